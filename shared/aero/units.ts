/**
 * Unit conversions. Every factor is an exact definition from `constants.ts` (the inch of mercury
 * is the conventional value). "Mps" means metres per second throughout.
 *
 * Error policy: inputs must be finite numbers (`not-a-number`); temperatures must not be below
 * absolute zero (`temperature-out-of-range`); a result too large to represent throws
 * `result-out-of-range`. Signs are otherwise free (altitudes below sea level, negative wind
 * components and temperatures below zero are ordinary).
 */
import {
  KG_PER_POUND,
  METRES_PER_FOOT,
  MPS_PER_KMH,
  MPS_PER_KNOT,
  MPS_PER_MPH,
  PA_PER_INHG,
  ZERO_CELSIUS_K,
} from './constants';
import { AeroInputError } from './errors';
import { finiteResult, formatNumber, requireFinite } from './guards';

function scaled(value: number, factor: number, field: string, label: string): number {
  requireFinite(value, field, label);
  return finiteResult(value * factor, field, `a converted ${label.toLowerCase()}`);
}

// --- speed ---------------------------------------------------------------------------------

/**
 * Knots to metres per second (1 kt = 1852/3600 m/s exactly; international nautical mile).
 * Any finite number. @example ktToMps(100) // 51.444…
 */
export function ktToMps(kt: number): number {
  return scaled(kt, MPS_PER_KNOT, 'kt', 'Speed in knots');
}

/** Metres per second to knots. Any finite number. @example mpsToKt(51.444) // ≈ 100 */
export function mpsToKt(mps: number): number {
  return scaled(mps, 1 / MPS_PER_KNOT, 'mps', 'Speed in m/s');
}

/** Knots to km/h (1 kt = 1.852 km/h exactly). Any finite number. @example ktToKmh(100) // 185.2 */
export function ktToKmh(kt: number): number {
  return scaled(kt, MPS_PER_KNOT / MPS_PER_KMH, 'kt', 'Speed in knots');
}

/** km/h to knots. Any finite number. @example kmhToKt(185.2) // 100 */
export function kmhToKt(kmh: number): number {
  return scaled(kmh, MPS_PER_KMH / MPS_PER_KNOT, 'kmh', 'Speed in km/h');
}

/** Knots to statute miles per hour (1 mi = 1609.344 m exactly). Any finite number. @example ktToMph(100) // 115.078 */
export function ktToMph(kt: number): number {
  return scaled(kt, MPS_PER_KNOT / MPS_PER_MPH, 'kt', 'Speed in knots');
}

/** Statute miles per hour to knots. Any finite number. @example mphToKt(115.078) // ≈ 100 */
export function mphToKt(mph: number): number {
  return scaled(mph, MPS_PER_MPH / MPS_PER_KNOT, 'mph', 'Speed in mph');
}

// --- length --------------------------------------------------------------------------------

/** Feet to metres (1 ft = 0.3048 m exactly). Any finite number. @example ftToM(1000) // 304.8 */
export function ftToM(ft: number): number {
  return scaled(ft, METRES_PER_FOOT, 'ft', 'Length in feet');
}

/** Metres to feet. Any finite number. @example mToFt(304.8) // 1000 */
export function mToFt(m: number): number {
  return scaled(m, 1 / METRES_PER_FOOT, 'm', 'Length in metres');
}

// --- pressure ------------------------------------------------------------------------------

/** Hectopascals to inches of mercury (conventional, 33.863 89 hPa/inHg). Any finite number. @example hpaToInhg(1013.25) // 29.921 */
export function hpaToInhg(hpa: number): number {
  return scaled(hpa, 100 / PA_PER_INHG, 'hpa', 'Pressure in hPa');
}

/** Inches of mercury to hectopascals. Any finite number. @example inhgToHpa(29.92) // 1013.2 */
export function inhgToHpa(inhg: number): number {
  return scaled(inhg, PA_PER_INHG / 100, 'inhg', 'Pressure in inHg');
}

// --- temperature ---------------------------------------------------------------------------

const ABSOLUTE_ZERO_C = -ZERO_CELSIUS_K;
const ABSOLUTE_ZERO_F = (ABSOLUTE_ZERO_C * 9) / 5 + 32;

function requireAboveAbsoluteZero(value: number, floor: number, field: string, unit: string): void {
  if (value < floor) {
    throw new AeroInputError(
      'temperature-out-of-range',
      field,
      `A temperature of ${formatNumber(value, 2)} ${unit} is below absolute zero (${formatNumber(floor, 2)} ${unit}).`,
    );
  }
}

/** °C to °F (F = C·9/5 + 32). At least −273.15 °C. @example cToF(15) // 59 */
export function cToF(c: number): number {
  requireFinite(c, 'c', 'Temperature in °C');
  requireAboveAbsoluteZero(c, ABSOLUTE_ZERO_C, 'c', '°C');
  return finiteResult((c * 9) / 5 + 32, 'c', 'a temperature in °F');
}

/** °F to °C. At least −459.67 °F. @example fToC(59) // 15 */
export function fToC(f: number): number {
  requireFinite(f, 'f', 'Temperature in °F');
  requireAboveAbsoluteZero(f, ABSOLUTE_ZERO_F, 'f', '°F');
  return finiteResult(((f - 32) * 5) / 9, 'f', 'a temperature in °C');
}

/** °C to kelvin (K = C + 273.15). At least −273.15 °C. @example cToK(15) // 288.15 */
export function cToK(c: number): number {
  requireFinite(c, 'c', 'Temperature in °C');
  requireAboveAbsoluteZero(c, ABSOLUTE_ZERO_C, 'c', '°C');
  return finiteResult(c + ZERO_CELSIUS_K, 'c', 'a temperature in K');
}

/** Kelvin to °C. At least 0 K. @example kToC(288.15) // 15 */
export function kToC(k: number): number {
  requireFinite(k, 'k', 'Temperature in K');
  requireAboveAbsoluteZero(k, 0, 'k', 'K');
  return finiteResult(k - ZERO_CELSIUS_K, 'k', 'a temperature in °C');
}

// --- mass ----------------------------------------------------------------------------------

/** Kilograms to pounds (1 lb = 0.453 592 37 kg exactly). Any finite number. @example kgToLb(1000) // 2204.62 */
export function kgToLb(kg: number): number {
  return scaled(kg, 1 / KG_PER_POUND, 'kg', 'Mass in kg');
}

/** Pounds to kilograms. Any finite number. @example lbToKg(2204.62) // ≈ 1000 */
export function lbToKg(lb: number): number {
  return scaled(lb, KG_PER_POUND, 'lb', 'Mass in lb');
}
