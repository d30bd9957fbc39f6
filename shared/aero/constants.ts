/**
 * Every physical constant, unit definition and envelope bound of the flight-physics library,
 * each with its source. Derived values are computed here from the defining ones (never typed in
 * rounded), so the whole library agrees with itself to the last bit; the published rounded
 * figure is quoted beside each and checked in `constants.spec.ts`.
 *
 * Sources:
 * - ISA: ICAO Doc 7488/3 "Manual of the ICAO Standard Atmosphere" (1993) and ISO 2533:1975
 *   "Standard Atmosphere", Table 1 (primary constants); identical to the U.S. Standard
 *   Atmosphere 1976 below 47 km geopotential, the top of this library's model.
 * - Units: the international yard and pound agreement of 1959 (foot, pound, mile), the
 *   international nautical mile of 1 852 m (BIPM SI Brochure, non-SI units accepted for use
 *   with the SI), the conventional inch of mercury (NIST Special Publication 811, appendix B,
 *   quoted from memory).
 */

// ---------------------------------------------------------------------------------------------
// Standard atmosphere (ICAO Doc 7488 / ISO 2533:1975 Table 1)

/** Sea-level standard temperature, K. ISO 2533 Table 1: T0 = 288.15 K (15 °C). */
export const SEA_LEVEL_TEMPERATURE_K = 288.15;

/** Sea-level standard pressure, Pa. ISO 2533 Table 1: p0 = 101 325 Pa (1013.25 hPa). */
export const SEA_LEVEL_PRESSURE_PA = 101325;

/** Standard acceleration of gravity, m/s². ISO 2533 Table 1: g0 = 9.806 65 m/s². */
export const STANDARD_GRAVITY_MS2 = 9.80665;

/** Specific gas constant of dry air, J/(kg·K). ISO 2533 Table 1: R = 287.052 87 J/(kg·K). */
export const GAS_CONSTANT_AIR_JKGK = 287.05287;

/** Ratio of specific heats of air, dimensionless. ISO 2533 Table 1: κ = 1.4. */
export const HEAT_CAPACITY_RATIO = 1.4;

/**
 * Radius of the Earth used for geopotential altitude, m. ISO 2533 Table 1: r = 6 356 766 m.
 * Geopotential H and geometric Z are related by H = r·Z / (r + Z).
 */
export const EARTH_RADIUS_M = 6356766;

/**
 * Sea-level standard density, kg/m³, derived as p0 / (R·T0) = 1.225 000 02. ISO 2533 Table 1
 * publishes 1.225 kg/m³; the derived value is used so that σ is exactly 1 at ISA sea level.
 */
export const SEA_LEVEL_DENSITY_KGM3 = SEA_LEVEL_PRESSURE_PA / (GAS_CONSTANT_AIR_JKGK * SEA_LEVEL_TEMPERATURE_K);

/**
 * Sea-level standard speed of sound, m/s, derived as √(κ·R·T0) = 340.293 99. ISO 2533 Table 5
 * publishes 340.294 m/s. It is also the reference speed a0 of the calibrated-airspeed relation.
 */
export const SEA_LEVEL_SPEED_OF_SOUND_MS = Math.sqrt(
  HEAT_CAPACITY_RATIO * GAS_CONSTANT_AIR_JKGK * SEA_LEVEL_TEMPERATURE_K,
);

/**
 * One layer of the standard atmosphere: from `baseAltitudeM` (geopotential) upward the
 * temperature changes linearly at `lapseRateKPerM` (0 for an isothermal layer).
 */
export interface AtmosphereLayerDefinition {
  readonly baseAltitudeM: number;
  readonly baseTemperatureK: number;
  readonly lapseRateKPerM: number;
}

/**
 * The layers of ISO 2533:1975 (temperature and vertical temperature gradient by geopotential
 * altitude) up to 47 km: troposphere −6.5 K/km (continued below sea level to −5 km, 320.65 K, as ICAO Doc 7488/3 tabulates it),
 * tropopause isothermal at 216.65 K from 11 km, +1.0 K/km from 20 km, +2.8 K/km from 32 km.
 * Base pressures are derived from p0 by the barometric formula in `atmosphere.ts`.
 */
export const ATMOSPHERE_LAYERS: readonly AtmosphereLayerDefinition[] = [
  { baseAltitudeM: 0, baseTemperatureK: 288.15, lapseRateKPerM: -0.0065 },
  { baseAltitudeM: 11000, baseTemperatureK: 216.65, lapseRateKPerM: 0 },
  { baseAltitudeM: 20000, baseTemperatureK: 216.65, lapseRateKPerM: 0.001 },
  { baseAltitudeM: 32000, baseTemperatureK: 228.65, lapseRateKPerM: 0.0028 },
];

/**
 * Lowest geopotential altitude of the model, m: −5 km, where ICAO Doc 7488/3 begins its tables
 * (ISO 2533:1975 begins at −2 km; both continue the troposphere's −6.5 K/km below sea level).
 * Low enough that no ordinary cold or high-pressure day falls outside the model: a sea-level
 * field at QNH 1100 hPa and −60 °C has a density altitude of about −11,000 ft (−3.4 km).
 */
