import fc from 'fast-check';
import { tatToSatC } from './total-temperature';
import { expectAeroError } from './testing/test-helpers';

describe('tatToSatC: SAT = TAT / (1 + 0.2·K·M²) (NASA RP 1046, Gracey 1980; flight-physics.md)', () => {
  it('at Mach 0.78 with K = 1 takes −30 °C TAT to −52.2 °C SAT (243.15 K / 1.121 68 = 216.773 K)', () => {
    expect(tatToSatC(-30, 0.78)).toBeCloseTo(216.7731 - 273.15, 3);
  });

  it('with recovery factor 0.8 the correction is smaller (243.15 K / 1.097 344 = 221.580 K)', () => {
    expect(tatToSatC(-30, 0.78, 0.8)).toBeCloseTo(221.5805 - 273.15, 3);
  });

  it('at rest TAT equals SAT', () => {
    expect(tatToSatC(15, 0)).toBeCloseTo(15, 12);
  });

  it('never gives a SAT warmer than the TAT (the probe only heats; property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -80, max: 60, noNaN: true }), fc.double({ min: 0, max: 0.99, noNaN: true }), fc.double({ min: 0.5, max: 1, noNaN: true }), (tatC, mach, k) => {
        expect(tatToSatC(tatC, mach, k)).toBeLessThanOrEqual(tatC + 1e-9);
      }),
    );
  });

  it('refuses Mach 1 and above, NaN, a temperature below absolute zero and a recovery factor out of range', () => {
    expectAeroError(() => tatToSatC(-30, 1), 'speed-out-of-range');
    expectAeroError(() => tatToSatC(Number.NaN, 0.5), 'not-a-number');
    expectAeroError(() => tatToSatC(-300, 0.5), 'temperature-out-of-range');
    expectAeroError(() => tatToSatC(-30, 0.5, 1.2), 'factor-out-of-range');
  });
});
