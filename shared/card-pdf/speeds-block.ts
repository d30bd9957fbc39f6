/**
 * The card's speeds by phase (code, meaning and configuration, weight where it varies, IAS
 * large, CAS small) and the limits table (limit speeds, MMO, crossover altitude), each line
 * with its revision bar.
 */
import type { TableCell } from 'pdfmake/interfaces';
import type { SpeedCard } from '../card/card';
import { cardNumber, limitRows, phaseGroups, showsWeightColumn } from '../card/card-presentation';
import { BAR_WIDTH, GREY, MONO, bar, head, num } from './pdf-blocks';
import { lineKey } from './revision-marks';
import { icedNote } from './icing-block';
import { approachNote } from './wind-block';

const noteOf = <T>(note: T | null): T[] => (note === null ? [] : [note]);

/** The speeds table's column widths and rows; `showWeight` when the speeds' weights differ. */
export function speedsTable(card: SpeedCard, marked: (key: string) => boolean): { widths: (number | string)[]; body: TableCell[][]; showWeight: boolean } {
  const showWeight = showsWeightColumn(card);
  const speedWidths = showWeight ? [BAR_WIDTH, 36, '*', 34, 44, 34] : [BAR_WIDTH, 36, '*', 48, 36];
  const speedBody: TableCell[][] = [
    [bar(false), head('Speed', 'left'), head('Meaning · configuration', 'left'), ...(showWeight ? [head('At kg')] : []), head('IAS kt'), head('CAS kt')],
  ];
  for (const group of phaseGroups(card)) {
    const span = speedWidths.length - 1;
    speedBody.push([bar(false), { text: group.title.toUpperCase(), bold: true, fontSize: 6, lineHeight: 1, colSpan: span, fillColor: GREY, characterSpacing: 0.6 }, ...Array.from({ length: span - 1 }, () => ({ text: '' }))]);
    for (const speed of group.speeds) {
      speedBody.push([
        bar(marked(lineKey.speed(speed.code, speed.configurationKey))),
        { text: speed.code, font: MONO, bold: true, fontSize: 10, lineHeight: 0.9, margin: [0, 1.5, 0, 0] },
        { text: [speed.label, { text: ` · ${speed.configurationLabel}`, fontSize: 6.3 }, ...noteOf(approachNote(card, speed)), ...noteOf(icedNote(card, speed))], margin: [0, 2.2, 0, 0] },
        ...(showWeight ? [num(cardNumber(speed.weightKg), { margin: [0, 2.5, 0, 0] })] : []),
        num(cardNumber(speed.iasKt), { bold: true, fontSize: 13.5 }),
        num(cardNumber(speed.casKt), { fontSize: 8.5, margin: [0, 2, 0, 0] }),
      ]);
    }
  }
  return { widths: speedWidths, body: speedBody, showWeight };
}

/** The limits table's rows. */
export function limitsTable(card: SpeedCard, marked: (key: string) => boolean): TableCell[][] {
  const limitBody: TableCell[][] = [[bar(false), head('Limit', 'left'), head('Meaning', 'left'), head('IAS'), head('CAS')]];
  for (const row of limitRows(card)) {
    limitBody.push([
      bar(marked(lineKey.limit(row.key))),
      { text: row.code, font: MONO, bold: true, lineHeight: 0.9 },
      { text: row.meaning, fontSize: 6.5 },
      num(cardNumber(row.iasKt), { bold: true, fontSize: 9 }),
      num(cardNumber(row.casKt)),
    ]);
  }
  if (card.limits.mmo !== null) {
    limitBody.push([bar(marked(lineKey.limit('MMO'))), { text: 'MMO', font: MONO, bold: true, lineHeight: 0.9 }, { text: 'Maximum operating Mach', fontSize: 6.5 }, num(`M ${cardNumber(card.limits.mmo, 3)}`, { colSpan: 2, bold: true, fontSize: 9 }), { text: '' }]);
  }
  if (card.crossoverAltitudeFt !== null) {
    limitBody.push([bar(marked(lineKey.limit('crossover'))), { text: 'Crossover', bold: true, fontSize: 6.5 }, { text: 'VMO below, MMO above', fontSize: 6.5 }, num(`${cardNumber(card.crossoverAltitudeFt)} ft`, { colSpan: 2 }), { text: '' }]);
  }
  return limitBody;
}
