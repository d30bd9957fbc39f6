/**
 * Speedwright's two CSV layouts for speed data, parsed into the shapes of revision content.
 * The layouts are our own; the header row names the columns (any order, any case).
 *
 * **Position-error table** — `configuration_key,ias_kt,cas_kt`
 * One row per calibration point. Rows of one configuration go from the lowest IAS up; both IAS
 * and CAS must rise strictly. A file may hold several configurations.
 * ```
 * configuration_key,ias_kt,cas_kt
 * clean,60,63
 * clean,80,81
 * landing-flap,50,54
 * landing-flap,70,71
 * ```
 * → `configurations: [{ key: 'clean', positionError: [{ iasKt: 60, casKt: 63 }, …] }, …]`
 *
 * **Tabulated speed** — `speed_code,configuration_key,weight_kg[,pressure_altitude_ft][,oat_c],value_kt`
 * One row per grid point of a speed that the flight manual tabulates against weight, and
 * optionally pressure altitude and OAT. Within one speed (code and configuration), rows are
 * sorted by weight, then pressure altitude, then OAT, each rising; every combination of the
 * axis values must be present exactly once.
 * ```
 * speed_code,configuration_key,weight_kg,value_kt
 * VR,takeoff-flap,900,52
 * VR,takeoff-flap,1100,57
 * ```
 * → `speeds: [{ code: 'VR', configurationKey: 'takeoff-flap', table: { byWeightKg: [900, 1100], valuesKt: [52, 57] } }]`
 * With altitude and temperature, `valuesKt` nests weight outermost: `valuesKt[w][p][t]`.
 *
 * **Units.** Every weight and speed column names its unit, and the figures are read in it as the
 * flight manual prints them: `weight_kg` or `weight_lb`; `ias_kt`, `ias_mph` or `ias_kmh`, and
 * likewise `cas_…` and `value_…`. One file gives each quantity in one unit (`ias_mph` beside
 * `cas_kt` is refused, naming line 1 and the column; see `csv-units.ts`). Checks and their
 * sentences use the file's unit; the parsed tables are converted to kt and kg (exact factors,
 * `shared/speed-book/stated-units.ts`), `rows` keep the figures as written, and `statedUnits`
 * names the units found, so the preview shows the file as the manual prints it.
 * ```
 * speed_code,configuration_key,weight_lb,value_mph
 * VR,takeoff-flap,1900,60
 * VR,takeoff-flap,2400,66
 * ```
 * → `byWeightKg: [861.8…, 1088.6…], valuesKt: [52.1…, 57.3…]`, `statedUnits: { weight: 'lb', speed: 'mph' }`
 *
 * Numbers use a point as the decimal separator. Every problem is reported as
 * `{ line, column, reason }` (line 1 is the header); a group with any problem is left out of
 * the parsed structure so that nothing half-checked reaches a draft.
 */
import { configurationKeySchema, speedCodeSchema } from '../../shared/speed-book/content-shape';
import { CANONICAL_UNITS, UNIT_SYMBOLS, fromCanonical, toCanonical, type StatedUnits } from '../../shared/speed-book/stated-units';
import Papa from 'papaparse';
import { DomainError } from '../errors/domain-error';
import { canonicalColumn, readCsvUnits, unitColumn, type CsvUnits } from './csv-units';
import { assertFieldsWithinBounds, assertGridWithinBounds, assertHeaderWithinBounds } from './csv-bounds';

export interface CsvRowError {
  /** 1-based line of the file; 1 is the header. */
  line: number;
  /** The column's name as in the header, or null when the whole row or group is meant. */
  column: string | null;
  reason: string;
}

export interface CsvRow {
  line: number;
  values: Record<string, string>;
}

export interface PositionErrorPoint {
  iasKt: number;
  casKt: number;
}

export interface TabulatedSpeedTable {
  byWeightKg: number[];
  byPressureAltitudeFt?: number[];
  byOatC?: number[];
  /** Nested weight → pressure altitude → OAT, as many levels as there are axes. */
  valuesKt: NestedNumbers;
}
export type NestedNumbers = number[] | NestedNumbers[];

interface UploadBase {
  columns: string[];
  rows: CsvRow[];
  errors: CsvRowError[];
  /** The units the header states (rows keep the figures as written; the parsed tables are in kt and kg). */
  statedUnits: CsvUnits['detected'];
}

export interface PositionErrorUpload extends UploadBase {
  layout: 'position-error';
  configurations: { key: string; positionError: PositionErrorPoint[] }[];
}

