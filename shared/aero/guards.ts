/**
 * Checks shared by the library's public functions. Internal: not part of the barrel. Each throws
 * an `AeroInputError` with a sentence that names the input the way a pilot would.
 */
import { AeroInputError } from './errors';

/**
 * A number for a message: rounded to `decimals`, thousands separated by commas, a plain minus.
 * Locale-independent on purpose, so messages read the same on every device and in logs.
 */
export function formatNumber(value: number, decimals = 0): string {
  if (!Number.isFinite(value)) return String(value);
  const fixed = Math.abs(value).toFixed(decimals);
  const [whole, fraction] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const sign = value < 0 && Number(fixed) !== 0 ? '-' : '';
  return sign + grouped + (fraction ? '.' + fraction : '');
}

function describe(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (value === undefined) return 'nothing';
  if (value === null) return 'null';
  if (typeof value === 'string') return JSON.stringify(value);
  return typeof value;
}

/** Throws `not-a-number` unless `value` is a finite number. `label` is e.g. "The pressure altitude". */
export function requireFinite(value: unknown, field: string, label: string): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new AeroInputError('not-a-number', field, `${label} must be a finite number; got ${describe(value)}.`);
  }
}

/** Throws unless `value` is a finite speed above zero (in the unit `unit`, e.g. "kt"). */
export function requirePositiveSpeed(value: unknown, field: string, label: string, unit = 'kt'): asserts value is number {
  requireFinite(value, field, label);
  if (value <= 0) {
    throw new AeroInputError(
      'speed-not-positive',
      field,
      `${label} must be above zero; got ${formatNumber(value, 2)}${unit ? ' ' + unit : ''}.`,
    );
  }
}

/** Throws unless `value` is a finite weight above zero. */
export function requirePositiveWeight(value: unknown, field: string, label: string): asserts value is number {
  requireFinite(value, field, label);
  if (value <= 0) {
    throw new AeroInputError('weight-not-positive', field, `${label} must be above zero; got ${formatNumber(value, 2)}.`);
  }
}

/**
 * Returns `value` if finite, else throws `result-out-of-range`. The last line of defence of the
 * "never NaN or Infinity" rule for inputs that are valid one by one but extreme together.
 */
export function finiteResult(value: number, field: string, what: string): number {
  if (!Number.isFinite(value)) {
    throw new AeroInputError('result-out-of-range', field, `The inputs are too extreme to give ${what}.`);
  }
  return value;
}
