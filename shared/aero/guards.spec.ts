import { AeroInputError } from './errors';
import { finiteResult, formatNumber, requireFinite, requirePositiveSpeed, requirePositiveWeight } from './guards';
import { expectAeroError } from './testing/test-helpers';

// The error policy itself is the library's own design (style.md, "one error policy"); no outside source.
describe('guards', () => {
  it('formats numbers the same on every device: commas for thousands, fixed decimals', () => {
    expect(formatNumber(104987.4)).toBe('104,987');
    expect(formatNumber(-6561.68)).toBe('-6,562');
    expect(formatNumber(1013.25, 1)).toBe('1,013.3');
    expect(formatNumber(-0.0001, 1)).toBe('0.0');
    expect(formatNumber(Number.NaN)).toBe('NaN');
  });

  it('refuses missing, NaN, infinite and non-numeric values with not-a-number', () => {
    for (const value of [undefined, null, Number.NaN, Infinity, -Infinity, '12', {}]) {
      const error = expectAeroError(() => requireFinite(value, 'x', 'The value'), 'not-a-number');
      expect(error.field).toBe('x');
    }
    expect(() => requireFinite(0, 'x', 'The value')).not.toThrow();
  });

  it('refuses speeds and weights at or below zero', () => {
    expectAeroError(() => requirePositiveSpeed(0, 'v', 'The speed'), 'speed-not-positive');
    expectAeroError(() => requirePositiveSpeed(-1, 'v', 'The speed'), 'speed-not-positive');
    expectAeroError(() => requirePositiveWeight(0, 'w', 'The weight'), 'weight-not-positive');
    expect(() => requirePositiveSpeed(1e-300, 'v', 'The speed')).not.toThrow();
  });

  it('turns a non-finite result into result-out-of-range', () => {
    expect(finiteResult(3, 'x', 'a value')).toBe(3);
    const error = expectAeroError(() => finiteResult(Infinity, 'x', 'a value'), 'result-out-of-range');
    expect(error).toBeInstanceOf(AeroInputError);
  });
});
