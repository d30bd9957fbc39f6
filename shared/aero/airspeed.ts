/**
 * The airspeed chain CAS ↔ EAS ↔ TAS ↔ Mach at one pressure altitude and outside air
 * temperature, by the compressible pitot–static relations of NASA Reference Publication 1046
 * (Gracey 1980, "Measurement of Aircraft Speed and Altitude"), see `pitot.ts`:
 *
 *   impact pressure from CAS   qc = p0·f(CAS/a0)        (f: Saint-Venant below 1, Rayleigh above)
 *   Mach from qc and static p  M  = f⁻¹(qc/p)
 *   TAS = M·a,  EAS = TAS·√σ,  dynamic pressure q = ½·ρ·TAS² = 0.7·p·M²
 *
 * with p, ρ and a from the ISO 2533 atmosphere at the pressure altitude and the actual
 * temperature, and a0 = 661.4786 kt, p0 = 101 325 Pa as the calibration references.
 */
import * as constants from './constants';
import * as atmosphere from './atmosphere';
import { AeroInputError } from './errors';
import * as guards from './guards';
import * as pitot from './pitot';

// Imports are bound to module constants once, at load: the CommonJS output of esbuild (used by
// tsx, which runs the benchmark) reads every imported name through a getter on each use, which
// made those reads the bulk of a conversion's time. tsc and the Angular bundler are unaffected.
const {
  GAS_CONSTANT_AIR_JKGK,
  HEAT_CAPACITY_RATIO,
  METRES_PER_FOOT,
  MIN_AIRSPEED_KT,
  MIN_MACH,
  MPS_PER_KNOT,
  SEA_LEVEL_DENSITY_KGM3,
  SEA_LEVEL_PRESSURE_PA,
  SEA_LEVEL_SPEED_OF_SOUND_KT,
  ZERO_CELSIUS_K,
} = constants;
const { isaPressurePaAtM } = atmosphere;
const requireOatC: typeof atmosphere.requireOatC = atmosphere.requireOatC;
const requirePressureAltitudeFt: typeof atmosphere.requirePressureAltitudeFt = atmosphere.requirePressureAltitudeFt;
const { formatNumber } = guards;
const requirePositiveSpeed: typeof guards.requirePositiveSpeed = guards.requirePositiveSpeed;
const { MAX_MACH, impactPressureRatio, machForImpactPressureRatio } = pitot;

const KAPPA_R = HEAT_CAPACITY_RATIO * GAS_CONSTANT_AIR_JKGK;
const A0_KT = SEA_LEVEL_SPEED_OF_SOUND_KT;
const HALF_KAPPA = HEAT_CAPACITY_RATIO / 2;

/** One speed given to `convertAirspeed`. Exactly one of the four may be present. */
export type AirspeedGiven =
  | { readonly casKt: number; readonly easKt?: undefined; readonly tasKt?: undefined; readonly mach?: undefined }
  | { readonly casKt?: undefined; readonly easKt: number; readonly tasKt?: undefined; readonly mach?: undefined }
  | { readonly casKt?: undefined; readonly easKt?: undefined; readonly tasKt: number; readonly mach?: undefined }
  | { readonly casKt?: undefined; readonly easKt?: undefined; readonly tasKt?: undefined; readonly mach: number };

/** Input of `convertAirspeed`: where the aircraft is, and one speed. */
export type AirspeedInput = {
  /** Geopotential pressure altitude, ft, −16 404 to 154 199. */
  readonly pressureAltitudeFt: number;
  /** Outside (static) air temperature, °C, −100 to ISA +55 (never above +70). */
  readonly oatC: number;
} & AirspeedGiven;

/** The same airspeed expressed every way, with the pressures behind it. */
export interface Airspeeds {
  /** Calibrated airspeed, kt. */
  readonly casKt: number;
  /** Equivalent airspeed, kt. */
  readonly easKt: number;
  /** True airspeed, kt. */
  readonly tasKt: number;
  /** Mach number, dimensionless. */
  readonly mach: number;
  /** Dynamic pressure q = ½·ρ·TAS², Pa. */
  readonly dynamicPressurePa: number;
  /** Impact pressure qc (pitot minus static), Pa. */
  readonly impactPressurePa: number;
}

function tooFast(field: string, what: string): AeroInputError {
  return new AeroInputError(
    'speed-out-of-range',
    field,
    `${what} is at or beyond Mach ${MAX_MACH}; the pitot relations used here stop there.`,
  );
}

function tooSlow(field: string, what: string, minimum: string): AeroInputError {
  return new AeroInputError('speed-out-of-range', field, `${what} is below ${minimum}, slower than any airspeed system reads.`);
}

type SpeedKey = 'casKt' | 'easKt' | 'tasKt' | 'mach';

/** Which single speed was given, after checking there is exactly one. */
function givenSpeed(input: AirspeedInput): SpeedKey {
  const hasCas = input.casKt !== undefined;
  const hasEas = input.easKt !== undefined;
  const hasTas = input.tasKt !== undefined;
  const hasMach = input.mach !== undefined;
  const count = Number(hasCas) + Number(hasEas) + Number(hasTas) + Number(hasMach);
  if (count !== 1) {
    throw new AeroInputError(
      'one-speed-required',
      'speed',
      count === 0
        ? 'Give one speed to convert: CAS, EAS or TAS in knots, or a Mach number.'
        : 'Give only one speed to convert (CAS, EAS, TAS or Mach), not several.',
    );
  }
  return hasCas ? 'casKt' : hasEas ? 'easKt' : hasTas ? 'tasKt' : 'mach';
}

