/**
 * The position-error layout, `configuration_key,ias_kt,cas_kt`: one calibration point a row,
 * each configuration's rows from the lowest IAS up, IAS and CAS rising strictly, at least two
 * points, a correction of at most 30 kt (more is likelier swapped columns). Compared in the
 * file's unit, stored in kt.
 */
import { CANONICAL_UNITS, UNIT_SYMBOLS, fromCanonical, toCanonical, type StatedUnits } from '@shared/speed-book/stated-units';
import { CONFIGURATION_KEY, configurationKeyReason, number } from './csv-cells';
import { sortErrors, type CsvRowError } from './csv-problems';
import type { CsvUnits } from './csv-units';
import type { CsvRow, PositionErrorPoint, PositionErrorUpload } from './speed-table-upload';

export const POSITION_ERROR_COLUMNS = ['configuration_key', 'ias_kt', 'cas_kt'];
/** A position error larger than this is more likely swapped columns than a real correction. */
export const MAX_POSITION_ERROR_KT = 30;

/** The configurations of a position-error file; a configuration with any problem is left out. */
export function parsePositionError(rows: CsvRow[], badShape: Set<number>, errors: CsvRowError[], units: CsvUnits): Pick<PositionErrorUpload, 'configurations' | 'errors'> {
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
