/**
 * Speedwright's flight-physics library: the whole public API. Pure TypeScript (ES2022, no I/O,
 * no DOM, no framework), used unchanged by the Angular client and the Node server.
 *
 * Error policy: every function throws `AeroInputError` (with a `code` from
 * `AERO_INPUT_ERROR_CODES` and a sentence for the pilot) for any invalid or out-of-envelope
 * input, and never returns NaN or Infinity. Units are in every name.
 */
export { AERO_INPUT_ERROR_CODES, AeroInputError, type AeroInputErrorCode } from './errors';

export {
  GAS_CONSTANT_AIR_JKGK,
  HEAT_CAPACITY_RATIO,
  KG_PER_POUND,
  MAX_ISA_DEVIATION_C,
  MAX_OAT_C,
  MAX_PRESSURE_ALTITUDE_FT,
  MAX_QNH_HPA,
  METRES_PER_FOOT,
  MIN_AIRSPEED_KT,
  MIN_MACH,
  MIN_OAT_C,
  MIN_PRESSURE_ALTITUDE_FT,
  MIN_QNH_HPA,
  MPS_PER_KMH,
  MPS_PER_KNOT,
  MPS_PER_MPH,
  PA_PER_INHG,
  SEA_LEVEL_DENSITY_KGM3,
  SEA_LEVEL_PRESSURE_PA,
  SEA_LEVEL_SPEED_OF_SOUND_KT,
  SEA_LEVEL_SPEED_OF_SOUND_MS,
  SEA_LEVEL_TEMPERATURE_K,
  STANDARD_GRAVITY_MS2,
  ZERO_CELSIUS_K,
} from './constants';

export {
  cToF,
  cToK,
  fToC,
  ftToM,
  hpaToInhg,
  inhgToHpa,
  kToC,
  kgToLb,
  kmhToKt,
  ktToKmh,
  ktToMph,
  ktToMps,
  lbToKg,
  mToFt,
  mphToKt,
  mpsToKt,
} from './units';

export { roundLimitKt, roundSpeedKt, roundStallKt } from './rounding';

export { geometricAltitudeM, geopotentialAltitudeM } from './geopotential';

export {
  isa,
  isaDeviationC,
  isaTemperatureC,
  pressureAltitudeFtForPressureHpa,
  type IsaConditions,
} from './atmosphere';

export { densityAltitudeFt, pressureAltitudeFt, stationPressureHpa } from './altimetry';

export { convertAirspeed, type AirspeedGiven, type AirspeedInput, type Airspeeds } from './airspeed';

export {
  casToIasKt,
  checkPositionErrorTable,
  iasToCasKt,
  type PositionErrorPoint,
  type PositionErrorTable,
} from './position-error';

export { crossoverAltitudeFt } from './crossover';

export { weightScaledSpeedKt } from './weight';

export {
  checkSpeedTable,
  interpolateSpeedTableKt,
  type SpeedTable,
  type SpeedTableByWeight,
  type SpeedTableByWeightAltitudeAndOat,
  type SpeedTableByWeightAndAltitude,
  type SpeedTableByWeightAndOat,
  type SpeedTableQuery,
} from './speed-table';

export { loadFactorInTurn, stallSpeedInTurnKt } from './turn';

export { tatToSatC } from './total-temperature';
