/**
 * Geometric (tape-measure) altitude Z versus geopotential altitude H, the altitude of the
 * standard atmosphere and of pressure altitude: H = r·Z / (r + Z), ISO 2533:1975 §2 with
 * r = 6 356 766 m. Needed whenever a source tabulates the atmosphere by geometric altitude.
 */
import { EARTH_RADIUS_M } from './constants';
import { AeroInputError } from './errors';
import { formatNumber, requireFinite } from './guards';

/** Anything beyond ±1000 km is not an aircraft altitude and nears the formula's pole at Z = −r. */
const LIMIT_M = 1_000_000;

function requireAltitudeM(valueM: number, field: string, label: string): void {
  requireFinite(valueM, field, label);
  if (valueM < -LIMIT_M || valueM > LIMIT_M) {
    throw new AeroInputError(
      'altitude-out-of-range',
      field,
      `${label} of ${formatNumber(valueM)} m is not an altitude in the atmosphere (limit ±1,000 km).`,
    );
  }
}

/**
 * Geopotential altitude, m, of a geometric altitude `geometricM` (m), H = r·Z / (r + Z)
 * (ISO 2533:1975). Valid for |Z| ≤ 1 000 km.
 * @example geopotentialAltitudeM(11019.07) // ≈ 11000 (the tropopause, U.S. Standard Atmosphere 1976)
 */
export function geopotentialAltitudeM(geometricM: number): number {
  requireAltitudeM(geometricM, 'geometricM', 'A geometric altitude');
  return (EARTH_RADIUS_M * geometricM) / (EARTH_RADIUS_M + geometricM);
}

/**
 * Geometric altitude, m, of a geopotential altitude `geopotentialM` (m), Z = r·H / (r − H)
 * (ISO 2533:1975). Valid for |H| ≤ 1 000 km.
 * @example geometricAltitudeM(11000) // ≈ 11019.07
 */
export function geometricAltitudeM(geopotentialM: number): number {
  requireAltitudeM(geopotentialM, 'geopotentialM', 'A geopotential altitude');
  return (EARTH_RADIUS_M * geopotentialM) / (EARTH_RADIUS_M - geopotentialM);
}
