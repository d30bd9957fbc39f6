import fc from 'fast-check';
import { weightScaledSpeedKt } from './weight';
import { expectAeroError, expectRelative } from './testing/test-helpers';

describe('weightScaledSpeedKt: V = Vref·√(W/Wref) (FAA Pilot\'s Handbook of Aeronautical Knowledge)', () => {
  it('follows the square root of the weight ratio', () => {
    expectRelative(weightScaledSpeedKt(100, 1000, 900), 100 * Math.sqrt(0.9), 1e-15);
    expectRelative(weightScaledSpeedKt(61, 2400, 2400), 61, 1e-15);
    expectRelative(weightScaledSpeedKt(50, 1000, 4000), 100, 1e-15);
  });

  it('10 % less weight is about 5 % less speed (common practice, from memory)', () => {
    expect(Math.abs(weightScaledSpeedKt(100, 1000, 900) / 100 - 0.95)).toBeLessThan(0.002);
  });

  it('does not depend on the weight unit (kg or lb) and composes (property, fast-check)', () => {
    const weight = fc.double({ min: 100, max: 500000, noNaN: true });
    fc.assert(
      fc.property(fc.double({ min: 20, max: 400, noNaN: true }), weight, weight, weight, (speedKt, w1, w2, w3) => {
        expectRelative(weightScaledSpeedKt(speedKt, w1 * 2.20462262, w2 * 2.20462262), weightScaledSpeedKt(speedKt, w1, w2), 1e-12);
        expectRelative(weightScaledSpeedKt(weightScaledSpeedKt(speedKt, w1, w2), w2, w3), weightScaledSpeedKt(speedKt, w1, w3), 1e-12);
      }),
    );
  });

  it('refuses weights at or below zero, speeds at or below zero, NaN and overflowing results', () => {
    expectAeroError(() => weightScaledSpeedKt(60, 0, 1000), 'weight-not-positive');
    expectAeroError(() => weightScaledSpeedKt(60, 1000, -1), 'weight-not-positive');
    expectAeroError(() => weightScaledSpeedKt(0, 1000, 1000), 'speed-not-positive');
    expectAeroError(() => weightScaledSpeedKt(60, Number.NaN, 1000), 'not-a-number');
    expectAeroError(() => weightScaledSpeedKt(1e300, 1e-300, 1e300), 'result-out-of-range');
  });
});
