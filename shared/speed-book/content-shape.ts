/**
 * The shape of a revision's content: field by field, each value on its own. The rules that
 * tie fields together (tables rising, references resolving, limits above stall) live in
 * `content-rules.ts`; `revision-content.ts` joins the two into the one schema.
 *
 * Written with zod's small build (`zod/mini`: the same checks and messages, functions instead of
 * methods). The public check page re-derives a card from a revision through this one schema
 * (`shared/card/checked-content.ts`); the full build would add its code to that page's download
 * and spend a phone's main thread building a method table on every one of these schemas at
 * import. The server, the editor and the card screen use these same objects.
 */
import * as z from 'zod/mini';
import { plainText } from '../text/plain-text';
import { configurationKeySchema } from './configuration-key';

/** "The ceiling" → "the ceiling" inside a sentence; "VNE" stays as it is. */
const inSentence = (what: string) => (/^[A-Z][a-z]/.test(what) ? what[0].toLowerCase() + what.slice(1) : what);

const num = (what: string) =>
  z.number({ error: (issue) => (issue.input === undefined ? `Give ${inSentence(what)}.` : `${what} must be a number.`) });

/** A speed in knots, above zero and below 1 000 kt. */
export const knots = (what: string) => num(what).check(z.positive(`${what} must be above zero.`), z.maximum(999, `${what} must be below 1,000 kt.`));

/** A weight in kilograms, above zero and below 1 000 000 kg. */
export const kilograms = (what: string) =>
  num(what).check(z.positive(`${what} must be above zero.`), z.maximum(999_999, `${what} must be below 1,000,000 kg.`));

const capitalised = (what: string) => what.charAt(0).toUpperCase() + what.slice(1);
const text = (what: string, max: number) =>
  z
    .string({ error: (issue) => (issue.input === undefined ? `Give ${what}.` : `${what} must be text.`) })
    .check(plainText(capitalised(what)), z.trim(), z.minLength(1, `Give ${what}.`), z.maxLength(max, `${what} must be at most ${max} characters.`));

export const AIRCRAFT_CATEGORIES = ['piston-single', 'piston-twin', 'turboprop', 'jet'] as const;
export const SPEED_PHASES = ['takeoff', 'climb', 'cruise', 'approach', 'landing', 'any'] as const;
export const SPEED_BASES = ['ias', 'cas'] as const;
/**
 * What a speed is, whatever the flight manual spells it: its rounding on the card and the
 * ordering rules follow this, never the code's spelling. Stall and minimum speeds (VMC, V2,
 * VREF) round up, limits (VA, VNO, VNE, VFE, VLE, VLO, VMO) down, the others to the nearest knot.
 */
export const SPEED_CLASSES = ['stall', 'minimum', 'takeoff', 'climb', 'approach', 'limit', 'other'] as const;
/** Units a flight manual may state its figures in; the content always stores kg and kt. */
export const STATED_WEIGHT_UNITS = ['kg', 'lb'] as const;
export const STATED_SPEED_UNITS = ['kt', 'mph', 'kmh'] as const;

export const aircraftSchema = z.strictObject({
  category: z.enum(AIRCRAFT_CATEGORIES, { error: 'Choose piston-single, piston-twin, turboprop or jet.' }),
  engines: num('The number of engines').check(z.int('The number of engines must be a whole number.'), z.minimum(1, 'An aircraft has at least one engine.'), z.maximum(8, 'At most 8 engines.')),
  ceilingFt: num('The ceiling').check(z.int('The ceiling must be whole feet.'), z.minimum(1000, 'The ceiling must be at least 1,000 ft.'), z.maximum(60_000, 'The ceiling must be at most 60,000 ft.')),
  /** Recovery factor K of the total-air-temperature probe (SAT = TAT / (1 + 0.2·K·M²)); 1.0 when absent. */
  tatRecoveryFactor: z.optional(
    num('The TAT probe recovery factor').check(z.minimum(0.5, 'The TAT probe recovery factor must be at least 0.5.'), z.maximum(1, 'The TAT probe recovery factor must be at most 1.')),
  ),
});

export const weightsSchema = z.strictObject({
  minimumKg: kilograms('The minimum weight'),
  maximumTakeoffKg: kilograms('The maximum takeoff weight'),
  maximumLandingKg: kilograms('The maximum landing weight'),
  /** The weight weight-scaled speeds are published at; needed as soon as one speed is scaled. */
  referenceKg: z.optional(kilograms('The reference weight')),
});

export { configurationKeySchema };

