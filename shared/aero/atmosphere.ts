/**
 * The ICAO / ISO standard atmosphere (ICAO Doc 7488/3; ISO 2533:1975) from −5 km to 47 km
 * geopotential: temperature linear in each layer, pressure from the barometric formula (a power
 * law where the lapse rate is not zero, an exponential where the layer is isothermal), density
 * from the gas law ρ = p / (R·T), speed of sound a = √(κ·R·T). An ISA deviation shifts the
 * temperature only; pressure stays that of the standard atmosphere at the pressure altitude.
 */
import * as constants from './constants';
import { AeroInputError } from './errors';
import * as guards from './guards';

// Imports are bound to module constants once, at load: the CommonJS output of esbuild (used by
// tsx, which runs the benchmark) reads every imported name through a getter on each use, which
// made those reads the bulk of a conversion's time. tsc and the Angular bundler are unaffected.
const {
  ATMOSPHERE_LAYERS,
  GAS_CONSTANT_AIR_JKGK,
  HEAT_CAPACITY_RATIO,
  MAX_ISA_DEVIATION_C,
  MAX_OAT_C,
  MAX_PRESSURE_ALTITUDE_FT,
  METRES_PER_FOOT,
  MIN_OAT_C,
  MIN_PRESSURE_ALTITUDE_FT,
  MPS_PER_KNOT,
  SEA_LEVEL_DENSITY_KGM3,
  SEA_LEVEL_PRESSURE_PA,
  STANDARD_GRAVITY_MS2,
  ZERO_CELSIUS_K,
} = constants;
const { formatNumber } = guards;
const requireFinite: typeof guards.requireFinite = guards.requireFinite;

/** A layer with its derived base pressure and density and the exponent of its barometric law. */
interface Layer {
  readonly baseM: number;
  readonly baseK: number;
  readonly lapseKPerM: number;
  readonly basePa: number;
  readonly baseKgM3: number;
  /** Lapse layers: p/pb = (T/Tb)^exponent with exponent = −g0/(R·L). Isothermal: g0/(R·Tb), per metre. */
  readonly exponent: number;
}

function buildLayers(): readonly Layer[] {
  const layers: Layer[] = [];
  let basePa = SEA_LEVEL_PRESSURE_PA;
  ATMOSPHERE_LAYERS.forEach((definition, i) => {
    const baseM = definition.baseAltitudeM;
    const baseK = definition.baseTemperatureK;
    const lapseKPerM = definition.lapseRateKPerM;
    const exponent =
      lapseKPerM === 0
        ? STANDARD_GRAVITY_MS2 / (GAS_CONSTANT_AIR_JKGK * baseK)
        : -STANDARD_GRAVITY_MS2 / (GAS_CONSTANT_AIR_JKGK * lapseKPerM);
    if (i > 0) basePa = pressureInLayer(layers[i - 1], baseM);
    layers.push({ baseM, baseK, lapseKPerM, basePa, baseKgM3: basePa / (GAS_CONSTANT_AIR_JKGK * baseK), exponent });
  });
  return layers;
}

function pressureInLayer(layer: Layer, altitudeM: number): number {
  if (layer.lapseKPerM === 0) return layer.basePa * Math.exp(-layer.exponent * (altitudeM - layer.baseM));
  const temperatureK = layer.baseK + layer.lapseKPerM * (altitudeM - layer.baseM);
  return layer.basePa * Math.pow(temperatureK / layer.baseK, layer.exponent);
}

const LAYERS = buildLayers();
const TOP_LAYER = LAYERS.length - 1;

function layerAt(altitudeM: number): Layer {
  let i = TOP_LAYER;
  while (i > 0 && altitudeM < LAYERS[i].baseM) i--;
  return LAYERS[i];
}

/** @internal ISA temperature, K, at geopotential `altitudeM`. No checks: callers check the range. */
export function isaTemperatureKAtM(altitudeM: number): number {
  const layer = layerAt(altitudeM);
  return layer.baseK + layer.lapseKPerM * (altitudeM - layer.baseM);
}

/** @internal ISA pressure, Pa, at geopotential `altitudeM`. No checks: callers check the range. */
export function isaPressurePaAtM(altitudeM: number): number {
  return pressureInLayer(layerAt(altitudeM), altitudeM);
}

/**
 * @internal Geopotential altitude, m, of ISA pressure `pressurePa` (> 0), the inverse of the
 * barometric formula. Pressures beyond the model's ends continue the end layers; callers check.
 */
export function altitudeMForPressurePa(pressurePa: number): number {
  let i = TOP_LAYER;
  while (i > 0 && pressurePa > LAYERS[i].basePa) i--;
  const layer = LAYERS[i];
  if (layer.lapseKPerM === 0) return layer.baseM - Math.log(pressurePa / layer.basePa) / layer.exponent;
  const temperatureK = layer.baseK * Math.pow(pressurePa / layer.basePa, 1 / layer.exponent);
  return layer.baseM + (temperatureK - layer.baseK) / layer.lapseKPerM;
}