const LABELS: Readonly<Record<SpeedKey, string>> = {
  casKt: 'calibrated airspeed',
  easKt: 'equivalent airspeed',
  tasKt: 'true airspeed',
  mach: 'Mach number',
};
const SUBJECTS: Readonly<Record<SpeedKey, string>> = {
  casKt: 'The calibrated airspeed',
  easKt: 'The equivalent airspeed',
  tasKt: 'The true airspeed',
  mach: 'The Mach number',
};

/** The given speed, checked to be a number, above zero and not below the slowest accepted. */
function checkedSpeed(input: AirspeedInput, key: SpeedKey): number {
  const value =
    key === 'casKt' ? input.casKt : key === 'tasKt' ? input.tasKt : key === 'easKt' ? input.easKt : input.mach;
  // Fast path: a finite number at or above the slowest accepted (NaN fails the comparisons).
  if (typeof value === 'number' && value < Infinity && value >= (key === 'mach' ? MIN_MACH : MIN_AIRSPEED_KT)) return value;
  return refuseSpeed(value, key);
}

function refuseSpeed(value: unknown, key: SpeedKey): never {
  requirePositiveSpeed(value, key, SUBJECTS[key], key === 'mach' ? '' : 'kt');
  throw key === 'mach'
    ? tooSlow(key, `Mach ${formatNumber(value, 5)}`, `Mach ${MIN_MACH}`)
    : tooSlow(key, `${key === 'easKt' ? 'An' : 'A'} ${LABELS[key]} of ${formatNumber(value, 3)} kt`, `${MIN_AIRSPEED_KT} kt`);
}

/**
 * Converts one airspeed (CAS, EAS, TAS or Mach) into all four at a pressure altitude and outside
 * air temperature, with the dynamic and impact pressures.
 *
 * Method: compressible pitot–static relations of NASA RP 1046 (Gracey 1980): Saint-Venant below
 * Mach 1, Rayleigh pitot formula from Mach 1 to 5; static pressure from the ISO 2533 standard
 * atmosphere at the pressure altitude, density and speed of sound from the actual temperature.
 *
 * @param input `pressureAltitudeFt` (ft, −16 404 to 154 199), `oatC` (static air temperature,
 *   °C, −100 to ISA +55, never above +70) and exactly one of `casKt`, `easKt`, `tasKt` (kt, at
 *   least 1) or `mach` (at least 0.001); the flight must be slower than Mach 5.
 * @example convertAirspeed({ pressureAltitudeFt: 10_000, oatC: -4.81, casKt: 250 })
 *   // { casKt: 250, easKt: 248.10, tasKt: 288.70, mach: 0.4523, … } (NASA RP 1046 check values)
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `temperature-out-of-range`,
 *   `one-speed-required`, `speed-not-positive`, `speed-out-of-range`
 */
export function convertAirspeed(input: AirspeedInput): Airspeeds {
  const pressureAltitudeFt = input.pressureAltitudeFt;
  const oatC = input.oatC;
  requirePressureAltitudeFt(pressureAltitudeFt);
  requireOatC(oatC, pressureAltitudeFt);
  const given = givenSpeed(input);
  const speed = checkedSpeed(input, given);

  const pressurePa = isaPressurePaAtM(pressureAltitudeFt * METRES_PER_FOOT);
  const temperatureK = oatC + ZERO_CELSIUS_K;
  const speedOfSoundKt = Math.sqrt(KAPPA_R * temperatureK) / MPS_PER_KNOT;
  const rootSigma = Math.sqrt(pressurePa / (GAS_CONSTANT_AIR_JKGK * temperatureK * SEA_LEVEL_DENSITY_KGM3));

  let casKt: number;
  let mach: number;
  let impactPressurePa: number;
  if (given === 'casKt') {
    casKt = speed;
    if (casKt >= MAX_MACH * A0_KT) throw tooFast('casKt', `A calibrated airspeed of ${formatNumber(casKt, 1)} kt`);
    impactPressurePa = SEA_LEVEL_PRESSURE_PA * impactPressureRatio(casKt / A0_KT);
    mach = machForImpactPressureRatio(impactPressurePa / pressurePa);
  } else {
    mach = given === 'mach' ? speed : (given === 'tasKt' ? speed : speed / rootSigma) / speedOfSoundKt;
    if (mach >= MAX_MACH) refuseTooFast(given, speed, pressureAltitudeFt);
    impactPressurePa = pressurePa * impactPressureRatio(mach);
    casKt = A0_KT * machForImpactPressureRatio(impactPressurePa / SEA_LEVEL_PRESSURE_PA);
    if (casKt >= MAX_MACH * A0_KT) refuseTooFast(given, speed, pressureAltitudeFt);
  }
  if (mach >= MAX_MACH) refuseTooFast(given, speed, pressureAltitudeFt);

  const tasKt = given === 'tasKt' ? speed : mach * speedOfSoundKt;
  return {
    casKt,
    easKt: given === 'easKt' ? speed : tasKt * rootSigma,
    tasKt,
    mach,
    dynamicPressurePa: HALF_KAPPA * pressurePa * mach * mach,
    impactPressurePa,
  };
}

function refuseTooFast(given: SpeedKey, speed: number, pressureAltitudeFt: number): never {
  const what =
    given === 'mach'
      ? `Mach ${formatNumber(speed, 3)}`
      : `${formatNumber(speed, 1)} kt ${LABELS[given]} at ${formatNumber(pressureAltitudeFt)} ft`;
  throw tooFast(given, what);
}
