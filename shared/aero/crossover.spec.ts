import fc from 'fast-check';
import { convertAirspeed } from './airspeed';
import { isaTemperatureC } from './atmosphere';
import { crossoverAltitudeFt } from './crossover';
import { AeroInputError } from './errors';
import { expectAeroError, expectRelative } from './testing/test-helpers';

function crossoverOrUndefined(vmoKt: number, mmo: number): number | undefined {
  try {
    return crossoverAltitudeFt(vmoKt, mmo);
  } catch (error) {
    if (error instanceof AeroInputError && error.code === 'altitude-out-of-range') return undefined;
    throw error;
  }
}

// Definition (flight-physics.md, NASA RP 1046 relations): at the crossover, VMO as a CAS is MMO.
describe('crossoverAltitudeFt', () => {
  it.each([
    [250, 0.6],
    [300, 0.78],
    [340, 0.82],
    [350, 0.9],
  ])('VMO %d KCAS is exactly MMO %d at the crossover (consistency with convertAirspeed)', (vmoKt, mmo) => {
    const altitudeFt = crossoverAltitudeFt(vmoKt, mmo);
    for (const deviationC of [-20, 0, 20]) {
      const speeds = convertAirspeed({ pressureAltitudeFt: altitudeFt, oatC: isaTemperatureC(altitudeFt, deviationC), casKt: vmoKt });
      expectRelative(speeds.mach, mmo, 1e-9);
    }
  });

  it('falls as VMO rises, rises as MMO rises (property, fast-check)', () => {
    let compared = 0;
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 600, noNaN: true }),
        fc.double({ min: 1e-4, max: 0.5, noNaN: true }),
        fc.double({ min: 0.3, max: 2, noNaN: true }),
        (vmoKt, step, mmo) => {
          const low = crossoverOrUndefined(vmoKt, mmo);
          const high = crossoverOrUndefined(vmoKt * (1 + step), mmo);
          const higherMach = crossoverOrUndefined(vmoKt, mmo * (1 + step));
          if (low === undefined) return;
          compared++;
          if (high !== undefined) expect(high).toBeLessThan(low);
          if (higherMach !== undefined) expect(higherMach).toBeGreaterThan(low);
        },
      ),
    );
    expect(compared).toBeGreaterThan(50);
  });

  it('refuses NaN, zero, Mach 5 and limits that cross outside the atmosphere model', () => {
    expectAeroError(() => crossoverAltitudeFt(Number.NaN, 0.8), 'not-a-number');
    expectAeroError(() => crossoverAltitudeFt(300, 0), 'speed-not-positive');
    expectAeroError(() => crossoverAltitudeFt(300, 5), 'speed-out-of-range');
    expectAeroError(() => crossoverAltitudeFt(600, 0.3), 'altitude-out-of-range'); // would cross below −2 km
    expectAeroError(() => crossoverAltitudeFt(20, 0.95), 'altitude-out-of-range'); // above 47 km
  });
});
