/**
 * Speeds the flight manual tabulates against weight, and for takeoff speeds also against
 * pressure altitude and temperature, read by linear (bilinear, trilinear) interpolation
 * between the tabulated points, the way a flight-manual table is read by hand (FAA Pilot's
 * Handbook of Aeronautical Knowledge, "interpolation" of performance tables). Never
 * extrapolated: outside the table the speed is refused with the reason.
 *
 * The shape follows the revision content of product.md: axes `byWeightKg` (always),
 * `byPressureAltitudeFt` and `byOatC` (optional), and `valuesKt` nested in that axis order:
 * `valuesKt[weight][altitude][oat]`, with absent axes simply left out.
 */
import { AeroInputError } from './errors';
import { formatNumber, requireFinite } from './guards';
import { type AxisPosition, locate, mix } from './interpolation';

type Row = readonly number[];
type Grid = readonly Row[];

/** A speed against weight only: `valuesKt[i]` at `byWeightKg[i]`. */
export interface SpeedTableByWeight {
  readonly byWeightKg: readonly number[];
  readonly byPressureAltitudeFt?: undefined;
  readonly byOatC?: undefined;
  readonly valuesKt: Row;
}

/** Against weight and pressure altitude: `valuesKt[weight][altitude]`. */
export interface SpeedTableByWeightAndAltitude {
  readonly byWeightKg: readonly number[];
  readonly byPressureAltitudeFt: readonly number[];
  readonly byOatC?: undefined;
  readonly valuesKt: Grid;
}

/** Against weight and outside air temperature: `valuesKt[weight][oat]`. */
export interface SpeedTableByWeightAndOat {
  readonly byWeightKg: readonly number[];
  readonly byPressureAltitudeFt?: undefined;
  readonly byOatC: readonly number[];
  readonly valuesKt: Grid;
}

/** Against weight, pressure altitude and outside air temperature: `valuesKt[weight][altitude][oat]`. */
export interface SpeedTableByWeightAltitudeAndOat {
  readonly byWeightKg: readonly number[];
  readonly byPressureAltitudeFt: readonly number[];
  readonly byOatC: readonly number[];
  readonly valuesKt: readonly Grid[];
}

/** A tabulated speed, kt. Every axis has at least two entries and increases strictly. */
export type SpeedTable =
  | SpeedTableByWeight
  | SpeedTableByWeightAndAltitude
  | SpeedTableByWeightAndOat
  | SpeedTableByWeightAltitudeAndOat;

/** Where to read a speed table. Inputs for axes the table does not have are ignored. */
export interface SpeedTableQuery {
  /** Weight, kg (the table's weight unit). */
  readonly weightKg: number;
  /** Pressure altitude, ft; required when the table has `byPressureAltitudeFt`. */
  readonly pressureAltitudeFt?: number;
  /** Outside air temperature, °C; required when the table has `byOatC`. */
  readonly oatC?: number;
}

interface Axis {
  readonly key: 'byWeightKg' | 'byPressureAltitudeFt' | 'byOatC';
  readonly queryKey: keyof SpeedTableQuery;
  readonly label: string;
  readonly unit: string;
  readonly values: readonly number[];
}

function invalid(field: string, message: string): AeroInputError {
  return new AeroInputError('invalid-table', field, `The speed table is not usable: ${message}`);
}

function axesOf(table: SpeedTable): Axis[] {
  if (typeof table !== 'object' || table === null) throw invalid('table', 'it is missing.');
  const axes: Axis[] = [
    { key: 'byWeightKg', queryKey: 'weightKg', label: 'weight', unit: 'kg', values: table.byWeightKg },
  ];
  if (table.byPressureAltitudeFt !== undefined) {
    axes.push({
      key: 'byPressureAltitudeFt',
      queryKey: 'pressureAltitudeFt',
      label: 'pressure altitude',
      unit: 'ft',
      values: table.byPressureAltitudeFt,
    });
  }
  if (table.byOatC !== undefined) {
    axes.push({ key: 'byOatC', queryKey: 'oatC', label: 'temperature', unit: '°C', values: table.byOatC });
  }
  for (const axis of axes) checkAxis(axis);
  return axes;
}

function checkAxis({ key, label, values }: Axis): void {
  if (!Array.isArray(values) || values.length < 2) throw invalid(key, `the ${label} axis needs at least two entries.`);
  for (let i = 0; i < values.length; i++) {
    const value: unknown = values[i];
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw invalid(`${key}[${i}]`, `entry ${i + 1} of the ${label} axis is not a number.`);
    }
    if (key === 'byWeightKg' && value <= 0) {
      throw new AeroInputError('weight-not-positive', `${key}[${i}]`, `The speed table is not usable: entry ${i + 1} of the weight axis is not above zero.`);
    }
    if (i > 0 && value <= values[i - 1]) {
      throw invalid(`${key}[${i}]`, `the ${label} axis must increase strictly, but entry ${i + 1} does not exceed entry ${i}.`);
    }
  }
}

