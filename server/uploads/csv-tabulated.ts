/**
 * The tabulated-speed layout, `speed_code,configuration_key,weight_kg[,pressure_altitude_ft][,oat_c],value_kt`:
 * one grid point a row, a speed's rows sorted by weight, then altitude, then OAT, each rising,
 * every combination present once, at least two values an axis. Built into the nested values
 * of the revision content (weight outermost), in kg and kt.
 */
import { UNIT_SYMBOLS, toCanonical, type StatedUnits } from '@shared/speed-book/stated-units';
import { speedCodeSchema } from '@shared/speed-book/content-shape';
import { assertGridWithinBounds } from './csv-bounds';
import { CONFIGURATION_KEY, SPEED_CODE, configurationKeyReason, number, schemaMessage } from './csv-cells';
import { sortErrors, type CsvRowError } from './csv-problems';
import type { CsvUnits } from './csv-units';
import type { CsvRow, NestedNumbers, TabulatedSpeedTable, TabulatedSpeedUpload } from './speed-table-upload';

export const TABULATED_REQUIRED = ['speed_code', 'configuration_key', 'weight_kg', 'value_kt'];
export const TABULATED_OPTIONAL = ['pressure_altitude_ft', 'oat_c'];
/** More missing grid points than this per speed are summed up in one line. */
const MAX_MISSING_LISTED = 10;

/** Values nested as deep as the axes, while a grid is built (the content schema's type is fixed at three levels). */
type Grid = number[] | Grid[];

interface GridPoint {
  line: number;
  axes: number[];
  valueKt: number;
}

