/**
 * The pitot-tube relations between Mach number and the ratio of impact pressure qc (pitot
 * minus static) to a reference pressure, for a perfect gas with κ = 1.4. Internal: used by
 * `airspeed.ts` (reference: static pressure, or p0 for calibrated airspeed) and `crossover.ts`.
 * Method: NASA Reference Publication 1046 (Gracey 1980), the Saint-Venant relation below Mach 1
 * and the Rayleigh pitot formula (normal shock ahead of the probe) from Mach 1 up:
 *
 *   M < 1:  qc/p = (1 + (κ−1)/2·M²)^(κ/(κ−1)) − 1
 *   M ≥ 1:  qc/p = [(κ+1)²·M² / (4κ·M² − 2(κ−1))]^(κ/(κ−1)) · (2κ·M² − (κ−1)) / (κ+1) − 1
 *
 * The two agree at Mach 1 (qc/p = 0.892 929). Above `MAX_MACH` the perfect-gas relations no
 * longer describe air and callers refuse the speed.
 */
import { HEAT_CAPACITY_RATIO } from './constants';

const K = HEAT_CAPACITY_RATIO;
/** κ/(κ−1) = 3.5, its inverse 2/7, (κ−1)/2 = 0.2 and 2/(κ−1) = 5. */
const PRESSURE_EXPONENT = K / (K - 1);
const INVERSE_PRESSURE_EXPONENT = 1 / PRESSURE_EXPONENT;
const HALF_K_MINUS_ONE = (K - 1) / 2;
const TWO_OVER_K_MINUS_ONE = 2 / (K - 1);
const K_PLUS_ONE_SQUARED = (K + 1) * (K + 1);

/** Fastest Mach the relations are used for: beyond Mach 5 (hypersonic) air is no perfect gas. */
export const MAX_MACH = 5;

/** Below this u = 0.2·M² the direct (1 + u)^k − 1 loses digits; see `powMinusOne`. */
const SMALL = 1e-3;

/**
 * (1 + u)^k − 1 without the cancellation of the direct form at low speed: below u = 10⁻³ it is
 * computed as expm1(k·log1p(u)), which keeps round trips exact to ~10⁻¹⁵ down to 1 kt.
 */
function powMinusOne(u: number, k: number): number {
  return u < SMALL ? Math.expm1(k * Math.log1p(u)) : Math.pow(1 + u, k) - 1;
}

function rayleighRatioPlusOne(mach: number): number {
  const m2 = mach * mach;
  return (
    (Math.pow((K_PLUS_ONE_SQUARED * m2) / (4 * K * m2 - 2 * (K - 1)), PRESSURE_EXPONENT) * (2 * K * m2 - (K - 1))) /
    (K + 1)
  );
}

/** qc/p at Mach 1, where the subsonic and the Rayleigh relations meet. */
export const SONIC_IMPACT_PRESSURE_RATIO = powMinusOne(HALF_K_MINUS_ONE, PRESSURE_EXPONENT);

/** Ratio of impact pressure to the reference pressure at Mach `mach` (> 0). */
export function impactPressureRatio(mach: number): number {
  return mach < 1 ? powMinusOne(HALF_K_MINUS_ONE * mach * mach, PRESSURE_EXPONENT) : rayleighRatioPlusOne(mach) - 1;
}

/** d ln(qc/p + 1) / dM of the Rayleigh relation, for Newton's method. */
function rayleighLogSlope(mach: number): number {
  const m2 = mach * mach;
  return (
    PRESSURE_EXPONENT * (2 / mach - (8 * K * mach) / (4 * K * m2 - 2 * (K - 1))) + (4 * K * mach) / (2 * K * m2 - (K - 1))
  );
}

/**
 * Mach for a ratio of impact to reference pressure (> 0), the inverse of `impactPressureRatio`.
 * Subsonic: closed form. Supersonic: the Rayleigh relation has no closed inverse, so it is
 * solved by Newton's method on ln(qc/p + 1), kept inside a shrinking bracket [1, MAX_MACH]
 * (bisection whenever a step would leave it); converges to a few ulps in under ten steps.
 * Ratios beyond Mach `MAX_MACH` return a value ≥ MAX_MACH; callers refuse those.
 */
export function machForImpactPressureRatio(ratio: number): number {
  if (ratio < SONIC_IMPACT_PRESSURE_RATIO) {
    return Math.sqrt(TWO_OVER_K_MINUS_ONE * powMinusOne(ratio, INVERSE_PRESSURE_EXPONENT));
  }
  const target = Math.log1p(ratio);
  if (target >= Math.log(rayleighRatioPlusOne(MAX_MACH))) return MAX_MACH;
  let low = 1;
  let high = MAX_MACH;
  let mach = 1.5;
  for (let i = 0; i < 100; i++) {
    const error = Math.log(rayleighRatioPlusOne(mach)) - target;
    if (error > 0) high = mach;
    else low = mach;
    let next = mach - error / rayleighLogSlope(mach);
    if (!(next > low && next < high)) next = (low + high) / 2;
    if (Math.abs(next - mach) <= 1e-15 * mach || high - low <= 1e-15 * mach) return next;
    mach = next;
  }
  return mach;
}
