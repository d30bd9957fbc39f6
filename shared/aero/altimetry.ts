/**
 * Pressure altitude from field elevation and QNH, and density altitude (with humidity through
 * the virtual temperature). Methods: the ICAO standard-atmosphere altimeter relation
 * (ICAO Doc 7488/3 troposphere law, on which altimeters are calibrated) and the virtual
 * temperature of moist air (the standard meteorological definition, as in flight-physics.md).
 */
import {
  GAS_CONSTANT_AIR_JKGK,
  MAGNUS_COEFFICIENTS,
  MAX_PRESSURE_ALTITUDE_FT,
  MAX_QNH_HPA,
  METRES_PER_FOOT,
  MIN_OAT_C,
  MIN_PRESSURE_ALTITUDE_FT,
  MIN_QNH_HPA,
  SEA_LEVEL_TEMPERATURE_K,
  STANDARD_GRAVITY_MS2,
  TROPOPAUSE_ALTITUDE_M,
  TROPOSPHERE_LAPSE_RATE_KPM,
  WATER_VAPOUR_MOLAR_MASS_RATIO,
  ZERO_CELSIUS_K,
} from './constants';
import {
  altitudeMForDensityKgM3,
  altitudeMForPressurePa,
  isaPressurePaAtM,
  requireOatC,
  requirePressureAltitudeFt,
} from './atmosphere';
import { AeroInputError } from './errors';
import { formatNumber, requireFinite } from './guards';

/** g0 / (R·L) of the troposphere, 5.255 88: the exponent of the altimeter law. */
const ALTIMETER_EXPONENT = STANDARD_GRAVITY_MS2 / (GAS_CONSTANT_AIR_JKGK * TROPOSPHERE_LAPSE_RATE_KPM);
const MAX_ELEVATION_FT = TROPOPAUSE_ALTITUDE_M / METRES_PER_FOOT;

function requireElevationAndQnh(elevationFt: number, qnhHpa: number): void {
  requireFinite(elevationFt, 'elevationFt', 'The elevation');
  requireFinite(qnhHpa, 'qnhHpa', 'The QNH');
  if (elevationFt < MIN_PRESSURE_ALTITUDE_FT || elevationFt > MAX_ELEVATION_FT) {
    throw new AeroInputError(
      'altitude-out-of-range',
      'elevationFt',
      `An elevation of ${formatNumber(elevationFt)} ft is outside the range of the altimeter relation ` +
        `(${formatNumber(MIN_PRESSURE_ALTITUDE_FT)} to ${formatNumber(MAX_ELEVATION_FT)} ft).`,
    );
  }
  if (qnhHpa < MIN_QNH_HPA || qnhHpa > MAX_QNH_HPA) {
    throw new AeroInputError(
      'pressure-out-of-range',
      'qnhHpa',
      `A QNH of ${formatNumber(qnhHpa, 1)} hPa is not plausible; accepted: ${MIN_QNH_HPA} to ${MAX_QNH_HPA} hPa ` +
        `(for inches of mercury, convert first: 29.92 inHg is 1013.2 hPa).`,
    );
  }
}

function stationPressurePa(elevationFt: number, qnhHpa: number): number {
  const elevationM = elevationFt * METRES_PER_FOOT;
  return (
    qnhHpa * 100 * Math.pow(1 - (TROPOSPHERE_LAPSE_RATE_KPM * elevationM) / SEA_LEVEL_TEMPERATURE_K, ALTIMETER_EXPONENT)
  );
}

/**
 * Static pressure, hPa, at a place of elevation `elevationFt` where the altimeter setting is
 * `qnhHpa`: p = QNH·(1 − L·h/T0)^(g0/(R·L)), the standard-atmosphere troposphere law an altimeter
 * is calibrated on (ICAO Doc 7488/3).
 *
 * @param elevationFt ft, −16 404 to 36 089 (the troposphere, where the law holds)
 * @param qnhHpa hPa, 850 to 1100
 * @example stationPressureHpa(0, 1013.25) // 1013.25
 * @example stationPressureHpa(5000, 1013.25) // 843.07
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `pressure-out-of-range`
 */
export function stationPressureHpa(elevationFt: number, qnhHpa: number): number {
  requireElevationAndQnh(elevationFt, qnhHpa);
  return stationPressurePa(elevationFt, qnhHpa) / 100;
}

/**
 * Pressure altitude, ft, of a place of elevation `elevationFt` with altimeter setting `qnhHpa`:
 * the station pressure from the altimeter law (see `stationPressureHpa`), then the ISA altitude
 * of that pressure (ISO 2533:1975). Exact, not the "27–30 ft per hPa" rule of thumb.
 *
 * @param elevationFt ft, −16 404 to 36 089
 * @param qnhHpa hPa, 850 to 1100 (for inHg use `inhgToHpa`)
 * @example pressureAltitudeFt(0, 1013.25) // 0
 * @example pressureAltitudeFt(0, inhgToHpa(29.70)) // ≈ 205 (FAA worked example, sea-level field)
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `pressure-out-of-range`
 */