/** The speeds of a tabulated file; a speed with any problem is left out. */
export function parseTabulated(
  rows: CsvRow[],
  badShape: Set<number>,
  errors: CsvRowError[],
  columns: string[],
  units: CsvUnits,
): Pick<TabulatedSpeedUpload, 'speeds' | 'errors'> {
  const weightColumn = units.columns.weight!;
  const valueColumn = units.columns.value!;
  const stated: StatedUnits = { weight: units.detected.weight ?? 'kg', speed: units.detected.speed ?? 'kt' };
  const axisColumns = [weightColumn, ...TABULATED_OPTIONAL.filter((column) => columns.includes(column))];
  const groups = new Map<string, { code: string; configurationKey: string; firstLine: number; points: GridPoint[]; bad: boolean }>();
  for (const row of rows) {
    if (badShape.has(row.line)) continue;
    const code = row.values['speed_code']!;
    const configurationKey = row.values['configuration_key']!;
    let identified = true;
    if (!SPEED_CODE.test(code)) {
      errors.push({ line: row.line, column: 'speed_code', reason: code ? `"${code}" is not a speed code: ${schemaMessage(speedCodeSchema, code)}` : 'Enter the speed code, e.g. VR.' });
      identified = false;
    }
    if (!CONFIGURATION_KEY.test(configurationKey)) {
      errors.push({ line: row.line, column: 'configuration_key', reason: configurationKeyReason(configurationKey) });
      identified = false;
    }
    if (!identified) continue;
    const id = `${code}\u0000${configurationKey}`;
    const group = groups.get(id) ?? { code, configurationKey, firstLine: row.line, points: [], bad: false };
    groups.set(id, group);
    const axes = axisColumns.map((column) => number(row, column, errors));
    const valueKt = number(row, valueColumn, errors);
    if (axes.some((axis) => axis === undefined) || valueKt === undefined) {
      group.bad = true;
      continue;
    }
    const point: GridPoint = { line: row.line, axes: axes as number[], valueKt };
    const previous = group.points.at(-1);
    if (previous) {
      const order = compareAxes(point.axes, previous.axes);
      if (order === 0) {
        errors.push({ line: row.line, column: null, reason: `${describePoint(group.code, axisColumns, point.axes, stated)} is already on line ${previous.line}; each grid point appears once.` });
        group.bad = true;
        continue;
      }
      if (order < 0) {
        const column = axisColumns[point.axes.findIndex((value, index) => value !== previous.axes[index])]!;
        errors.push({
          line: row.line,
          column,
          reason: `Rows of ${group.code} must be sorted by weight, then pressure altitude, then OAT, each rising; this row comes after line ${previous.line} but belongs before it.`,
        });
        group.bad = true;
        continue;
      }
    }
    group.points.push(point);
  }

  const speeds: TabulatedSpeedUpload['speeds'] = [];
  for (const group of groups.values()) {
    if (group.bad) continue;
    const axisValues = axisColumns.map((_, index) => [...new Set(group.points.map((point) => point.axes[index]!))].sort((a, b) => a - b));
    const short = axisColumns.findIndex((_, index) => axisValues[index]!.length < 2);
    if (short >= 0) {
      errors.push({
        line: group.firstLine,
        column: axisColumns[short]!,
        reason: `${group.code} (${group.configurationKey}) needs at least two values of ${axisColumns[short]} so that values between them can be interpolated.`,
      });
      continue;
    }
    assertGridWithinBounds(group.code, group.configurationKey, axisColumns, axisValues, group.points.length);
    const byKey = new Map(group.points.map((point) => [point.axes.join('|'), point.valueKt]));
    const missing: number[][] = [];
    const build = (depth: number, prefix: number[]): Grid => {
      const values = axisValues[depth]!;
      if (depth === axisValues.length - 1) {
        return values.map((value) => {
          const axes = [...prefix, value];
          const found = byKey.get(axes.join('|'));
          if (found === undefined) missing.push(axes);
          return found ?? Number.NaN;
        });
      }
      return values.map((value) => build(depth + 1, [...prefix, value])) as Grid;
    };
    const valuesKt = build(0, []);
    if (missing.length) {
      for (const axes of missing.slice(0, MAX_MISSING_LISTED)) {
        errors.push({
          line: group.firstLine,
          column: valueColumn,
          reason: `No row for ${describePoint(group.code, axisColumns, axes, stated)}: every combination of the table's weights, altitudes and temperatures needs one.`,
        });
      }
      if (missing.length > MAX_MISSING_LISTED) {
        errors.push({ line: group.firstLine, column: valueColumn, reason: `…and ${missing.length - MAX_MISSING_LISTED} more missing grid points of ${group.code}.` });
      }
      continue;
    }
    const table: TabulatedSpeedTable = {
      byWeightKg: axisValues[0]!.map((weight) => toCanonical(weight, 'weight', stated)),
      valuesKt: inKnots(valuesKt, stated) as NestedNumbers,
    };
    const altitudeIndex = axisColumns.indexOf('pressure_altitude_ft');
    const oatIndex = axisColumns.indexOf('oat_c');
    if (altitudeIndex > 0) table.byPressureAltitudeFt = axisValues[altitudeIndex]!;
    if (oatIndex > 0) table.byOatC = axisValues[oatIndex]!;
    speeds.push({ code: group.code, configurationKey: group.configurationKey, table });
  }
  return { speeds, errors: sortErrors(errors) };
}

/** A tabulated speed's nested values, stated in `units`, in kt. */
function inKnots(values: Grid, units: StatedUnits): Grid {
  return (values as (number | Grid)[]).map((value) => (typeof value === 'number' ? toCanonical(value, 'speed', units) : inKnots(value, units))) as Grid;
}

function compareAxes(a: number[], b: number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]! ? -1 : 1;
  return 0;
}

function describePoint(code: string, columns: readonly string[], axes: number[], units: StatedUnits): string {
  const parts = axes.map((value, index) => {
    const column = columns[index];
    return index === 0 ? `${value} ${UNIT_SYMBOLS[units.weight]}` : column === 'pressure_altitude_ft' ? `${value} ft` : `${value} °C`;
  });
  return `${code} at ${parts.join(', ')}`;
}