/**
 * @internal Geopotential altitude, m, where the ISA density equals `densityKgM3` (> 0). In a
 * lapse layer ρ/ρb = (T/Tb)^(exponent − 1); in an isothermal one density falls like pressure.
 */
export function altitudeMForDensityKgM3(densityKgM3: number): number {
  let i = TOP_LAYER;
  while (i > 0 && densityKgM3 > LAYERS[i].baseKgM3) i--;
  const layer = LAYERS[i];
  if (layer.lapseKPerM === 0) return layer.baseM - Math.log(densityKgM3 / layer.baseKgM3) / layer.exponent;
  const temperatureK = layer.baseK * Math.pow(densityKgM3 / layer.baseKgM3, 1 / (layer.exponent - 1));
  return layer.baseM + (temperatureK - layer.baseK) / layer.lapseKPerM;
}

/** @internal Throws unless `pressureAltitudeFt` is a finite altitude inside the model. */
export function requirePressureAltitudeFt(
  pressureAltitudeFt: unknown,
  field = 'pressureAltitudeFt',
  label = 'The pressure altitude',
): asserts pressureAltitudeFt is number {
  if (
    typeof pressureAltitudeFt === 'number' &&
    pressureAltitudeFt >= MIN_PRESSURE_ALTITUDE_FT &&
    pressureAltitudeFt <= MAX_PRESSURE_ALTITUDE_FT
  ) {
    return; // the common case, decided without a call (NaN fails the comparisons)
  }
  requireFinite(pressureAltitudeFt, field, label);
  throw new AeroInputError(
    'altitude-out-of-range',
    field,
    `${label} of ${formatNumber(pressureAltitudeFt)} ft is outside the standard atmosphere used here ` +
      `(${formatNumber(MIN_PRESSURE_ALTITUDE_FT)} to ${formatNumber(MAX_PRESSURE_ALTITUDE_FT)} ft).`,
  );
}

/**
 * @internal Throws unless `oatC` is a plausible outside air temperature at `pressureAltitudeFt`
 * (already checked): from −100 °C up to ISA + 55 °C, and never above +70 °C (see constants.ts).
 * When the temperature came from an ISA deviation, pass it so the message can say so; the
 * message is only built on failure, keeping the check free on the hot path.
 */
export function requireOatC(oatC: unknown, pressureAltitudeFt: number, fromIsaDeviationC?: number): asserts oatC is number {
  const field = fromIsaDeviationC === undefined ? 'oatC' : 'isaDeviationC';
  requireFinite(oatC, field, 'The outside air temperature');
  const isaC =
    fromIsaDeviationC === undefined
      ? isaTemperatureKAtM(pressureAltitudeFt * METRES_PER_FOOT) - ZERO_CELSIUS_K
      : oatC - fromIsaDeviationC;
  const maxC = Math.min(MAX_OAT_C, isaC + MAX_ISA_DEVIATION_C);
  if (oatC < MIN_OAT_C || oatC > maxC) {
    const label =
      fromIsaDeviationC === undefined ? 'The outside air temperature' : `The temperature at ISA ${signed(fromIsaDeviationC)} °C`;
    throw new AeroInputError(
      'temperature-out-of-range',
      field,
      `${label} of ${formatNumber(oatC, 1)} °C at ${formatNumber(pressureAltitudeFt)} ft is not plausible; ` +
        `accepted there: ${formatNumber(MIN_OAT_C)} °C to ${formatNumber(maxC, 1)} °C ` +
        `(ISA is ${formatNumber(isaC, 1)} °C; at most ISA +${MAX_ISA_DEVIATION_C} °C and never above +${MAX_OAT_C} °C).`,
    );
  }
}

/** The atmosphere at one pressure altitude. */
export interface IsaConditions {
  /** Outside (static) air temperature, K: ISA plus the deviation. */
  readonly temperatureK: number;
  /** Static pressure, Pa: always that of ISA at the pressure altitude. */
  readonly pressurePa: number;
  /** Air density, kg/m³, from the gas law at this pressure and temperature. */
  readonly densityKgM3: number;
  /** Speed of sound, kt, √(κ·R·T). */
  readonly speedOfSoundKt: number;
  /** Density ratio σ = ρ / ρ0, dimensionless. */
  readonly sigma: number;
}

/**
 * The standard atmosphere at a pressure altitude, optionally on a non-standard day.
 *
 * Method: ICAO Doc 7488/3 and ISO 2533:1975 (layers and barometric formula); the deviation
 * shifts temperature only, so density and the speed of sound follow the actual temperature.
 *
 * @param pressureAltitudeFt geopotential pressure altitude, ft, −16 404 ft (−5 km) to 154 199 ft (47 km)
 * @param isaDeviationC temperature difference from ISA, °C; the resulting temperature must lie in
 *   the envelope of `requireOatC` (−100 °C to ISA +55 °C, never above +70 °C)
 * @example isa(0) // { temperatureK: 288.15, pressurePa: 101325, densityKgM3: 1.225, speedOfSoundKt: 661.48, sigma: 1 }
 * @example isa(36_089.24, 10).temperatureK // 226.65
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `temperature-out-of-range`
 */
