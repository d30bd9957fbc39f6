/**
 * Reading a speed-table CSV into its header and rows: one kind of line break (so line numbers
 * match an editor's), records by papaparse with the line each starts on (quoted fields may span
 * lines), the header's columns and stated units, and rows of the header's width. The file as a
 * whole is refused when it cannot be a table (not text, empty, a quote not closed, a column
 * twice, too many rows); a row's problem is reported, not thrown.
 */
import Papa from 'papaparse';
import { assertFieldsWithinBounds, assertHeaderWithinBounds } from './csv-bounds';
import { unusable, type CsvRowError } from './csv-problems';
import { canonicalColumn, readCsvUnits, type CsvUnits } from './csv-units';
import { LAYOUT_HELP, type CsvRow } from './speed-table-upload';

export const MAX_CSV_ROWS = 5000;

/** The header and rows of a file, before any layout reads them. */
export interface CsvTable {
  /** The header's column names, trimmed and in lower case. */
  columns: string[];
  /** The same, a column in another unit written as its kt/kg twin (`ias_mph` → `ias_kt`). */
  generic: string[];
  units: CsvUnits;
  rows: CsvRow[];
  /** Rows whose width differs from the header's. */
  errors: CsvRowError[];
  /** Lines of those rows, which the layouts skip. */
  badShape: Set<number>;
}

/** `input` read into header and rows; throws `csvFileError` when it is no usable table. */
export function readCsvTable(input: string): CsvTable {
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
  return { columns, generic, units, rows, errors, badShape };
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