export interface TabulatedSpeedUpload extends UploadBase {
  layout: 'tabulated-speed';
  speeds: { code: string; configurationKey: string; table: TabulatedSpeedTable }[];
}

export type SpeedTableUpload = PositionErrorUpload | TabulatedSpeedUpload;

export const MAX_CSV_ROWS = 5000;
/** More missing grid points than this per speed are summed up in one line. */
const MAX_MISSING_LISTED = 10;
/** A position error larger than this is more likely swapped columns than a real correction. */
export const MAX_POSITION_ERROR_KT = 30;

interface Range {
  min: number;
  max: number;
  unit: string;
  what: string;
}
const RANGES = {
  ias_kt: { min: 20, max: 600, unit: 'kt', what: 'an IAS' },
  cas_kt: { min: 20, max: 600, unit: 'kt', what: 'a CAS' },
  weight_kg: { min: 100, max: 400_000, unit: 'kg', what: 'a weight' },
  pressure_altitude_ft: { min: -2000, max: 60_000, unit: 'ft', what: 'a pressure altitude' },
  oat_c: { min: -90, max: 60, unit: '°C', what: 'an OAT' },
  value_kt: { min: 10, max: 700, unit: 'kt', what: 'a speed' },
} satisfies Record<string, Range>;

const POSITION_ERROR_COLUMNS = ['configuration_key', 'ias_kt', 'cas_kt'];
const TABULATED_REQUIRED = ['speed_code', 'configuration_key', 'weight_kg', 'value_kt'];
const TABULATED_OPTIONAL = ['pressure_altitude_ft', 'oat_c'];
// Keys and codes follow the revision content's own rules, so a preview that passes here is
// not refused later by the content schema.
const CONFIGURATION_KEY = { test: (key: string) => configurationKeySchema.safeParse(key).success };
const SPEED_CODE = { test: (code: string) => speedCodeSchema.safeParse(code).success };

export const LAYOUT_HELP =
  'Use one of the two layouts: a position-error table with the columns configuration_key,ias_kt,cas_kt, ' +
  'or a tabulated speed with speed_code,configuration_key,weight_kg,value_kt (and optionally pressure_altitude_ft and oat_c). ' +
  'Weights may be given in lb (weight_lb) and speeds in mph or km/h (ias_mph, cas_kmh, value_mph…), one unit per quantity.';

/** Parses an uploaded CSV. Throws a 422 when the file as a whole is unusable; row problems come back in `errors`. */
export function parseSpeedTableCsv(input: string): SpeedTableUpload {
  // One kind of line break, so that line numbers match what an editor shows.
  const text = input.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  if (text.includes('\u0000')) throw unusable('This file is not text. Save the table as CSV (comma-separated values) and upload that.');
  const records = readRecords(text);
  const headerIndex = records.findIndex((record) => record.fields.some((field) => field.trim() !== ''));
  if (headerIndex < 0) throw unusable(`The file is empty. ${LAYOUT_HELP}`);
  const header = records[headerIndex]!;
  assertHeaderWithinBounds(header.fields);
  assertFieldsWithinBounds(header.line, header.fields);
  const columns = header.fields.map((field) => field.trim().toLowerCase());
  const duplicate = columns.find((column, index) => columns.indexOf(column) !== index);
  if (duplicate) throw unusable(`The column "${duplicate}" appears twice in the header.`);
  const units = readCsvUnits(columns, header.line);
  // The layouts below are written in kt and kg; a column in another unit stands in for its kt/kg twin.
  const generic = columns.map(canonicalColumn);

  const errors: CsvRowError[] = [];
  const rows: CsvRow[] = [];
  for (const record of records.slice(headerIndex + 1)) {
    if (record.fields.every((field) => field.trim() === '')) continue;
    if (rows.length >= MAX_CSV_ROWS) throw unusable(`The file has more than ${MAX_CSV_ROWS} rows; split it into several uploads.`);
    assertFieldsWithinBounds(record.line, record.fields);
    const values: Record<string, string> = {};
    columns.forEach((column, index) => (values[column] = (record.fields[index] ?? '').trim()));
    rows.push({ line: record.line, values });
    if (record.fields.length !== columns.length) {
      errors.push({
        line: record.line,
        column: null,
        reason: `This row has ${record.fields.length} value${record.fields.length === 1 ? '' : 's'}; the header has ${columns.length} columns.`,
      });
    }
  }
  const badShape = new Set(errors.map((error) => error.line));

  if (sameSet(generic, POSITION_ERROR_COLUMNS)) {
    return { layout: 'position-error', columns, rows, statedUnits: units.detected, ...parsePositionError(rows, badShape, errors, units) };
  }
  const optional = generic.filter((column) => !TABULATED_REQUIRED.includes(column));
  if (TABULATED_REQUIRED.every((column) => generic.includes(column)) && optional.every((column) => TABULATED_OPTIONAL.includes(column))) {
    return { layout: 'tabulated-speed', columns, rows, statedUnits: units.detected, ...parseTabulated(rows, badShape, errors, columns, units) };
  }
  const unknown = columns.filter((_, i) => ![...POSITION_ERROR_COLUMNS, ...TABULATED_REQUIRED, ...TABULATED_OPTIONAL].includes(generic[i]!));
  throw unusable(
    `${unknown.length ? `The header has columns this upload does not know (${unknown.map((c) => `"${c}"`).join(', ')}). ` : 'The header does not match a layout. '}${LAYOUT_HELP}`,
  );
}

