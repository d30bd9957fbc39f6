import fc from 'fast-check';
import { unit } from 'mathjs';
import { MAX_PRESSURE_ALTITUDE_FT, MIN_PRESSURE_ALTITUDE_FT } from './constants';
import { type AirspeedGiven, convertAirspeed } from './airspeed';
import { isa, isaTemperatureC } from './atmosphere';
import { AeroInputError } from './errors';
import { expectAeroError, expectPublished, expectRelative } from './testing/test-helpers';

/** `convertAirspeed` on a day at `isaDeviationC` from ISA. */
function at(pressureAltitudeFt: number, speed: AirspeedGiven, isaDeviationC = 0) {
  return convertAirspeed({ pressureAltitudeFt, oatC: isaTemperatureC(pressureAltitudeFt, isaDeviationC), ...speed });
}

/** The result, or undefined when the combination is refused for being too fast or too slow. */
function attempt(action: () => ReturnType<typeof at>) {
  try {
    return action();
  } catch (error) {
    if (error instanceof AeroInputError && error.code === 'speed-out-of-range') return undefined;
    throw error;
  }
}

const psfToPa = unit(1, 'lbf/ft^2').toNumber('Pa'); // mathjs

describe('convertAirspeed: NASA RP 1046 (Gracey) values quoted in flight-physics.md, standard day', () => {
  it('impact pressure at 100 KCAS is 34.0493 lb/ft²', () => {
    // Computed 34.04917 lb/ft², 0.00013 (4 ppm) below the quoted figure: the quoting source rounds
    // p0 and a0 in its own units. Tolerance ± 2 in the last digit.
    expectPublished(at(0, { casKt: 100 }).impactPressurePa / psfToPa, '34.0493', 2);
  });

  it('250 KCAS at 10,000 ft is 248.10 KEAS and 288.70 KTAS', () => {
    const speeds = at(10000, { casKt: 250 });
    expectPublished(speeds.easKt, '248.10');
    expectPublished(speeds.tasKt, '288.70');
  });

  it('400 KCAS at 30,000 ft is 602.6 KTAS (supersonic: Rayleigh pitot formula)', () => {
    const speeds = at(30000, { casKt: 400 });
    expectPublished(speeds.tasKt, '602.6');
    expect(speeds.mach).toBeGreaterThan(1);
  });

  it('Mach 0.8 at 30,000 ft is 471.46 KTAS', () => {
    expectPublished(at(30000, { mach: 0.8 }).tasKt, '471.46');
  });
});

describe('convertAirspeed: definitions (NASA RP 1046)', () => {
  it('at ISA sea level CAS = EAS = TAS, since a0 and p0 are the calibration references (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1500, noNaN: true }), (casKt) => {
        const speeds = at(0, { casKt });
        expectRelative(speeds.easKt, casKt, 1e-12);
        expectRelative(speeds.tasKt, casKt, 1e-12);
      }),
    );
  });

  it('EAS = TAS·√σ and q = ½·ρ·TAS² (NASA RP 1046; ISO 2533 density)', () => {
    const speeds = convertAirspeed({ pressureAltitudeFt: 8000, oatC: 20, tasKt: 180 });
    const conditions = isa(8000, 20 - isaTemperatureC(8000));
    expectRelative(speeds.easKt, 180 * Math.sqrt(conditions.sigma), 1e-12);
    const tasMps = unit(180 * 1852, 'm/h').toNumber('m/s'); // mathjs, 1 kt = 1852 m/h
    expectRelative(speeds.dynamicPressurePa, 0.5 * conditions.densityKgM3 * tasMps * tasMps, 1e-12);
    expectRelative(speeds.mach, 180 / conditions.speedOfSoundKt, 1e-12);
  });

  it('the subsonic and supersonic pitot relations meet at Mach 1 (NASA RP 1046)', () => {
    const below = at(30000, { mach: 1 - 1e-9 });
    const above = at(30000, { mach: 1 + 1e-9 });
    expectRelative(below.casKt, above.casKt, 1e-8);
    expectRelative(below.impactPressurePa, above.impactPressurePa, 1e-8);
  });

  it('above sea level EAS is below CAS: the compressibility correction (NASA RP 1046, from memory) (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 100, max: 60000, noNaN: true }), fc.double({ min: 20, max: 500, noNaN: true }), (altitudeFt, casKt) => {
        const speeds = attempt(() => at(altitudeFt, { casKt }));
        if (speeds) expect(speeds.easKt).toBeLessThan(casKt);
      }),
    );
  });
});

describe('convertAirspeed: facts of the trade (common practice, no source; flight-physics.md)', () => {
  it('dynamic pressure scales with speed squared: double ×4, treble ×9, half ×¼', () => {
    const q = (tasKt: number) => convertAirspeed({ pressureAltitudeFt: 5000, oatC: 10, tasKt }).dynamicPressurePa;
    expectRelative(q(200) / q(100), 4, 1e-12);
    expectRelative(q(300) / q(100), 9, 1e-12);
    expectRelative(q(50) / q(100), 0.25, 1e-12);
  });

  it('at 40,000 ft the density is about a quarter of sea level, so TAS ≈ 2 × EAS (within 5 %)', () => {
    expect(Math.abs(isa(40000).sigma - 0.25)).toBeLessThan(0.0125);
    const speeds = at(40000, { casKt: 250 });
    expect(Math.abs(speeds.tasKt / speeds.easKt - 2)).toBeLessThan(0.1);
  });

  it('compressibility is small at low speed and significant above about 300 kt', () => {
    for (const altitudeFt of [0, 5000, 10000]) {
      for (const casKt of [60, 120, 200]) {
        expect((casKt - at(altitudeFt, { casKt }).easKt) / casKt).toBeLessThan(0.01);
      }
    }
    expect((350 - at(30000, { casKt: 350 }).easKt) / 350).toBeGreaterThan(0.02);
  });
});

