/**
 * The airspeed-indicator picture of the card's back: the dial (dial-svg.ts, from
 * indicator-geometry.ts) beside its legend, every arc and line named in words with its range,
 * since the printed card may be black and white (no meaning in colour alone).
 */
import type { Content, TableCell } from 'pdfmake/interfaces';
import type { SpeedCard } from '../card/card';
import { cardNumber } from '../card/card-presentation';
import { drawDial } from '../card/indicator-geometry';
import { dialSvg, swatchCanvas } from './dial-svg';
import { BAR_WIDTH, FIGURES_LAYOUT, INDENT, MONO, bar } from './pdf-blocks';
import { lineKey } from './revision-marks';

/** The dial and its legend; `marked(key)` tells a marking that changed since the previous revision. */
export function indicatorBlock(card: SpeedCard, marked: (key: string) => boolean): Content {
  const drawing = drawDial(card.indicator);
  const legendBody: TableCell[][] = [
    ...drawing.arcs.map((arc): TableCell[] => [bar(marked(lineKey.arc(arc.colour))), { canvas: swatchCanvas({ kind: 'arc', arc }), margin: [0, 1, 0, 0] } as TableCell, { text: [`${arc.words}: `, { text: arc.range, font: MONO, bold: true }, ' kt'], fontSize: 6.8 }]),
    ...drawing.lines.map((line): TableCell[] => [bar(marked(lineKey.line(line.code))), { canvas: swatchCanvas({ kind: 'line', line }), margin: [0, 0.5, 0, 0] } as TableCell, { text: [`${line.words}: `, { text: String(line.kt), font: MONO, bold: true }, ' kt'], fontSize: 6.8 }]),
  ];
  const dialWidth = 140;
  return {
    columns: [
      { width: dialWidth, svg: dialSvg(card.indicator, `at ${cardNumber(card.inputs.weightKg)} kg`), margin: [INDENT - 4, 0, 0, 0] },
      {
        width: '*',
        stack: [
          { text: `Markings in ${drawing.basisWords}, as the speed book states, at this card's weight.`, fontSize: 6.8, margin: [INDENT, 4, 0, 3] },
          legendBody.length
            ? { table: { widths: [BAR_WIDTH, 24, '*'], body: legendBody }, layout: { ...FIGURES_LAYOUT, hLineWidth: () => 0, paddingTop: () => 1.2, paddingBottom: () => 1.2 } }
            : { text: 'The speed book gives no indicator markings.', margin: [INDENT, 0, 0, 0] },
        ],
      },
    ],
    columnGap: 4,
    unbreakable: true,
  };
}
