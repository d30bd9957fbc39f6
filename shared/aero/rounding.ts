/**
 * Rounding of speeds for the card (flight-physics.md, "Rounding on cards"; common practice, no
 * outside source): a limit is rounded down so the card never allows more than the limit, a
 * stall speed up so the card never promises control below it, anything else to the nearest
 * knot. A value within 10⁻⁹ kt of a whole knot counts as that knot, and one within 10⁻⁹ kt
 * below a half counts as the half, so floating-point noise (199.999 999 999 7 from a unit
 * conversion) cannot cost or add a knot.
 */
import { finiteResult, requirePositiveSpeed } from './guards';

/** Distance from a whole knot, kt, below which a value is taken as that whole knot. */
const WHOLE_KNOT_TOLERANCE = 1e-9;

/**
 * A limit speed (VNE, VNO, VMO, VFE, VLE, VLO, …) for the card, rounded down to a whole knot.
 * @param speedKt kt, above zero
 * @example roundLimitKt(163.9) // 163
 * @throws AeroInputError `not-a-number`, `speed-not-positive`
 */
export function roundLimitKt(speedKt: number): number {
  requirePositiveSpeed(speedKt, 'speedKt', 'The limit speed');
  return finiteResult(Math.floor(speedKt + WHOLE_KNOT_TOLERANCE), 'speedKt', 'a rounded limit speed');
}

/**
 * A stall speed (VS0, VS1, stall speed in a turn) for the card, rounded up to a whole knot.
 * @param speedKt kt, above zero
 * @example roundStallKt(48.1) // 49
 * @throws AeroInputError `not-a-number`, `speed-not-positive`
 */
export function roundStallKt(speedKt: number): number {
  requirePositiveSpeed(speedKt, 'speedKt', 'The stall speed');
  return finiteResult(Math.ceil(speedKt - WHOLE_KNOT_TOLERANCE), 'speedKt', 'a rounded stall speed');
}

/**
 * Any other speed for the card, rounded to the nearest whole knot (halves up).
 * @param speedKt kt, above zero
 * @example roundSpeedKt(72.5) // 73
 * @throws AeroInputError `not-a-number`, `speed-not-positive`
 */
export function roundSpeedKt(speedKt: number): number {
  requirePositiveSpeed(speedKt, 'speedKt', 'The speed');
  return finiteResult(Math.round(speedKt + WHOLE_KNOT_TOLERANCE), 'speedKt', 'a rounded speed');
}
