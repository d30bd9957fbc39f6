/**
 * `POST /api/airframes/:id/card.pdf` (issues a card): the card inputs as query parameters,
 * named as the fields of `CardInputs` (shared/card/card.ts), nested ones dotted. The server reads them into
 * `cardInputsSchema` (server/cards/card-pdf.service.ts), which says what each must be; this
 * schema describes them for the API document.
 */
import * as z from 'zod';
import { CARD_PAPER_SIZES } from './page-sizes';

const figure = (what: string) => z.string().describe(what);
const aerodrome = (name: 'departure' | 'arrival', optional: boolean) => {
  const field = (text: string) => (optional ? figure(`${text} (with the other ${name}.* fields, or none)`).optional() : figure(text));
  return {
    [`${name}.elevationFt`]: field(`Field elevation at ${name}, ft`),
    [`${name}.qnhHpa`]: field(`QNH at ${name}, hPa`),
    [`${name}.oatC`]: field(`Outside air temperature at ${name}, °C`),
    [`${name}.dewPointC`]: figure(`Dew point at ${name}, °C (optional: dry air)`).optional(),
    [`${name}.runwayHeadingDeg`]: figure(`Runway heading at ${name}, degrees magnetic 1–360 (optional; with ${name}.wind.*)`).optional(),
    [`${name}.wind.directionDeg`]: figure(`Wind direction at ${name}, degrees magnetic 1–360, the same north as the runway heading (optional)`).optional(),
    [`${name}.wind.speedKt`]: figure(`Steady wind speed at ${name}, kt (optional)`).optional(),
    [`${name}.wind.gustKt`]: figure(`Gusts at ${name}, kt, at least the steady speed (optional)`).optional(),
  };
};

export const cardPdfQuerySchema = z.object({
  weightKg: figure('Takeoff weight, kg'),
  landingWeightKg: figure('Landing weight, kg (optional: the takeoff weight)').optional(),
  configuration: z.string().describe('The takeoff configuration’s key in the speed book'),
  ...aerodrome('departure', false),
  ...aerodrome('arrival', true),
  isaDeviationC: figure('ISA deviation en route, °C'),
  'cruise.iasKt': figure('Planned cruise IAS, kt (or cruise.mach)').optional(),
  'cruise.mach': figure('Planned cruise Mach number (or cruise.iasKt)').optional(),
  altitudeStepFt: figure('Spacing of the altitude table’s rows, whole feet (100 to 10,000)'),
  paper: z.enum(CARD_PAPER_SIZES).optional().describe('half-letter (default), a5, two-up-letter or two-up-a4'),
});

/** `GET /api/airframes/:id/card.pdf`: prints a card already in the card log again; nothing is written. */
export const cardPdfReprintQuerySchema = z.object({
  code: z.string().describe('The card code of an issued card of this airframe, e.g. K7M-4RT-X9X (X-Card-Code of the POST)'),
  paper: z.enum(CARD_PAPER_SIZES).optional().describe('half-letter (default), a5, two-up-letter or two-up-a4'),
});