export const positionErrorPointSchema = z.strictObject({
  iasKt: knots('The indicated airspeed'),
  casKt: knots('The calibrated airspeed'),
});

export const configurationSchema = z.strictObject({
  key: configurationKeySchema,
  label: text('the configuration’s label', 80),
  /** IAS → CAS, strictly increasing in both columns. */
  positionError: z
    .array(positionErrorPointSchema, { error: 'Give the position-error table as a list of IAS/CAS points.' })
    .check(z.minLength(2, 'A position-error table needs at least two IAS/CAS points.'), z.maxLength(100, 'A position-error table has at most 100 points.')),
  /**
   * The flight manual's increment for ice accretion in this configuration, whole kt 0–40: with
   * "icing conditions" ticked the card shows, beside each normal figure, the speed plus this
   * increment for the speeds of this configuration of class takeoff, minimum (V2, VREF; not VMC),
   * climb and approach (`ICED_SPEED_CLASSES`, shared/card/card-icing.ts). Stall and limit speeds
   * are never increased. Absent: the manual states none (the card says so when icing is ticked).
   */
  iceIncrementKt: z.optional(
    num('The ice increment').check(z.int('The ice increment must be whole knots.'), z.minimum(0, 'The ice increment must be at least 0 kt.'), z.maximum(40, 'The ice increment must be at most 40 kt.')),
  ),
});

/** Trade codes (VS1, VR, VREF, V2) or free ones: a letter, then letters and digits. */
export const speedCodeSchema = z
  .string({ error: 'Give the speed’s code.' })
  .check(z.regex(/^[A-Za-z][A-Za-z0-9]*$/, 'A speed code is a letter followed by letters and digits, such as VREF or VS1.'), z.maxLength(12, 'A speed code must be at most 12 characters.'));

const speedBase = {
  code: speedCodeSchema,
  label: text('the speed’s label', 80),
  phase: z.enum(SPEED_PHASES, { error: 'Choose takeoff, climb, cruise, approach, landing or any.' }),
  configurationKey: configurationKeySchema,
  basis: z.enum(SPEED_BASES, { error: 'Choose ias or cas.' }),
  /** Absent in content written before speeds declared their class: then read from the code. */
  speedClass: z.optional(z.enum(SPEED_CLASSES, { error: 'Choose stall, minimum, takeoff, climb, approach, limit or other.' })),
};

const tableKt = knots('A tabulated speed');
const axis = (what: string, min: number, max: number, unit: string) =>
  z
    .array(num(`Each ${what}`).check(z.minimum(min, `Each ${what} must be at least ${min} ${unit}.`), z.maximum(max, `Each ${what} must be at most ${max} ${unit}.`)), {
      error: `Give the ${what} axis as a list of numbers.`,
    })
    .check(z.minLength(2, `The ${what} axis needs at least two entries.`), z.maxLength(50, `The ${what} axis has at most 50 entries.`));

/** Weight-scaled from `referenceKt` at `weights.referenceKg`: V = Vref·√(W / Wref). */
export const scaledSpeedSchema = z.strictObject({ ...speedBase, kind: z.literal('scaled'), referenceKt: knots('The reference speed') });

/**
 * Tabulated against weight, and optionally pressure altitude and OAT. `valuesKt` nests in axis
 * order: `valuesKt[weight][altitude][oat]`, absent axes left out (as shared/aero's speed table).
 */
export const tabulatedSpeedSchema = z.strictObject({
  ...speedBase,
  kind: z.literal('tabulated'),
  byWeightKg: axis('weight', 1, 999_999, 'kg'),
  byPressureAltitudeFt: z.optional(axis('pressure altitude', -2000, 60_000, 'ft')),
  byOatC: z.optional(axis('temperature', -100, 70, '°C')),
  valuesKt: z.array(z.union([tableKt, z.array(z.union([tableKt, z.array(tableKt)]))]), {
    error: 'Give the tabulated speeds as a list (one entry per weight), nested by altitude and temperature.',
  }),
});

export const fixedSpeedSchema = z.strictObject({ ...speedBase, kind: z.literal('fixed'), valueKt: knots('The speed') });

export const speedSchema = z.discriminatedUnion('kind', [scaledSpeedSchema, tabulatedSpeedSchema, fixedSpeedSchema], {
  error: 'Choose the speed’s kind: scaled, tabulated or fixed.',
});

/**
 * Limit speeds, in the basis named by `indicatorMarkingBasis` (the flight manual's limitations
 * and the airspeed indicator's markings share one basis). VNO, VNE and VMO are read through the
 * first configuration's position-error table (the cruise configuration); each VFE through its
 * own configuration's.
 */
