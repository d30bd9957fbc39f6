/**
 * The crossover altitude of a VMO (a calibrated airspeed) and an MMO: where both give the same
 * impact pressure, qc(VMO) = p·[(1 + 0.2·MMO²)^3.5 − 1], solved for the static pressure p and
 * converted to its ISA pressure altitude. Below it VMO is the limit, above it MMO.
 * Method: pitot relations of NASA RP 1046 (Gracey 1980), see `pitot.ts`, and ISO 2533:1975.
 */
import {
  MAX_PRESSURE_ALTITUDE_FT,
  METRES_PER_FOOT,
  MIN_AIRSPEED_KT,
  MIN_MACH,
  MIN_PRESSURE_ALTITUDE_FT,
  SEA_LEVEL_PRESSURE_PA,
  SEA_LEVEL_SPEED_OF_SOUND_KT,
} from './constants';
import { altitudeMForPressurePa } from './atmosphere';
import { AeroInputError } from './errors';
import { formatNumber, requirePositiveSpeed } from './guards';
import { MAX_MACH, impactPressureRatio } from './pitot';

function outOfRange(field: string, message: string): AeroInputError {
  return new AeroInputError('speed-out-of-range', field, message);
}

/**
 * Crossover altitude, ft: the pressure altitude at which `vmoKt` (CAS) and `mmo` are the same
 * speed. Independent of temperature (both limits are defined by pressures).
 *
 * @param vmoKt maximum operating speed, KCAS, at least 1 kt and below Mach 5 at sea level
 * @param mmo maximum operating Mach, at least 0.001 and below 5
 * @example crossoverAltitudeFt(250, 0.6) // ≈ 24,694
 * @example crossoverAltitudeFt(340, 0.82) // ≈ 25,968
 * @throws AeroInputError `not-a-number`, `speed-not-positive`, `speed-out-of-range`, `altitude-out-of-range`
 */
export function crossoverAltitudeFt(vmoKt: number, mmo: number): number {
  requirePositiveSpeed(vmoKt, 'vmoKt', 'VMO');
  requirePositiveSpeed(mmo, 'mmo', 'MMO', '');
  if (vmoKt < MIN_AIRSPEED_KT || vmoKt >= MAX_MACH * SEA_LEVEL_SPEED_OF_SOUND_KT) {
    throw outOfRange('vmoKt', `A VMO of ${formatNumber(vmoKt, 1)} KCAS is outside the speeds handled here.`);
  }
  if (mmo < MIN_MACH || mmo >= MAX_MACH) {
    throw outOfRange('mmo', `An MMO of ${formatNumber(mmo, 3)} is outside the Mach numbers handled here.`);
  }
  const impactPressurePa = SEA_LEVEL_PRESSURE_PA * impactPressureRatio(vmoKt / SEA_LEVEL_SPEED_OF_SOUND_KT);
  const pressurePa = impactPressurePa / impactPressureRatio(mmo);
  const altitudeFt = altitudeMForPressurePa(pressurePa) / METRES_PER_FOOT;
  if (!(altitudeFt >= MIN_PRESSURE_ALTITUDE_FT && altitudeFt <= MAX_PRESSURE_ALTITUDE_FT)) {
    throw new AeroInputError(
      'altitude-out-of-range',
      'vmoKt',
      `VMO ${formatNumber(vmoKt, 1)} KCAS and MMO ${formatNumber(mmo, 3)} would cross at about ${formatNumber(altitudeFt)} ft, ` +
        `outside the standard atmosphere used here (${formatNumber(MIN_PRESSURE_ALTITUDE_FT)} to ${formatNumber(MAX_PRESSURE_ALTITUDE_FT)} ft).`,
    );
  }
  return altitudeFt;
}
