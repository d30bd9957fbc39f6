import fc from 'fast-check';
import { loadFactorInTurn, stallSpeedInTurnKt } from './turn';
import { expectAeroError } from './testing/test-helpers';

describe('stall speed in a level turn (FAA Airplane Flying Handbook / PHAK: Vs·√n, n = 1/cos bank)', () => {
  it.each([
    // Percent increase of the stall speed with bank, FAA handbooks as quoted in flight-physics.md.
    [30, 7],
    [45, 19],
    [60, 41],
  ])('%d° of bank raises the stall speed by %d %%', (bankDeg, percent) => {
    expect(Math.round((stallSpeedInTurnKt(100, bankDeg) / 100 - 1) * 100)).toBe(percent);
  });

  it('load factor is 1 wings level and 2 g at 60° (FAA PHAK load-factor chart, from memory)', () => {
    expect(loadFactorInTurn(0)).toBe(1);
    expect(loadFactorInTurn(60)).toBeCloseTo(2, 12);
  });

  it('rises with bank and stays finite all the way to 90° (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 89.999, noNaN: true }), fc.double({ min: 1e-6, max: 0.01, noNaN: true }), (bankDeg, step) => {
        const steeper = Math.min(bankDeg + step, 89.9999999);
        // Within a millionth of a degree of wings level cos(bank) rounds to 1, so only "not lower" there.
        if (bankDeg >= 1) expect(stallSpeedInTurnKt(50, steeper)).toBeGreaterThan(stallSpeedInTurnKt(50, bankDeg));
        else expect(stallSpeedInTurnKt(50, steeper)).toBeGreaterThanOrEqual(stallSpeedInTurnKt(50, bankDeg));
        expect(Number.isFinite(stallSpeedInTurnKt(50, steeper))).toBe(true);
      }),
    );
  });

  it('refuses bank below 0° or 90° and more, NaN and a stall speed at or below zero', () => {
    expectAeroError(() => stallSpeedInTurnKt(50, 90), 'bank-out-of-range');
    expectAeroError(() => stallSpeedInTurnKt(50, -1), 'bank-out-of-range');
    expectAeroError(() => loadFactorInTurn(Number.NaN), 'not-a-number');
    expectAeroError(() => stallSpeedInTurnKt(0, 30), 'speed-not-positive');
  });
});
