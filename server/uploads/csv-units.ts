/**
 * The units a speed-table CSV states in its header. Each weight or speed column carries its
 * unit in its name (our own naming): `weight_kg` or `weight_lb`; `ias_kt`, `ias_mph`, `ias_kmh`
 * and likewise `cas_…` and `value_…`. One file states one unit per quantity; a file that mixes
 * two (say `ias_mph` with `cas_kt`, or `weight_kg` beside `weight_lb`) is refused, naming the
 * header line and the column. Figures are read in the stated unit and stored in kg and kt by
 * `shared/speed-book/stated-units.ts` (exact factors of the 1959 yard and pound agreement and
 * the international nautical mile).
 */
import { STATED_SPEED_UNITS, STATED_WEIGHT_UNITS } from '@shared/speed-book/content-shape';
import { UNIT_SYMBOLS, type StatedSpeedUnit, type StatedWeightUnit } from '@shared/speed-book/stated-units';
import { csvFileError } from './csv-problems';

/** The columns that hold a figure with a unit, by what they mean. */
export type UnitRole = 'ias' | 'cas' | 'weight' | 'value';
const SPEED_ROLES = ['ias', 'cas', 'value'] as const;

export interface CsvUnits {
  /** The actual column name of each role present in the header, such as `ias: 'ias_mph'`. */
  columns: Partial<Record<UnitRole, string>>;
  /** The units the file states; a quantity the layout does not have is left out. */
  detected: { speed?: StatedSpeedUnit; weight?: StatedWeightUnit };
}

/** `ias_mph` → { role: 'ias', unit: 'mph' }; a name that is not a unit-bearing column → null. */
export function unitColumn(name: string): { role: UnitRole; unit: StatedSpeedUnit | StatedWeightUnit } | null {
  const match = /^(ias|cas|value|weight)_([a-z]+)$/.exec(name);
  if (!match) return null;
  const role = match[1] as UnitRole;
  const unit = match[2]!;
  if (role === 'weight') return (STATED_WEIGHT_UNITS as readonly string[]).includes(unit) ? { role, unit: unit as StatedWeightUnit } : null;
  return (STATED_SPEED_UNITS as readonly string[]).includes(unit) ? { role, unit: unit as StatedSpeedUnit } : null;
}

/**
 * The unit-bearing columns of a header (lower-cased names) and the units they state. Throws a
 * 422 naming line `headerLine` and the column when one quantity comes in two units or one role
 * appears in two units.
 */
export function readCsvUnits(columns: readonly string[], headerLine: number): CsvUnits {
  const units: CsvUnits = { columns: {}, detected: {} };
  for (const column of columns) {
    const found = unitColumn(column);
    if (!found) continue;
    const quantity = found.role === 'weight' ? 'weight' : 'speed';
    const stated = units.detected[quantity];
    if (stated !== undefined && stated !== found.unit) {
      const roles: readonly UnitRole[] = quantity === 'weight' ? ['weight'] : SPEED_ROLES;
      const already = roles.map((role) => units.columns[role]).find(Boolean)!;
      const message =
        `Line ${headerLine}, column "${column}": this file already gives ${quantity === 'weight' ? 'weights' : 'speeds'} in ` +
        `${UNIT_SYMBOLS[stated!]} (column "${already}"). Give every ${quantity} of one file in one unit, as the flight manual prints it.`;
      throw csvFileError('unusable_csv', message);
    }
    units.columns[found.role] = column;
    if (quantity === 'weight') units.detected.weight = found.unit as StatedWeightUnit;
    else units.detected.speed = found.unit as StatedSpeedUnit;
  }
  return units;
}

/** A column's name as the kt/kg layouts write it: `ias_mph` → `ias_kt`, `weight_lb` → `weight_kg`; others unchanged. */
export function canonicalColumn(name: string): string {
  const found = unitColumn(name);
  return found ? `${found.role}_${found.role === 'weight' ? 'kg' : 'kt'}` : name;
}