describe('convertAirspeed: properties (fast-check)', () => {
  // From −2 km: below it ISA passes +40 °C, and ISA +30 °C would break the +70 °C cap of the
  // temperature policy (constants.ts), a refusal these properties are not about.
  const altitudeFt = fc.double({ min: Math.max(MIN_PRESSURE_ALTITUDE_FT, -2000 / 0.3048), max: MAX_PRESSURE_ALTITUDE_FT, noNaN: true });
  const deviationC = fc.double({ min: -30, max: 30, noNaN: true });

  it('CAS → Mach → CAS round-trips to 1e-9 relative, subsonic and supersonic', () => {
    let converted = 0;
    fc.assert(
      fc.property(altitudeFt, deviationC, fc.double({ min: 1, max: 3000, noNaN: true }), (hFt, dev, casKt) => {
        const forward = attempt(() => at(hFt, { casKt }, dev));
        const back = forward && attempt(() => at(hFt, { mach: forward.mach }, dev));
        if (!back) return;
        converted++;
        expectRelative(back.casKt, casKt, 1e-9);
      }),
      { numRuns: 500 },
    );
    expect(converted).toBeGreaterThan(250); // the property is not vacuous
  });

  it('TAS → EAS → TAS round-trips to 1e-9 relative', () => {
    let converted = 0;
    fc.assert(
      fc.property(altitudeFt, deviationC, fc.double({ min: 1, max: 2000, noNaN: true }), (hFt, dev, tasKt) => {
        const forward = attempt(() => at(hFt, { tasKt }, dev));
        const back = forward && attempt(() => at(hFt, { easKt: forward.easKt }, dev));
        if (!back) return;
        converted++;
        expectRelative(back.tasKt, tasKt, 1e-9);
      }),
      { numRuns: 500 },
    );
    expect(converted).toBeGreaterThan(250);
  });

  it('a higher CAS gives a higher TAS at a fixed altitude and temperature', () => {
    fc.assert(
      fc.property(altitudeFt, deviationC, fc.double({ min: 1, max: 600, noNaN: true }), fc.double({ min: 1e-6, max: 1, noNaN: true }), (hFt, dev, casKt, step) => {
        const slower = attempt(() => at(hFt, { casKt }, dev));
        const faster = attempt(() => at(hFt, { casKt: casKt * (1 + step) }, dev));
        if (slower && faster) expect(faster.tasKt).toBeGreaterThan(slower.tasKt);
      }),
      { numRuns: 500 },
    );
  });

  it('a higher altitude gives a higher TAS for the same CAS (same ISA deviation)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: Math.max(MIN_PRESSURE_ALTITUDE_FT, -2000 / 0.3048), max: MAX_PRESSURE_ALTITUDE_FT - 10, noNaN: true }), // as `altitudeFt` above
        fc.double({ min: 10, max: 20000, noNaN: true }),
        deviationC,
        fc.double({ min: 1, max: 600, noNaN: true }),
        (hFt, climbFt, dev, casKt) => {
          const low = attempt(() => at(hFt, { casKt }, dev));
          const high = attempt(() => at(Math.min(MAX_PRESSURE_ALTITUDE_FT, hFt + climbFt), { casKt }, dev));
          if (low && high) expect(high.tasKt).toBeGreaterThan(low.tasKt);
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('convertAirspeed: refusals (library error policy)', () => {
  const where = { pressureAltitudeFt: 5000, oatC: 5 };

  it('needs exactly one speed', () => {
    expectAeroError(() => convertAirspeed(where as never), 'one-speed-required');
    expectAeroError(() => convertAirspeed({ ...where, casKt: 100, mach: 0.2 } as never), 'one-speed-required');
  });

  it('refuses NaN, zero, negative, too slow and Mach 5 or faster', () => {
    expectAeroError(() => convertAirspeed({ ...where, casKt: Number.NaN }), 'not-a-number');
    expectAeroError(() => convertAirspeed({ ...where, tasKt: 0 }), 'speed-not-positive');
    expectAeroError(() => convertAirspeed({ ...where, easKt: -100 }), 'speed-not-positive');
    expectAeroError(() => convertAirspeed({ ...where, casKt: 0.5 }), 'speed-out-of-range');
    expectAeroError(() => convertAirspeed({ ...where, mach: 0.0001 }), 'speed-out-of-range');
    expectAeroError(() => convertAirspeed({ ...where, mach: 5 }), 'speed-out-of-range');
    expectAeroError(() => convertAirspeed({ ...where, tasKt: 4000 }), 'speed-out-of-range');
    expectAeroError(() => convertAirspeed({ ...where, casKt: 4000 }), 'speed-out-of-range');
  });

  it('refuses altitudes and temperatures outside the envelope', () => {
    expectAeroError(() => convertAirspeed({ pressureAltitudeFt: 200000, oatC: -50, casKt: 100 }), 'altitude-out-of-range');
    expectAeroError(() => convertAirspeed({ pressureAltitudeFt: 0, oatC: -300, casKt: 100 }), 'temperature-out-of-range');
    expectAeroError(() => convertAirspeed({ pressureAltitudeFt: 0, oatC: Number.NaN, casKt: 100 }), 'not-a-number');
  });

  it('says what is wrong in words a pilot understands', () => {
    const error = expectAeroError(() => convertAirspeed({ pressureAltitudeFt: 0, oatC: 95, casKt: 100 }), 'temperature-out-of-range');
    expect(error.message).toMatch(/outside air temperature of 95\.0 °C at 0 ft is not plausible/);
    expect(error.field).toBe('oatC');
  });
});