function checkValues(values: unknown, axes: readonly Axis[], depth: number, path: string): void {
  const expected = axes[depth].values.length;
  if (!Array.isArray(values) || values.length !== expected) {
    throw invalid(path, `${path} must list ${expected} entries, one per ${axes[depth].label} of the table.`);
  }
  for (let i = 0; i < expected; i++) {
    const entry: unknown = values[i];
    const entryPath = `${path}[${i}]`;
    if (depth < axes.length - 1) checkValues(entry, axes, depth + 1, entryPath);
    else if (typeof entry !== 'number' || !Number.isFinite(entry) || entry <= 0) {
      throw invalid(entryPath, `the speed at ${entryPath} is not a speed above zero.`);
    }
  }
}

/**
 * Checks a speed table and throws with the first problem found: an axis shorter than two
 * entries, not strictly increasing or not numeric, a weight not above zero, `valuesKt` of the
 * wrong shape, or a speed that is not above zero. Use it to validate a revision once.
 *
 * @example checkSpeedTable({ byWeightKg: [900, 1200], valuesKt: [55, 63] }) // passes
 * @throws AeroInputError `invalid-table`, `weight-not-positive`
 */
export function checkSpeedTable(table: SpeedTable): void {
  checkValues(table.valuesKt, axesOf(table), 0, 'valuesKt');
}

function blend(values: unknown, positions: readonly AxisPosition[], depth: number): number {
  const { index, t } = positions[depth];
  const row = values as readonly unknown[];
  if (depth === positions.length - 1) return mix(row[index] as number, row[index + 1] as number, t);
  return mix(blend(row[index], positions, depth + 1), blend(row[index + 1], positions, depth + 1), t);
}

/**
 * Reads a tabulated speed, kt, at a weight (and pressure altitude and temperature when the table
 * has those axes), by linear interpolation along each axis (bilinear on two axes, trilinear on
 * three); the flight-manual table method (FAA PHAK). Never extrapolated.
 *
 * @param table the tabulated speed (see `SpeedTable`; checked as by `checkSpeedTable`)
 * @param query `weightKg` (kg), and `pressureAltitudeFt` (ft) / `oatC` (°C) when the table has
 *   those axes; each must lie within its axis
 * @example interpolateSpeedTableKt({ byWeightKg: [900, 1200], valuesKt: [55, 63] }, { weightKg: 1050 }) // 59
 * @example interpolateSpeedTableKt(
 *   { byWeightKg: [5000, 6000], byPressureAltitudeFt: [0, 4000], byOatC: [0, 40],
 *     valuesKt: [[[100, 102], [101, 104]], [[108, 110], [109, 112]]] },
 *   { weightKg: 5500, pressureAltitudeFt: 2000, oatC: 20 }) // 105.75
 * @throws AeroInputError `invalid-table`, `weight-not-positive`, `missing-input`, `not-a-number`, `outside-table`
 */
export function interpolateSpeedTableKt(table: SpeedTable, query: SpeedTableQuery): number {
  const axes = axesOf(table);
  checkValues(table.valuesKt, axes, 0, 'valuesKt');
  if (typeof query !== 'object' || query === null) {
    throw new AeroInputError('missing-input', 'query', 'Give the weight (and altitude and temperature) to read the table at.');
  }
  const positions = axes.map((axis): AxisPosition => {
    const value = query[axis.queryKey];
    if (value === undefined) {
      throw new AeroInputError('missing-input', axis.queryKey, `This speed table is by ${axis.label}; give the ${axis.label} in ${axis.unit}.`);
    }
    requireFinite(value, axis.queryKey, `The ${axis.label}`);
    if (axis.key === 'byWeightKg' && value <= 0) {
      throw new AeroInputError('weight-not-positive', 'weightKg', `The weight must be above zero; got ${formatNumber(value, 1)} kg.`);
    }
    const position: AxisPosition = { index: 0, t: 0 };
    if (!locate(axis.values.length, (i) => axis.values[i], value, position)) {
      const first = axis.values[0];
      const last = axis.values[axis.values.length - 1];
      throw new AeroInputError(
        'outside-table',
        axis.queryKey,
        `A ${axis.label} of ${formatNumber(value, 1)} ${axis.unit} is outside the flight manual's table ` +
          `(${formatNumber(first, 1)} to ${formatNumber(last, 1)} ${axis.unit}); the speed cannot be given there.`,
      );
    }
    return position;
  });
  return blend(table.valuesKt, positions, 0);
}
