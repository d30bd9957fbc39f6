/**
 * The altitude table of the card's back (pressure altitude, OAT, the planned cruise's IAS, CAS,
 * EAS, TAS and Mach, the IAS limit with its kind; OVER in words and shaded where the cruise is
 * above it) and the stall speeds in a level turn.
 */
import type { TableCell } from 'pdfmake/interfaces';
import type { SpeedCard } from '../card/card';
import { cardNumber, limitKindWords } from '../card/card-presentation';
import { GREY, MONO, bar, head, num } from './pdf-blocks';
import { lineKey } from './revision-marks';

/** The altitude table's rows, header first. */
export function altitudeTableBody(card: SpeedCard, marked: (key: string) => boolean): TableCell[][] {
  const altitudeBody: TableCell[][] = [
    [bar(false), head('Press. alt. ft'), head('OAT °C'), head('IAS kt'), head('CAS'), head('EAS'), head('TAS'), head('Mach'), head('IAS limit kt')],
  ];
  for (const row of card.altitudeTable) {
    const fill = row.aboveLimit ? { fillColor: GREY } : {};
    altitudeBody.push([
      bar(marked(lineKey.altitude(row.pressureAltitudeFt))),
      num(cardNumber(row.pressureAltitudeFt), { bold: true, ...fill }),
      num(cardNumber(row.oatC, 1), fill),
      num(cardNumber(row.iasKt), { bold: true, ...fill }),
      num(cardNumber(row.casKt), fill),
      num(cardNumber(row.easKt), fill),
      num(cardNumber(row.tasKt), fill),
      num(cardNumber(row.mach, 3), fill),
      {
        text: [
          { text: cardNumber(row.limitIasKt), font: MONO },
          row.limitKind ? { text: ` ${limitKindWords(row.limitKind)}`, fontSize: 5.5 } : '',
          row.aboveLimit ? { text: ' OVER', bold: true, fontSize: 6 } : '',
        ],
        alignment: 'right',
        ...fill,
      },
    ]);
  }
  return altitudeBody;
}

/** The stall-in-a-turn table's rows, header first. */
export function stallInTurnBody(card: SpeedCard, marked: (key: string) => boolean): TableCell[][] {
  const stallBody: TableCell[][] = [[bar(false), head('Bank°'), head('g'), head('IAS'), head('CAS')]];
  for (const line of card.stallInTurn) {
    stallBody.push([bar(marked(lineKey.stall(line.bankDeg))), num(String(line.bankDeg)), num(cardNumber(line.loadFactor, 2)), num(cardNumber(line.iasKt), { bold: true, fontSize: 9 }), num(cardNumber(line.casKt))]);
  }
  return stallBody;
}
