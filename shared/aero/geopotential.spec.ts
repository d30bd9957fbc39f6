import fc from 'fast-check';
import { geometricAltitudeM, geopotentialAltitudeM } from './geopotential';
import { expectAeroError, expectPublished, expectRelative } from './testing/test-helpers';

describe('geopotential ↔ geometric altitude (ISO 2533:1975, H = r·Z/(r + Z), r = 6 356 766 m)', () => {
  it.each([
    // Layer boundaries by geometric altitude as tabulated in the U.S. Standard Atmosphere 1976 (from memory).
    [11000, '11019'],
    [20000, '20063'],
    [32000, '32162'],
    [47000, '47350'],
  ])('H = %d m geopotential is Z ≈ %s m geometric (U.S. Standard Atmosphere 1976, from memory)', (geopotentialM, geometricM) => {
    expectPublished(geometricAltitudeM(geopotentialM), geometricM);
  });

  it('is the identity at sea level and grows apart with altitude', () => {
    expect(geopotentialAltitudeM(0)).toBe(0);
    expect(geopotentialAltitudeM(10000)).toBeLessThan(10000);
  });

  it('round-trips to 1e-12 relative (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: -100000, max: 100000, noNaN: true }), (geometricM) => {
        const back = geometricAltitudeM(geopotentialAltitudeM(geometricM));
        expect(Math.abs(back - geometricM)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(geometricM)));
      }),
    );
    expectRelative(geopotentialAltitudeM(geometricAltitudeM(5000)), 5000, 1e-14);
  });

  it('refuses non-numbers and altitudes beyond 1000 km', () => {
    expectAeroError(() => geopotentialAltitudeM(Number.NaN), 'not-a-number');
    expectAeroError(() => geometricAltitudeM(-7e6), 'altitude-out-of-range');
  });
});