export const MIN_ALTITUDE_M = -5000;

/** Highest geopotential altitude of the model, m: the top of the +2.8 K/km layer (47 km). */
export const MAX_ALTITUDE_M = 47000;

/** Troposphere lapse rate as a positive number, K/m (ISO 2533: 6.5 K/km). Used by the altimeter law. */
export const TROPOSPHERE_LAPSE_RATE_KPM = 0.0065;

/** Top of the troposphere, geopotential m (ISO 2533: 11 km). The altimeter law holds below it. */
export const TROPOPAUSE_ALTITUDE_M = 11000;

// ---------------------------------------------------------------------------------------------
// Units (exact by definition unless noted)

/** Metres in one international foot: exactly 0.3048 (1959 agreement). */
export const METRES_PER_FOOT = 0.3048;

/** Metres per second in one knot: exactly 1852 / 3600 (international nautical mile of 1852 m). */
export const MPS_PER_KNOT = 1852 / 3600;

/** Metres per second in one km/h: exactly 1 / 3.6. */
export const MPS_PER_KMH = 1 / 3.6;

/** Metres per second in one statute mile per hour: exactly 1609.344 / 3600 = 0.447 04. */
export const MPS_PER_MPH = 1609.344 / 3600;

/**
 * Pascals in one conventional inch of mercury: 3386.389 (NIST SP 811, from memory; it equals
 * 13 595.1 kg/m³ · g0 · 0.0254 m to 7 digits). flight-physics.md rounds it to 33.8639 hPa.
 */
export const PA_PER_INHG = 3386.389;

/** Kilograms in one avoirdupois pound: exactly 0.453 592 37 (1959 agreement). */
export const KG_PER_POUND = 0.45359237;

/** Kelvin at 0 °C: exactly 273.15 (SI definition of the degree Celsius). */
export const ZERO_CELSIUS_K = 273.15;

/** Speed of sound at ISA sea level in knots, derived: 661.4786 kt (flight-physics.md). */
export const SEA_LEVEL_SPEED_OF_SOUND_KT = SEA_LEVEL_SPEED_OF_SOUND_MS / MPS_PER_KNOT;

/** Lowest pressure altitude of the model, ft (−5 km geopotential = −16 404.2 ft). */
export const MIN_PRESSURE_ALTITUDE_FT = MIN_ALTITUDE_M / METRES_PER_FOOT;

/** Highest pressure altitude of the model, ft (47 km geopotential = 154 199.5 ft). */
export const MAX_PRESSURE_ALTITUDE_FT = MAX_ALTITUDE_M / METRES_PER_FOOT;

// ---------------------------------------------------------------------------------------------
// Moist air

/**
 * Ratio of the molar masses of water vapour and dry air, ε = 0.622 (flight-physics.md; from
 * memory 18.015 / 28.964 = 0.6220). Used by the virtual-temperature relation.
 */
export const WATER_VAPOUR_MOLAR_MASS_RATIO = 0.622;

/**
 * Magnus-type saturation vapour pressure over water, e = C·exp(A·t / (t + B)), t in °C, e in hPa,
 * with the coefficients of Alduchov & Eskridge (1996, J. Appl. Meteor. 35, 601–609; from memory):
 * C = 6.1094 hPa, A = 17.625, B = 243.04 °C. Stated accuracy better than 0.4 % from −40 to +50 °C.
 */
export const MAGNUS_COEFFICIENTS = { cHpa: 6.1094, a: 17.625, bC: 243.04 } as const;

// ---------------------------------------------------------------------------------------------
// Envelope bounds. These are the library's own choices (no outside source): generous enough for
// any real atmosphere, tight enough to catch typing errors and unit mix-ups.

/**
 * Coldest outside air temperature accepted at any altitude, °C. The coldest air observed at the
 * surface is about −89 °C and at the tropical tropopause about −90 °C (from memory).
 */
export const MIN_OAT_C = -100;

/**
 * Warmest outside air temperature accepted anywhere, °C. The hottest surface air recorded is
 * about +57 °C (from memory).
 */
export const MAX_OAT_C = 70;

/**
 * Warmest accepted ISA deviation, °C: the outside air temperature may be at most ISA + 55 °C
 * (and never above `MAX_OAT_C`). At sea level that is the +70 °C surface bound; aloft it follows
 * the standard lapse, so +60 °C at 30 000 ft (ISA −44.4 °C) is refused as a likely typing error.
 */
export const MAX_ISA_DEVIATION_C = 55;

/**
 * Accepted QNH, hPa. The lowest and highest sea-level pressures recorded are about 870 and
 * 1084 hPa (from memory); altimeter setting windows span roughly 950–1050 hPa.
 */
export const MIN_QNH_HPA = 850;
export const MAX_QNH_HPA = 1100;

/**
 * Slowest airspeed `convertAirspeed` accepts, kt, and slowest Mach. No airspeed system reads
 * below this, and it keeps the pitot relations clear of floating-point underflow.
 */
export const MIN_AIRSPEED_KT = 1;
export const MIN_MACH = 0.001;
