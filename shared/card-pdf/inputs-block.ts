/**
 * The top of the card's front: the inputs it was built for (each line with its revision-mark
 * key) and the check block — the QR code of the check URL, or why the card is not checkable yet.
 */
import type { Content } from 'pdfmake/interfaces';
import type { SpeedCard } from '../card/card';
import { cardNumber, cruiseWords, signedCardNumber } from '../card/card-presentation';
import { windInputRows } from './wind-block';
import { BAR_WIDTH, FIGURES_LAYOUT, bar, boxLayout } from './pdf-blocks';
import { qrVector } from './qr';
import { lineKey } from './revision-marks';

/** The inputs table; `marked(key)` tells a line that changed since the previous revision. */
export function inputsTable(card: SpeedCard, marked: (key: string) => boolean): Content {
  return {
    table: { widths: [BAR_WIDTH, 56, '*'], body: inputRows(card).map(([label, value, key]) => [bar(key !== null && marked(key)), { text: label, bold: true }, { text: value }]) },
    layout: { ...FIGURES_LAYOUT, hLineWidth: () => 0, paddingTop: () => 0.8, paddingBottom: () => 0.8 },
  };
}

/** The QR code of the check URL with a line on how to check; or, with no code yet, why not. */
export function checkBlock(checkUrl: string | null, size: number): Content[] {
  if (checkUrl === null) {
    return [
      {
        table: {
          widths: ['*'],
          body: [[{ stack: [{ text: 'NOT YET CHECKABLE', bold: true, fontSize: 6.5 }, { text: 'Issued offline: the card log gives this card its check code when the device next reaches the server. Print it again then for a card anyone can check.', fontSize: 5.8 }] }]],
        },
        layout: boxLayout(1),
      },
    ];
  }
  let host = checkUrl;
  try {
    host = new URL(checkUrl).host;
  } catch {
    // Not a URL: printed as given.
  }
  return [
    { canvas: qrVector(checkUrl, size).canvas, width: size, height: size } as Content,
    { text: `Scan, or open ${host}/check and type the code, to see whether this card is current.`, fontSize: 5.8, alignment: 'center' },
  ];
}

/** Label, value and the revision-mark key of each input line. */
function inputRows(card: SpeedCard): [string, string, string | null][] {
  const i = card.inputs;
  // A QNH reads as four figures, never with a thousands comma.
  const qnh = (hpa: number) => cardNumber(hpa, 1).replace(/,/g, '');
  const aerodrome = (a: NonNullable<SpeedCard['inputs']['arrival']>) =>
    `elevation ${cardNumber(a.elevationFt)} ft · QNH ${qnh(a.qnhHpa)} hPa · OAT ${cardNumber(a.oatC, 1)} °C${a.dewPointC === undefined ? '' : ` · dew point ${cardNumber(a.dewPointC, 1)} °C`}`;
  const landing = `${cardNumber(card.landing.weightKg)} kg landing${card.landing.source === 'entered' ? '' : card.landing.source === 'takeoff-weight' ? ' (the takeoff weight)' : ' (the maximum landing weight)'}`;
  return [
    ['Weight', `${cardNumber(i.weightKg)} kg takeoff · ${landing}`, null],
    ['Configuration', `${card.takeoffConfiguration.label} (takeoff)`, lineKey.takeoffConfiguration()],
    ['Departure', aerodrome(i.departure), null],
    ['Arrival', i.arrival ? aerodrome(i.arrival) : 'as at departure', null],
    ...windInputRows(card).map(([label, value]): [string, string, string | null] => [label, value, null]),
    ['En route', `ISA ${signedCardNumber(i.isaDeviationC)} °C · table every ${cardNumber(i.altitudeStepFt)} ft`, null],
    ['Planned cruise', cruiseWords(card), lineKey.cruise()],
  ];
}