export function pressureAltitudeFt(elevationFt: number, qnhHpa: number): number {
  requireElevationAndQnh(elevationFt, qnhHpa);
  const altitudeFt = altitudeMForPressurePa(stationPressurePa(elevationFt, qnhHpa)) / METRES_PER_FOOT;
  if (altitudeFt < MIN_PRESSURE_ALTITUDE_FT || altitudeFt > MAX_PRESSURE_ALTITUDE_FT) {
    throw new AeroInputError(
      'altitude-out-of-range',
      'qnhHpa',
      `An elevation of ${formatNumber(elevationFt)} ft with QNH ${formatNumber(qnhHpa, 1)} hPa gives a pressure altitude ` +
        `of ${formatNumber(altitudeFt)} ft, outside the standard atmosphere used here.`,
    );
  }
  return altitudeFt;
}

/**
 * @internal Saturation vapour pressure over water, hPa, at `temperatureC` (°C): the Magnus-type
 * formula with the Alduchov & Eskridge (1996) coefficients (constants.ts). At the dew point it
 * is the actual vapour pressure of the air.
 */
export function saturationVapourPressureHpa(temperatureC: number): number {
  const { cHpa, a, bC } = MAGNUS_COEFFICIENTS;
  return cHpa * Math.exp((a * temperatureC) / (temperatureC + bC));
}

/**
 * Density altitude, ft: the ISA altitude whose density equals that of the actual air
 * (ISO 2533:1975 density, inverted by layer). The air density is ρ = p / (R·Tv) with p the ISA
 * pressure at the pressure altitude and Tv the virtual temperature: Tv = T without a dew point,
 * Tv = T / (1 − (e/p)(1 − ε)) with one, e the vapour pressure at the dew point (Magnus-type
 * formula over water, Alduchov & Eskridge 1996) and ε = 0.622.
 *
 * @param pressureAltitudeFt ft, −16 404 to 154 199
 * @param oatC outside air temperature, °C, −100 to ISA +55 (never above +70)
 * @param dewPointC optional dew point, °C, from −100 up to `oatC`
 * @example densityAltitudeFt(0, 15) // 0
 * @example densityAltitudeFt(5000, 30) // ≈ 7,801 (ISA +25 °C)
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `temperature-out-of-range`,
 *   `dew-point-above-temperature`
 */
export function densityAltitudeFt(pressureAltitudeFt: number, oatC: number, dewPointC?: number): number {
  requirePressureAltitudeFt(pressureAltitudeFt);
  requireOatC(oatC, pressureAltitudeFt);
  const pressurePa = isaPressurePaAtM(pressureAltitudeFt * METRES_PER_FOOT);
  const temperatureK = oatC + ZERO_CELSIUS_K;
  const virtualTemperatureK =
    dewPointC === undefined ? temperatureK : temperatureK / (1 - vapourFraction(dewPointC, oatC, pressurePa) * (1 - WATER_VAPOUR_MOLAR_MASS_RATIO));
  const densityKgM3 = pressurePa / (GAS_CONSTANT_AIR_JKGK * virtualTemperatureK);
  const altitudeFt = altitudeMForDensityKgM3(densityKgM3) / METRES_PER_FOOT;
  if (altitudeFt < MIN_PRESSURE_ALTITUDE_FT || altitudeFt > MAX_PRESSURE_ALTITUDE_FT) {
    throw new AeroInputError(
      'altitude-out-of-range',
      'oatC',
      `The density altitude (${formatNumber(altitudeFt)} ft) is outside the standard atmosphere used here ` +
        `(${formatNumber(MIN_PRESSURE_ALTITUDE_FT)} to ${formatNumber(MAX_PRESSURE_ALTITUDE_FT)} ft).`,
    );
  }
  return altitudeFt;
}

/** e/p at the dew point, after checking the dew point is possible. */
function vapourFraction(dewPointC: number, oatC: number, pressurePa: number): number {
  requireFinite(dewPointC, 'dewPointC', 'The dew point');
  if (dewPointC < MIN_OAT_C) {
    throw new AeroInputError(
      'temperature-out-of-range',
      'dewPointC',
      `A dew point of ${formatNumber(dewPointC, 1)} °C is not plausible; the lowest accepted is ${MIN_OAT_C} °C.`,
    );
  }
  if (dewPointC > oatC) {
    throw new AeroInputError(
      'dew-point-above-temperature',
      'dewPointC',
      `The dew point (${formatNumber(dewPointC, 1)} °C) cannot be warmer than the air (${formatNumber(oatC, 1)} °C).`,
    );
  }
  const vapourPa = saturationVapourPressureHpa(dewPointC) * 100;
  if (vapourPa >= pressurePa) {
    throw new AeroInputError(
      'temperature-out-of-range',
      'dewPointC',
      `A dew point of ${formatNumber(dewPointC, 1)} °C is impossible at a static pressure of ` +
        `${formatNumber(pressurePa / 100, 1)} hPa: the water would boil.`,
    );
  }
  return vapourPa / pressurePa;
}
