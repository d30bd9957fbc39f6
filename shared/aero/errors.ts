/**
 * The library's one error policy: every invalid or out-of-envelope input throws an
 * `AeroInputError`; no function returns NaN or Infinity. The `code` is for programs (form
 * highlighting, server responses), the message is a sentence a pilot understands, `field` names
 * the offending input as the caller spelled it (e.g. `"oatC"`, `"positionErrorTable[3].casKt"`).
 */

/** Every code an `AeroInputError` can carry. */
export const AERO_INPUT_ERROR_CODES = [
  /** A number is missing, NaN or infinite, or not a number at all. */
  'not-a-number',
  /** A pressure altitude, elevation or result altitude is outside the modelled atmosphere. */
  'altitude-out-of-range',
  /** A temperature is below absolute zero or outside the plausible envelope at that altitude. */
  'temperature-out-of-range',
  /** The dew point is warmer than the air. */
  'dew-point-above-temperature',
  /** A QNH or other pressure is outside the accepted range. */
  'pressure-out-of-range',
  /** A speed is zero or negative. */
  'speed-not-positive',
  /** A speed is below the slowest accepted (1 kt, Mach 0.001) or at or beyond Mach 5. */
  'speed-out-of-range',
  /** A weight is zero or negative. */
  'weight-not-positive',
  /** A bank angle is negative or 90° or more. */
  'bank-out-of-range',
  /** A table is malformed: too short, not strictly increasing, wrong shape, bad values. */
  'invalid-table',
  /** The value looked up lies outside the table; tables are never extrapolated. */
  'outside-table',
  /** `convertAirspeed` needs exactly one of casKt, easKt, tasKt, mach. */
  'one-speed-required',
  /** An input the table needs (e.g. pressure altitude for a table by altitude) is missing. */
  'missing-input',
  /** The inputs are valid one by one but together give a figure too large to represent. */
  'result-out-of-range',
  /** A dimensionless factor (a probe's recovery factor) is outside its accepted range. */
  'factor-out-of-range',
] as const;

/** The machine-readable reason of an `AeroInputError`; see `AERO_INPUT_ERROR_CODES`. */
export type AeroInputErrorCode = (typeof AERO_INPUT_ERROR_CODES)[number];

/**
 * Thrown by every function of the library for invalid or out-of-envelope input.
 *
 * @example
 * try { isa(200_000); } catch (e) {
 *   if (e instanceof AeroInputError) console.log(e.code, e.message); // "altitude-out-of-range", "A pressure altitude of 200,000 ft …"
 * }
 */
export class AeroInputError extends Error {
  override readonly name = 'AeroInputError' as const;
  readonly code: AeroInputErrorCode;
  /** The input at fault, as the caller named it. */
  readonly field: string;

  constructor(code: AeroInputErrorCode, field: string, message: string) {
    super(message);
    this.code = code;
    this.field = field;
  }
}