export const limitsSchema = z.strictObject({
  vnoKt: z.optional(knots('VNO')),
  vneKt: z.optional(knots('VNE')),
  vmoKt: z.optional(knots('VMO')),
  mmo: z.optional(num('MMO').check(z.minimum(0.1, 'MMO must be at least Mach 0.1.'), z.maximum(0.99, 'MMO must be below Mach 1.'))),
  vfeKt: z.record(z.string(), knots('VFE'), { error: 'Give VFE as configuration key → kt.' }),
  vleKt: z.optional(knots('VLE')),
  vloKt: z.optional(knots('VLO')),
  vmcKt: z.optional(knots('VMC')),
  vyseKt: z.optional(knots('VYSE')),
  /** The crosswind the flight manual states as demonstrated, kt: the card cautions above it (not a refusal). */
  demonstratedCrosswindKt: z.optional(knots('The demonstrated crosswind')),
  /** The tailwind limit the flight manual states for takeoff and landing, kt: the card cautions above it. */
  maximumTailwindKt: z.optional(knots('The tailwind limit')),
});

const rangeOf = (what: string, min: number, max: number, unit: string) => {
  const bound = (which: string) =>
    num(`The ${which} ${what}`).check(z.minimum(min, `The ${which} ${what} must be at least ${min} ${unit}.`), z.maximum(max, `The ${which} ${what} must be at most ${max} ${unit}.`));
  return z
    .strictObject({ min: bound('lowest'), max: bound('highest') })
    .check(z.refine((range) => range.min < range.max, { message: `The lowest ${what} must be below the highest.`, path: ['max'] }));
};

const phaseEnvelopeSchema = z.strictObject({
  pressureAltitudeFt: rangeOf('pressure altitude', -5000, 60_000, 'ft'),
  oatC: rangeOf('temperature', -100, 70, '°C'),
});

/**
 * The pressure-altitude and OAT ranges the book declares it covers, for takeoff and for landing
 * (weights come from `weights`). Every table must cover it; outside it the card is refused with
 * one sentence. Optional only so that content written before envelopes still reads.
 */
export const envelopeSchema = z.strictObject({ takeoff: phaseEnvelopeSchema, landing: phaseEnvelopeSchema });

/** The flight manual's reason why the book departs from one ordering rule; the approver sees it. */
export const ruleExceptionSchema = z.strictObject({
  ruleId: z
    .string({ error: 'Give the rule’s id.' })
    .check(z.regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'A rule id is lower-case letters and digits joined by hyphens.'), z.maxLength(40, 'A rule id must be at most 40 characters.')),
  reason: text('the flight manual’s reason', 1000),
});

/** The units the flight manual prints; shown in review and the diff, never used to store. */
export const statedUnitsSchema = z.strictObject({
  weight: z.enum(STATED_WEIGHT_UNITS, { error: 'Choose kg or lb.' }),
  speed: z.enum(STATED_SPEED_UNITS, { error: 'Choose kt, mph or kmh.' }),
});

export const revisionContentShape = z.strictObject({
  schemaVersion: z.literal(1, { error: 'This is revision content of schema version 1.' }),
  aircraft: aircraftSchema,
  weights: weightsSchema,
  configurations: z
    .array(configurationSchema, { error: 'Give the configurations as a list.' })
    .check(z.minLength(1, 'Give at least one configuration (the first is the cruise configuration).'), z.maxLength(12, 'At most 12 configurations.')),
  speeds: z.array(speedSchema, { error: 'Give the speeds as a list.' }).check(z.maxLength(100, 'At most 100 speeds.')),
  limits: limitsSchema,
  indicatorMarkingBasis: z.enum(SPEED_BASES, { error: 'Choose ias or cas.' }),
  notes: z.string({ error: 'Notes must be text.' }).check(plainText('Notes', 'multi-line'), z.maxLength(4000, 'Notes must be at most 4,000 characters.')),
  envelope: z.optional(envelopeSchema),
  /** True when the book's stall speeds are reference stall speeds (VSR, CS-25 / Part 25 style). */
  statesReferenceStallSpeeds: z.optional(z.boolean({ error: 'Say yes or no.' })),
  ruleExceptions: z.optional(z.array(ruleExceptionSchema, { error: 'Give the exceptions as a list.' }).check(z.maxLength(20, 'At most 20 rule exceptions.'))),
  statedUnits: z.optional(statedUnitsSchema),
});