function parsePositionError(rows: CsvRow[], badShape: Set<number>, errors: CsvRowError[], units: CsvUnits): Pick<PositionErrorUpload, 'configurations' | 'errors'> {
  // Figures are compared in the file's own unit (order does not change with a unit) and stored in kt.
  const iasColumn = units.columns.ias!;
  const casColumn = units.columns.cas!;
  const stated: StatedUnits = { ...CANONICAL_UNITS, speed: units.detected.speed ?? 'kt' };
  const kt = UNIT_SYMBOLS[stated.speed];
  const maxError = stated.speed === 'kt' ? `${MAX_POSITION_ERROR_KT} kt` : `${Math.floor(fromCanonical(MAX_POSITION_ERROR_KT, 'speed', stated))} ${kt} (${MAX_POSITION_ERROR_KT} kt)`;
  const groups = new Map<string, { firstLine: number; points: (PositionErrorPoint & { line: number })[]; bad: boolean }>();
  for (const row of rows) {
    if (badShape.has(row.line)) continue;
    const key = row.values['configuration_key']!;
    if (!CONFIGURATION_KEY.test(key)) {
      errors.push({ line: row.line, column: 'configuration_key', reason: configurationKeyReason(key) });
      continue;
    }
    const group = groups.get(key) ?? { firstLine: row.line, points: [], bad: false };
    groups.set(key, group);
    const iasKt = number(row, iasColumn, errors);
    const casKt = number(row, casColumn, errors);
    if (iasKt === undefined || casKt === undefined) {
      group.bad = true;
      continue;
    }
    if (Math.abs(toCanonical(casKt - iasKt, 'speed', stated)) > MAX_POSITION_ERROR_KT) {
      errors.push({
        line: row.line,
        column: casColumn,
        reason: `CAS ${casKt} ${kt} differs from IAS ${iasKt} ${kt} by more than ${maxError}; check that the columns are in the right order.`,
      });
      group.bad = true;
      continue;
    }
    const previous = group.points.at(-1);
    if (previous && iasKt === previous.iasKt) {
      errors.push({ line: row.line, column: iasColumn, reason: `IAS ${iasKt} ${kt} of "${key}" is already on line ${previous.line}; each IAS appears once.` });
      group.bad = true;
      continue;
    }
    if (previous && iasKt < previous.iasKt) {
      errors.push({
        line: row.line,
        column: iasColumn,
        reason: `IAS must rise down the table: ${iasKt} ${kt} comes after ${previous.iasKt} ${kt} (line ${previous.line}) for "${key}".`,
      });
      group.bad = true;
      continue;
    }
    if (previous && casKt <= previous.casKt) {
      errors.push({
        line: row.line,
        column: casColumn,
        reason: `CAS must rise with IAS: ${casKt} ${kt} is not above ${previous.casKt} ${kt} on line ${previous.line} for "${key}".`,
      });
      group.bad = true;
      continue;
    }
    group.points.push({ iasKt, casKt, line: row.line });
  }
  const configurations: PositionErrorUpload['configurations'] = [];
  for (const [key, group] of groups) {
    if (!group.bad && group.points.length < 2) {
      errors.push({ line: group.firstLine, column: null, reason: `"${key}" needs at least two rows so that values between them can be interpolated.` });
      continue;
    }
    if (!group.bad) {
      const positionError = group.points.map(({ iasKt, casKt }) => ({ iasKt: toCanonical(iasKt, 'speed', stated), casKt: toCanonical(casKt, 'speed', stated) }));
      configurations.push({ key, positionError });
    }
  }
  return { configurations, errors: sortErrors(errors) };
}

