/**
 * The back page of the printed card: the aerodromes of the day with their cautions (landing at
 * the maximum landing weight, high density altitude), the stall speeds in a turn, the
 * airspeed-indicator picture and the altitude table.
 */
import type { Content, TableCell } from 'pdfmake/interfaces';
import type { SpeedCard } from '../card/card';
import { cardNumber, cruiseWords, signedCardNumber } from '../card/card-presentation';
import { altitudeTableBody, stallInTurnBody } from './altitude-block';
import type { CardPdfInput } from './card-pdf-input';
import { indicatorBlock } from './indicator-block';
import { BAR_WIDTH, FIGURES_LAYOUT, bar, caution, fine, head, num, title } from './pdf-blocks';
import { icingBackLines } from './icing-block';
import { windBackLines, windCautions } from './wind-block';

/** The back of the card, `width` wide: aerodromes, stall in a turn, indicator, altitude table. */
export function backPage(input: CardPdfInput, width: number): Content {
  const { card, changes } = input;
  const marked = (key: string) => changes.changed.has(key);

  const aerodromeBody: TableCell[][] = [[bar(false), head('Aerodrome', 'left'), head('Press. alt. ft'), head('Dens. alt. ft'), head('ISA dev. °C')]];
  const aerodromeRow = (name: string, a: SpeedCard['departure']): TableCell[] => [bar(false), { text: name, bold: true }, num(cardNumber(a.pressureAltitudeFt), { fontSize: 8.5 }), num(cardNumber(a.densityAltitudeFt), { fontSize: 8.5, bold: a.highDensityAltitude }), num(signedCardNumber(a.isaDeviationC), { fontSize: 8.5 })];
  aerodromeBody.push(aerodromeRow('Departure', card.departure));
  if (card.arrival) aerodromeBody.push(aerodromeRow('Arrival', card.arrival));

  const cautions: Content[] = [];
  if (card.landing.source === 'maximum-landing-weight') cautions.push(caution(card.landing.statement));
  if (card.departure.highDensityAltitude) {
    cautions.push(caution(`High density altitude at departure (${cardNumber(card.departure.densityAltitudeFt)} ft): expect a longer takeoff run and a weaker climb.`));
  }
  if (card.arrival?.highDensityAltitude) {
    cautions.push(caution(`High density altitude at arrival (${cardNumber(card.arrival.densityAltitudeFt)} ft): expect a higher true airspeed on final and a longer landing roll.`));
  }

  const indicator = indicatorBlock(card, marked);
  const altitudeBody = altitudeTableBody(card, marked);
  const stallBody = stallInTurnBody(card, marked);
  void width;
  return {
    stack: [
      {
        columns: [
          {
            width: '*',
            stack: [
              title('Departure and arrival', 0),
              { table: { headerRows: 1, widths: [BAR_WIDTH, '*', 38, 38, 38], body: aerodromeBody }, layout: FIGURES_LAYOUT },
              ...windBackLines(card),
              ...icingBackLines(card),
              ...cautions,
              ...windCautions(card),
            ],
          },
          ...(card.stallInTurn.length
            ? [{ width: 112, stack: [title('Stall in a level turn', 0), { table: { headerRows: 1, widths: [BAR_WIDTH, '*', 20, 22, 22], body: stallBody }, layout: FIGURES_LAYOUT }, fine('Kt, from VS1 at the takeoff weight, rounded up.')] } as Content]
            : []),
        ],
        columnGap: 8,
      },
      title('Airspeed indicator at this weight'),
      indicator,
      title(`Altitude table · planned cruise ${cruiseWords(card)} · ISA ${signedCardNumber(card.inputs.isaDeviationC)} °C`),
      { table: { headerRows: 1, dontBreakRows: true, widths: [BAR_WIDTH, 40, 30, 30, 26, 26, 26, 30, '*'], body: altitudeBody }, layout: { ...FIGURES_LAYOUT, paddingTop: () => 0.9, paddingBottom: () => 0.3 }, fontSize: 7 } as Content,
      fine('“–”: no IAS for this CAS in the position-error table. Limits rounded down. OVER (shaded): the planned cruise is above the limit.'),
      ...[...new Set(card.altitudeTable.map((row) => row.cruiseNote).filter((note): note is string => note !== null))].map((note) => fine(`“–”: ${note}`)),
    ],
  };
}
