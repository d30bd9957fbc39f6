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
 *
 * Beside it, one concern a file: reading the file into header and rows (csv-records.ts), a
 * cell (csv-cells.ts), the two layouts (csv-position-error.ts, csv-tabulated.ts), units
 * (csv-units.ts), bounds (csv-bounds.ts), the problems and the one file-level error
 * (csv-problems.ts), and the result's types (speed-table-upload.ts).
 */
import { unusable } from './csv-problems';
import { readCsvTable } from './csv-records';
import { parsePositionError, POSITION_ERROR_COLUMNS } from './csv-position-error';
import { parseTabulated, TABULATED_OPTIONAL, TABULATED_REQUIRED } from './csv-tabulated';
import { LAYOUT_HELP, type SpeedTableUpload } from './speed-table-upload';

// The public names of the parser, as before the split.
export type { CsvRowError } from './csv-problems';
export { MAX_CSV_ROWS } from './csv-records';
export { MAX_POSITION_ERROR_KT } from './csv-position-error';
export {
  LAYOUT_HELP,
  type CsvRow,
  type NestedNumbers,
  type PositionErrorPoint,
  type PositionErrorUpload,
  type SpeedTableUpload,
  type TabulatedSpeedTable,
  type TabulatedSpeedUpload,
} from './speed-table-upload';

/** Parses an uploaded CSV. Throws a 422 when the file as a whole is unusable; row problems come back in `errors`. */
export function parseSpeedTableCsv(input: string): SpeedTableUpload {
  const { columns, generic, units, rows, errors, badShape } = readCsvTable(input);

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

function sameSet(a: string[], b: string[]): boolean {
  return a.length === b.length && b.every((item) => a.includes(item));
}
