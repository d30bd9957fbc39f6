/**
 * The problems of an uploaded speed-table CSV: a row's problem (`CsvRowError`, reported with
 * the preview) and the error that refuses the file as a whole. `csvFileError` is the one place
 * the parser makes that error (a `DomainError` of kind refused; the error middleware answers 422).
 */
import { DomainError } from '../errors/domain-error';

export interface CsvRowError {
  /** 1-based line of the file; 1 is the header. */
  line: number;
  /** The column's name as in the header, or null when the whole row or group is meant. */
  column: string | null;
  reason: string;
}

/** Why a file as a whole is refused: not a usable table, or larger than an upload may be. */
export type CsvFileProblem = 'unusable_csv' | 'csv_too_large';

/** The error that refuses the whole file with `message` (shown beside the file field). */
export function csvFileError(code: CsvFileProblem, message: string): Error {
  return new DomainError('refused', code, message, { file: message });
}

/** A file that is not a usable speed table. */
export function unusable(message: string): Error {
  return csvFileError('unusable_csv', message);
}

export function sortErrors(errors: CsvRowError[]): CsvRowError[] {
  return [...errors].sort((a, b) => a.line - b.line);
}
