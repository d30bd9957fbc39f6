import fc from 'fast-check';
import { roundLimitKt, roundSpeedKt, roundStallKt } from './rounding';
import { expectAeroError } from './testing/test-helpers';

// Card rounding: flight-physics.md "Rounding on cards" — common practice, no outside source.
describe('card rounding (common practice: limits down, stall speeds up, others to the nearest knot)', () => {
  it('rounds limits down, stall speeds up and other speeds to the nearest knot', () => {
    expect(roundLimitKt(163.9)).toBe(163);
    expect(roundStallKt(48.1)).toBe(49);
    expect(roundSpeedKt(72.5)).toBe(73);
    expect(roundSpeedKt(72.49)).toBe(72);
  });

  it('does not let floating-point noise cost or add a knot', () => {
    expect(roundLimitKt(199.9999999999997)).toBe(200);
    expect(roundStallKt(50.0000000000003)).toBe(50);
    expect(roundSpeedKt(72.4999999999997)).toBe(73);
  });

  it('a limit never rounds up and a stall speed never rounds down (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 2000, noNaN: true }), (speedKt) => {
        expect(roundLimitKt(speedKt)).toBeLessThanOrEqual(speedKt + 1e-9);
        expect(roundStallKt(speedKt)).toBeGreaterThanOrEqual(speedKt - 1e-9);
        expect(Math.abs(roundSpeedKt(speedKt) - speedKt)).toBeLessThanOrEqual(0.5 + 1e-9);
      }),
    );
  });

  it('refuses NaN and speeds at or below zero', () => {
    expectAeroError(() => roundLimitKt(Number.NaN), 'not-a-number');
    expectAeroError(() => roundStallKt(0), 'speed-not-positive');
    expectAeroError(() => roundSpeedKt(-3), 'speed-not-positive');
  });
});
