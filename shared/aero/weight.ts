/**
 * Speeds flown at a fixed angle of attack (stall speeds, VA, best glide, VREF as a multiple of
 * the stall speed) scale with the square root of weight: lift = weight at a fixed lift
 * coefficient gives V = Vref·√(W / Wref) (FAA Pilot's Handbook of Aeronautical Knowledge and
 * Airplane Flying Handbook, effect of weight on stall speed and maneuvering speed).
 */
import { finiteResult, requirePositiveSpeed, requirePositiveWeight } from './guards';

/**
 * The speed, kt, at `weight` of a speed `speedKt` published at `referenceWeight`:
 * V = Vref·√(W / Wref). Both weights in the same unit (kg or lb). Use it only for speeds the
 * flight manual flies at a fixed angle of attack; tabulated and fixed speeds do not scale.
 *
 * @param speedKt the published speed, kt, above zero (IAS or CAS, as published; the caller
 *   converts through the position-error table when the scaling must happen in CAS)
 * @param referenceWeight the weight the speed is published for, above zero
 * @param weight the actual weight, above zero, same unit
 * @example weightScaledSpeedKt(61, 1100, 900) // 55.18
 * @throws AeroInputError `not-a-number`, `speed-not-positive`, `weight-not-positive`, `result-out-of-range`
 */
export function weightScaledSpeedKt(speedKt: number, referenceWeight: number, weight: number): number {
  requirePositiveSpeed(speedKt, 'speedKt', 'The published speed');
  requirePositiveWeight(referenceWeight, 'referenceWeight', 'The reference weight');
  requirePositiveWeight(weight, 'weight', 'The weight');
  return finiteResult(speedKt * Math.sqrt(weight / referenceWeight), 'weight', 'a weight-scaled speed');
}
