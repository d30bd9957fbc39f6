/**
 * What a pilot enters for a card (`CardInputs`) and the schema that checks it, on the device
 * and on the server alike; every sentence names the field to correct. Units are in every name.
 *
 * Written with zod's small build (`zod/mini`: the same rules and messages, functions instead of
 * methods) so the public check page, which decodes card inputs from a check URL, carries no full
 * zod in its first download; the server, the card screen and the check page use these objects.
 */
import * as z from 'zod/mini';
// The key alone (also zod/mini): the check page reads card inputs without the speed book's content schema.
import { configurationKeySchema } from '../speed-book/configuration-key';
import { approachAdditivePolicySchema } from './approach-policy';

const num = (what: string) =>
  z.number({ error: (issue) => (issue.input === undefined ? `Give ${what}.` : `${capitalise(what)} must be a number.`) });

function capitalise(text: string): string {
  return text[0].toUpperCase() + text.slice(1);
}

const weight = (what: string) =>
  num(what).check(z.positive(`${capitalise(what)} must be above zero.`), z.maximum(999_999, `${capitalise(what)} must be below 1,000,000 kg.`));

/** Which north the runway heading and the wind direction are given from: one reference for both (said on screen). */
export const WIND_DIRECTION_REFERENCE = 'magnetic' as const;
/** The strongest steady wind or gust a card takes, kt: beyond it the figure is a typing slip. */
export const MAX_WIND_KT = 150;

/** A direction in whole or decimal degrees, 1–360 (north is 360, as runways and winds are given). */
const direction = (what: string) =>
  num(what).check(z.minimum(1, `${capitalise(what)} must be from 1 to 360 degrees (north is 360).`), z.maximum(360, `${capitalise(what)} must be from 1 to 360 degrees (north is 360).`));

const windKnots = (what: string) =>
  num(what).check(z.minimum(0, `${capitalise(what)} must be 0 kt or more.`), z.maximum(MAX_WIND_KT, `${capitalise(what)} must be at most ${MAX_WIND_KT} kt.`));

/**
 * The wind at an aerodrome, from the same north as the runway heading (`WIND_DIRECTION_REFERENCE`).
 * A gust, when given, is at least the steady speed.
 */
export const windSchema = z
  .strictObject({
    /** Where the wind blows from, degrees 1–360. */
    directionDeg: direction('the wind direction in degrees'),
    /** Steady wind speed, kt. */
    speedKt: windKnots('the wind speed in kt'),
    /** Gusts, kt; at least the steady speed. */
    gustKt: z.optional(windKnots('the gust speed in kt')),
  })
  .check(z.refine((wind) => wind.gustKt === undefined || wind.gustKt >= wind.speedKt, { message: 'The gust must be at least the steady wind speed.', path: ['gustKt'] }));
export type Wind = z.infer<typeof windSchema>;

/**
 * Conditions at one aerodrome. Only the type and finiteness are checked here; whether a value
 * lies inside the atmosphere and the altimeter relation (e.g. an OAT of 90 °C) is decided by
 * `buildCard`, which refuses the card with the flight-physics library's sentence.
 */
export const aerodromeConditionsSchema = z.strictObject({
  /** Field elevation, ft above mean sea level. */
  elevationFt: num('the field elevation in feet'),
  /** Altimeter setting QNH, hPa (the screen converts inHg). */
  qnhHpa: num('the QNH in hPa'),
  /** Outside air temperature at the field, °C. */
  oatC: num('the outside air temperature in °C'),
  /** Dew point, °C; without it density altitude is for dry air. */
  dewPointC: z.optional(num('the dew point in °C')),
  /** The heading of the runway in use, degrees 1–360, from the same north as the wind; given with `wind`. */
  runwayHeadingDeg: z.optional(direction('the runway heading in degrees')),
  /** The day's wind; given with `runwayHeadingDeg`, for the wind components (and, where the card lands, the approach speed). */
  wind: z.optional(windSchema),
}).check(
  z.refine((conditions) => conditions.wind === undefined || conditions.runwayHeadingDeg !== undefined, { message: 'Give the runway heading with the wind.', path: ['runwayHeadingDeg'] }),
  z.refine((conditions) => conditions.runwayHeadingDeg === undefined || conditions.wind !== undefined, { message: 'Give the wind with the runway heading.', path: ['wind'] }),
);
export type AerodromeConditions = z.infer<typeof aerodromeConditionsSchema>;

/** The planned cruise: an indicated airspeed (through the cruise configuration's table) or a Mach number. */
export const cruiseSchema = z.union(
  [
    z.strictObject({ iasKt: num('the cruise indicated airspeed in kt').check(z.positive('The cruise speed must be above zero.'), z.maximum(999, 'The cruise speed must be below 1,000 kt.')) }),
    z.strictObject({ mach: num('the cruise Mach number').check(z.positive('The cruise Mach number must be above zero.'), z.lt(1, 'The cruise Mach number must be below Mach 1.')) }),
  ],
  { error: 'Give the planned cruise as an indicated airspeed in kt or as a Mach number, not both.' },
);

/**
 * What the pilot enters, in canonical units (the screen converts from the units chosen per
 * field). `configuration` is the takeoff configuration; approach and landing speeds use their
 * own configurations and `landingWeightKg` when given.
 */
export const cardInputsSchema = z.strictObject({
  airframeId: z.number({ error: 'Choose the airframe.' }).check(z.int('Choose the airframe.'), z.positive('Choose the airframe.')),
  /** Takeoff weight, kg. */
  weightKg: weight('the takeoff weight in kg'),
  /**
   * Landing weight, kg; without it the landing and approach speeds use the takeoff weight when
   * that is within the maximum landing weight, else the maximum landing weight (the card says so).
   */
  landingWeightKg: z.optional(weight('the landing weight in kg')),
  /** The takeoff configuration's key (a configuration of the speed book). */
  configuration: configurationKeySchema,
  departure: aerodromeConditionsSchema,
  arrival: z.optional(aerodromeConditionsSchema),
  /** The day's ISA deviation for the altitude table, °C. */
  isaDeviationC: num('the ISA deviation in °C'),
  cruise: cruiseSchema,
  /** Spacing of the altitude table's rows, whole feet. */
  /**
   * The operator's approach additive policy at the time the card is made (the device fills it in
   * from the synced operator settings). Needed when the aerodrome the card lands at has a wind.
   */
  approachAdditivePolicy: z.optional(approachAdditivePolicySchema),
  /**
   * Icing conditions: the card shows each speed the book gives an ice increment for beside its
   * iced figure (card-icing.ts). Absent or false: no icing part, and the card's digest is as before.
   */
  icing: z.optional(z.boolean({ error: 'Say yes or no for icing conditions.' })),
  altitudeStepFt: num('the altitude step in feet').check(
    z.int('The altitude step must be whole feet.'),
    z.minimum(100, 'The altitude step must be at least 100 ft.'),
    z.maximum(10_000, 'The altitude step must be at most 10,000 ft.'),
  ),
});
export type CardInputs = z.infer<typeof cardInputsSchema>;