export function isa(pressureAltitudeFt: number, isaDeviationC = 0): IsaConditions {
  requirePressureAltitudeFt(pressureAltitudeFt);
  requireFinite(isaDeviationC, 'isaDeviationC', 'The ISA deviation');
  const altitudeM = pressureAltitudeFt * METRES_PER_FOOT;
  const temperatureK = isaTemperatureKAtM(altitudeM) + isaDeviationC;
  requireOatC(temperatureK - ZERO_CELSIUS_K, pressureAltitudeFt, isaDeviationC);
  const pressurePa = isaPressurePaAtM(altitudeM);
  const densityKgM3 = pressurePa / (GAS_CONSTANT_AIR_JKGK * temperatureK);
  return {
    temperatureK,
    pressurePa,
    densityKgM3,
    speedOfSoundKt: Math.sqrt(HEAT_CAPACITY_RATIO * GAS_CONSTANT_AIR_JKGK * temperatureK) / MPS_PER_KNOT,
    sigma: densityKgM3 / SEA_LEVEL_DENSITY_KGM3,
  };
}

function signed(value: number): string {
  return (value >= 0 ? '+' : '') + formatNumber(value, 1);
}

/**
 * Outside air temperature, °C, of a day at `isaDeviationC` from ISA at a pressure altitude: the
 * OAT column of the card's altitude table. Method: ISO 2533:1975 temperature layers.
 *
 * @param pressureAltitudeFt ft, −16 404 to 154 199
 * @param isaDeviationC °C; the result must lie in the temperature envelope (see `isa`)
 * @example isaTemperatureC(10_000, 0) // −4.812
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `temperature-out-of-range`
 */
export function isaTemperatureC(pressureAltitudeFt: number, isaDeviationC = 0): number {
  requirePressureAltitudeFt(pressureAltitudeFt);
  requireFinite(isaDeviationC, 'isaDeviationC', 'The ISA deviation');
  const oatC = isaTemperatureKAtM(pressureAltitudeFt * METRES_PER_FOOT) - ZERO_CELSIUS_K + isaDeviationC;
  requireOatC(oatC, pressureAltitudeFt, isaDeviationC);
  return oatC;
}

/**
 * ISA deviation, °C, of an outside air temperature at a pressure altitude (OAT − T_ISA).
 * Method: ISO 2533:1975 temperature layers.
 *
 * @param pressureAltitudeFt ft, −16 404 to 154 199
 * @param oatC outside air temperature, °C, in the envelope of `isa`
 * @example isaDeviationC(0, 25) // 10
 * @throws AeroInputError `not-a-number`, `altitude-out-of-range`, `temperature-out-of-range`
 */
export function isaDeviationC(pressureAltitudeFt: number, oatC: number): number {
  requirePressureAltitudeFt(pressureAltitudeFt);
  requireOatC(oatC, pressureAltitudeFt);
  return oatC - (isaTemperatureKAtM(pressureAltitudeFt * METRES_PER_FOOT) - ZERO_CELSIUS_K);
}

/**
 * Pressure altitude, ft, of a static pressure: the ISA altitude at which the pressure is
 * `pressureHpa` (e.g. a station pressure, QFE). Method: ISO 2533:1975 barometric formula inverted.
 *
 * @param pressureHpa hPa, from the ISA pressure at 47 km (1.109 hPa) to that at −5 km (1776.9 hPa)
 * @example pressureAltitudeFtForPressureHpa(1013.25) // 0
 * @example pressureAltitudeFtForPressureHpa(696.817) // ≈ 10000
 * @throws AeroInputError `not-a-number`, `pressure-out-of-range`
 */
export function pressureAltitudeFtForPressureHpa(pressureHpa: number): number {
  requireFinite(pressureHpa, 'pressureHpa', 'The pressure');
  const lowestHpa = isaPressurePaAtM(MAX_PRESSURE_ALTITUDE_FT * METRES_PER_FOOT) / 100;
  const highestHpa = isaPressurePaAtM(MIN_PRESSURE_ALTITUDE_FT * METRES_PER_FOOT) / 100;
  if (pressureHpa < lowestHpa || pressureHpa > highestHpa) {
    throw new AeroInputError(
      'pressure-out-of-range',
      'pressureHpa',
      `A pressure of ${formatNumber(pressureHpa, 3)} hPa is outside the standard atmosphere used here ` +
        `(${formatNumber(lowestHpa, 3)} to ${formatNumber(highestHpa, 1)} hPa).`,
    );
  }
  return clampAltitudeFt(altitudeMForPressurePa(pressureHpa * 100) / METRES_PER_FOOT);
}

/** @internal Rounding noise of an inverse at the model's ends must not push a result outside it. */
export function clampAltitudeFt(altitudeFt: number): number {
  return Math.min(MAX_PRESSURE_ALTITUDE_FT, Math.max(MIN_PRESSURE_ALTITUDE_FT, altitudeFt));
}
