/**
 * Bounds that keep the work of one CSV upload small whatever the file holds (security issue
 * 12, finding 2): a header and cells no longer than the layouts need, and a tabulated speed's
 * grid refused before it is built when its axes would make more points than a table may hold.
 * The file itself is at most 256 kB and 5,000 rows (uploads.routes.ts, speed-table-csv.ts).
 */
import { DomainError } from '../errors/domain-error';

/** Values one axis of a tabulated speed may have; flight manuals tabulate a few dozen at most (from memory). */
export const MAX_AXIS_VALUES = 100;
/** Grid points (weights × altitudes × OATs) of one tabulated speed: one row each, so the row limit. */
export const MAX_GRID_POINTS = 5000;
/** Columns of a header: the layouts have at most six. */
export const MAX_CSV_COLUMNS = 20;
/** Characters of one cell: the longest key or number of the layouts is far shorter. */
export const MAX_CSV_FIELD_CHARS = 100;

const AXIS_WORDS: Record<string, string> = { weight_kg: 'weights', pressure_altitude_ft: 'pressure altitudes', oat_c: 'OATs' };

const tooBig = (message: string) => new DomainError('refused', 'csv_too_large', message, { file: message });

/** 422 when the header has more columns than any layout could use. */
export function assertHeaderWithinBounds(columns: readonly string[]): void {
  if (columns.length > MAX_CSV_COLUMNS) {
    throw tooBig(`The header has ${columns.length} columns; the speed-table layouts use at most 6. Check the separator and the header row.`);
  }
}

/** 422 when a row has a cell longer than any value of the layouts. */
export function assertFieldsWithinBounds(line: number, fields: readonly string[]): void {
  const index = fields.findIndex((field) => field.length > MAX_CSV_FIELD_CHARS);
  if (index >= 0) {
    throw tooBig(`Line ${line}, column ${index + 1} holds ${fields[index]!.length.toLocaleString('en-US')} characters; no value of these layouts is longer than ${MAX_CSV_FIELD_CHARS}.`);
  }
}

/**
 * 422 before any grid is built when the distinct values of a speed's axes would need more grid
 * points than a table holds, or an axis has more values than a table may: the sentence says how
 * many points the table would need and how many rows the file has for it.
 */
export function assertGridWithinBounds(code: string, configurationKey: string, axisColumns: readonly string[], axisValues: readonly (readonly number[])[], rowCount: number): void {
  let needed = 1;
  for (const values of axisValues) needed *= values.length;
  const crowded = axisValues.findIndex((values) => values.length > MAX_AXIS_VALUES);
  if (needed <= MAX_GRID_POINTS && crowded < 0) return;
  const axes = axisValues.map((values, index) => `${values.length} ${AXIS_WORDS[axisColumns[index]!] ?? axisColumns[index]}`).join(' × ');
  const limit =
    crowded >= 0
      ? `an axis holds at most ${MAX_AXIS_VALUES} values`
      : `a table holds at most ${MAX_GRID_POINTS.toLocaleString('en-US')} grid points`;
  throw tooBig(
    `${code} (${configurationKey}) would need ${needed.toLocaleString('en-US')} grid points (${axes}), one row each, and the file has ${rowCount.toLocaleString('en-US')} rows for it; ${limit}. ` +
      'Every weight must be tabulated at the same altitudes and temperatures.',
  );
}
