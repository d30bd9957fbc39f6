import fc from 'fast-check';
import { MAX_MACH, SONIC_IMPACT_PRESSURE_RATIO, impactPressureRatio, machForImpactPressureRatio } from './pitot';
import { expectPublished, expectRelative } from './testing/test-helpers';

describe('pitot relations (NASA RP 1046; Rayleigh pitot formula)', () => {
  it('qc/p at Mach 1 is 1.2^3.5 − 1 = 0.8929 from both sides (NASA RP 1046)', () => {
    expectPublished(SONIC_IMPACT_PRESSURE_RATIO, '0.8929');
    expectRelative(impactPressureRatio(1 - 1e-12), impactPressureRatio(1), 1e-10);
  });

  it.each([
    // Pitot pressure over free-stream static pressure behind a normal shock, p02/p1, as tabulated in
    // NACA Report 1135 "Equations, tables, and charts for compressible flow" (1953) (from memory).
    [1.5, '3.413'],
    [2, '5.640'],
    [3, '12.06'],
  ])('Mach %d: p02/p1 = %s (NACA Report 1135, from memory)', (mach, ratio) => {
    expectPublished(impactPressureRatio(mach) + 1, ratio);
  });

  it('the inverse round-trips to 1e-12 relative from Mach 0.001 to 5 (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: MAX_MACH - 1e-9, noNaN: true }), (mach) => {
        expectRelative(machForImpactPressureRatio(impactPressureRatio(mach)), mach, 1e-12);
      }),
      { numRuns: 1000 },
    );
  });

  it('reports MAX_MACH for ratios beyond it, so callers can refuse', () => {
    expect(machForImpactPressureRatio(impactPressureRatio(MAX_MACH) * 2)).toBe(MAX_MACH);
  });
});
