/**
 * Reading one cell of a speed-table CSV: a number in its column's unit and accepted range (the
 * kt/kg ranges converted, kept inside them), and the configuration keys and speed codes by the
 * revision content's own schemas, each with the sentence a fleet engineer acts on.
 */
import { configurationKeySchema, speedCodeSchema } from '@shared/speed-book/content-shape';
import { CANONICAL_UNITS, UNIT_SYMBOLS, fromCanonical, type StatedUnits } from '@shared/speed-book/stated-units';
import type { CsvRowError } from './csv-problems';
import { canonicalColumn, unitColumn } from './csv-units';
import type { CsvRow } from './speed-table-upload';

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

// Keys and codes follow the revision content's own rules, so a preview that passes here is
// not refused later by the content schema.
export const CONFIGURATION_KEY = { test: (key: string) => configurationKeySchema.safeParse(key).success };
export const SPEED_CODE = { test: (code: string) => speedCodeSchema.safeParse(code).success };

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

/** The number in `row`'s `column`, or undefined with the reason added to `errors`. */
export function number(row: CsvRow, column: string, errors: CsvRowError[]): number | undefined {
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

export function configurationKeyReason(key: string): string {
  return key
    ? `"${key}" is not a configuration key: ${schemaMessage(configurationKeySchema, key)}`
    : 'Enter the configuration key, e.g. clean or landing-flap.';
}

export function schemaMessage(schema: typeof configurationKeySchema | typeof speedCodeSchema, value: string): string {
  const result = schema.safeParse(value);
  return result.success ? '' : (result.error.issues[0]?.message ?? '');
}