interface GridPoint {
  line: number;
  axes: number[];
  valueKt: number;
}

function parseTabulated(
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
    const build = (depth: number, prefix: number[]): NestedNumbers => {
      const values = axisValues[depth]!;
      if (depth === axisValues.length - 1) {
        return values.map((value) => {
          const axes = [...prefix, value];
          const found = byKey.get(axes.join('|'));
          if (found === undefined) missing.push(axes);
          return found ?? Number.NaN;
        });
      }
      return values.map((value) => build(depth + 1, [...prefix, value])) as NestedNumbers;
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
      valuesKt: inKnots(valuesKt, stated),
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
function inKnots(values: NestedNumbers, units: StatedUnits): NestedNumbers {
  return (values as (number | NestedNumbers)[]).map((value) => (typeof value === 'number' ? toCanonical(value, 'speed', units) : inKnots(value, units))) as NestedNumbers;
}

/** The accepted range of a column in its own unit: the kt/kg range converted, kept inside it. */
function rangeOf(column: string): Range {
  const range = RANGES[canonicalColumn(column) as keyof typeof RANGES];
  const found = unitColumn(column);
  if (!found || found.unit === 'kt' || found.unit === 'kg') return range;
  const quantity = found.role === 'weight' ? 'weight' : 'speed';
  const units = { ...CANONICAL_UNITS, [quantity]: found.unit } as StatedUnits;
  return {
    ...range,
    unit: UNIT_SYMBOLS[found.unit],
    min: Math.ceil(fromCanonical(range.min, quantity, units)),
    max: Math.floor(fromCanonical(range.max, quantity, units)),
  };
}

function number(row: CsvRow, column: string, errors: CsvRowError[]): number | undefined {
  const raw = row.values[column] ?? '';
  const range = rangeOf(column);
  const fail = (reason: string) => {
    errors.push({ line: row.line, column, reason });
    return undefined;
  };
  if (raw === '') return fail(`Enter ${range.what} in ${range.unit}; this cell is empty.`);
  if (/^[+-]?\d+,\d+$/.test(raw)) return fail(`Use a point as the decimal separator: ${raw.replace(',', '.')}, not ${raw}.`);
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(raw)) return fail(`"${raw}" is not a number; enter ${range.what} in ${range.unit}.`);
  const value = Number(raw);
  if (value < range.min || value > range.max) {
    return fail(`${value} ${range.unit} is outside ${range.min} to ${range.max} ${range.unit}, the range accepted for ${range.what}.`);
  }
  return value;
}

interface CsvRecord {
  line: number;
  fields: string[];
}

/** Every record with the line it starts on (quoted fields may span lines, so rows and lines can differ). */
function readRecords(text: string): CsvRecord[] {
  const records: CsvRecord[] = [];
  let line = 1;
  let consumed = 0;
  let quoteProblem: number | undefined;
  Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: false,
    newline: '\n',
    delimitersToGuess: [',', ';', '\t'],
    step: (result) => {
      const end = result.meta.cursor;
      if (result.errors.some((error) => error.type === 'Quotes')) quoteProblem ??= line;
      records.push({ line, fields: result.data });
      line += countNewlines(text, consumed, end);
      consumed = end;
    },
  });
  if (quoteProblem !== undefined) throw unusable(`A quoted value on line ${quoteProblem} is not closed. Check the quotation marks.`);
  return records;
}

function countNewlines(text: string, from: number, to: number): number {
  let count = 0;
  // papaparse's cursor stands at the start of the next record, after this one's line break.
  for (let i = text.indexOf('\n', from); i !== -1 && i < to; i = text.indexOf('\n', i + 1)) count++;
  return count;
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

function configurationKeyReason(key: string): string {
  return key
    ? `"${key}" is not a configuration key: ${schemaMessage(configurationKeySchema, key)}`
    : 'Enter the configuration key, e.g. clean or landing-flap.';
}

function schemaMessage(schema: typeof configurationKeySchema | typeof speedCodeSchema, value: string): string {
  const result = schema.safeParse(value);
  return result.success ? '' : (result.error.issues[0]?.message ?? '');
}

function sameSet(a: string[], b: string[]): boolean {
  return a.length === b.length && b.every((item) => a.includes(item));
}

function sortErrors(errors: CsvRowError[]): CsvRowError[] {
  return [...errors].sort((a, b) => a.line - b.line);
}

function unusable(message: string): DomainError {
  return new DomainError('refused', 'unusable_csv', message, { file: message });
}
