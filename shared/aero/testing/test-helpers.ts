/**
 * Helpers for the library's own specs (not part of the barrel, not shipped to callers).
 */
import { AeroInputError, type AeroInputErrorCode } from '../errors';

/**
 * Asserts `actual` matches a published figure to ± `units` in its last printed digit, e.g.
 * `"898.746"` → ±0.001. The figure is passed as printed so its precision is not lost.
 */
export function expectPublished(actual: number, published: string, units = 1): void {
  const decimals = published.includes('.') ? published.split('.')[1].length : 0;
  const tolerance = units * Math.pow(10, -decimals) * (1 + 1e-9);
  const expected = Number(published);
  if (!(Math.abs(actual - expected) <= tolerance)) {
    throw new Error(`expected ${actual} to be ${published} ± ${units} in the last digit (difference ${actual - expected})`);
  }
}

/** Asserts `a` and `b` agree to `relative` (default 1e-9) of their size. */
export function expectRelative(a: number, b: number, relative = 1e-9): void {
  const scale = Math.max(Math.abs(a), Math.abs(b));
  if (!(Math.abs(a - b) <= relative * scale)) {
    throw new Error(`expected ${a} and ${b} to agree to ${relative} relative (difference ${a - b})`);
  }
}

/** Runs `action`, asserts it throws an `AeroInputError` with `code`, and returns the error. */
export function expectAeroError(action: () => unknown, code: AeroInputErrorCode): AeroInputError {
  try {
    action();
  } catch (error) {
    if (!(error instanceof AeroInputError)) throw new Error(`expected an AeroInputError, got ${String(error)}`);
    if (error.code !== code) throw new Error(`expected code ${code}, got ${error.code}: ${error.message}`);
    return error;
  }
  throw new Error(`expected an AeroInputError with code ${code}, but nothing was thrown`);
}

/**
 * True when the outcome of `action` obeys the error policy: finite numbers (or nothing, for the
 * `check…` functions) or an AeroInputError.
 */
export function obeysErrorPolicy(action: () => unknown): boolean {
  let result: unknown;
  try {
    result = action();
  } catch (error) {
    return error instanceof AeroInputError;
  }
  return result === undefined || allFinite(result);
}

function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (typeof value === 'object' && value !== null) return Object.values(value).every(allFinite);
  return false;
}
