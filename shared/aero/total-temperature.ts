/**
 * Static air temperature from a total-air-temperature probe. A probe in the airflow reads a
 * temperature raised by the adiabatic compression of the air it brings to rest; the static
 * (outside) air temperature follows from the Mach number and the probe's recovery factor K:
 *
 *   SAT = TAT / (1 + 0.2·K·M²)      (temperatures in kelvin; 0.2 = (γ − 1)/2 for γ = 1.4)
 *
 * Method: the adiabatic stagnation-temperature relation with a recovery factor, as in NASA
 * RP 1046 (Gracey, "Measurement of aircraft speed and altitude", 1980, chapter on temperature
 * measurement; from memory) and flight-physics.md. K = 1 for a probe that recovers the full
 * stagnation temperature (the default); real probes state K between about 0.75 and 1.
 */
import { HEAT_CAPACITY_RATIO, ZERO_CELSIUS_K } from './constants';
import { AeroInputError } from './errors';
import { finiteResult, formatNumber, requireFinite } from './guards';

/** Lowest and highest recovery factor accepted (the speed-book schema's range). */
const MIN_RECOVERY_FACTOR = 0.5;
const MAX_RECOVERY_FACTOR = 1;

/**
 * Static (outside) air temperature, °C, from the total air temperature a probe reads.
 *
 * @param tatC total air temperature, °C, above absolute zero
 * @param mach flight Mach number, 0 to below 1 (the subsonic relation)
 * @param recoveryFactor the probe's recovery factor K, 0.5 to 1; 1 when the book states none
 * @example tatToSatC(-30, 0.78) // ≈ −52.1 (K = 1: 243.15 K / 1.12168)
 * @example tatToSatC(15, 0) // 15 (at rest there is no heating)
 * @throws AeroInputError `not-a-number`, `temperature-out-of-range`, `speed-out-of-range`, `factor-out-of-range`
 */
export function tatToSatC(tatC: number, mach: number, recoveryFactor = 1): number {
  requireFinite(tatC, 'tatC', 'The total air temperature');
  requireFinite(mach, 'mach', 'The Mach number');
  requireFinite(recoveryFactor, 'recoveryFactor', 'The probe recovery factor');
  if (tatC <= -ZERO_CELSIUS_K) {
    throw new AeroInputError('temperature-out-of-range', 'tatC', `A total air temperature of ${formatNumber(tatC, 1)} °C is below absolute zero.`);
  }
  if (mach < 0 || mach >= 1) {
    throw new AeroInputError('speed-out-of-range', 'mach', `The TAT correction is for subsonic flight; Mach ${formatNumber(mach, 3)} is outside 0 to below 1.`);
  }
  if (recoveryFactor < MIN_RECOVERY_FACTOR || recoveryFactor > MAX_RECOVERY_FACTOR) {
    throw new AeroInputError(
      'factor-out-of-range',
      'recoveryFactor',
      `The probe recovery factor must lie between ${MIN_RECOVERY_FACTOR} and ${MAX_RECOVERY_FACTOR}; got ${formatNumber(recoveryFactor, 2)}.`,
    );
  }
  const heating = 1 + ((HEAT_CAPACITY_RATIO - 1) / 2) * recoveryFactor * mach * mach;
  return finiteResult((tatC + ZERO_CELSIUS_K) / heating - ZERO_CELSIUS_K, 'tatC', 'a static air temperature');
}
