import fc from 'fast-check';
import { densityAltitudeFt, pressureAltitudeFt, saturationVapourPressureHpa, stationPressureHpa } from './altimetry';
import { isa, isaTemperatureC, pressureAltitudeFtForPressureHpa } from './atmosphere';
import { inhgToHpa } from './units';
import { expectAeroError, expectRelative } from './testing/test-helpers';

describe('pressureAltitudeFt: the exact altimeter relation (ICAO Doc 7488 troposphere law)', () => {
  it('FAA worked example: a sea-level field with 29.70 inHg has a pressure altitude of about 205 ft', () => {
    expect(Math.abs(pressureAltitudeFt(0, inhgToHpa(29.7)) - 205)).toBeLessThan(1);
  });

  it('QNH 1013.25 hPa gives pressure altitude = elevation (definition of QNH, ICAO Doc 7488) (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -6000, max: 36000, noNaN: true }), (elevationFt) => {
        expect(Math.abs(pressureAltitudeFt(elevationFt, 1013.25) - elevationFt)).toBeLessThan(1e-6);
      }),
    );
  });

  it('the station pressure at QNH 1013.25 is the ISA pressure at the elevation (ISO 2533)', () => {
    expectRelative(stationPressureHpa(5000, 1013.25), isa(5000).pressurePa / 100, 1e-12);
  });

  it('about 27 ft per hPa near sea level (common practice, no source: the rule of thumb of flight-physics.md)', () => {
    const perHpa = (pressureAltitudeFt(0, 1003.25) - pressureAltitudeFt(0, 1013.25)) / 10;
    expect(perHpa).toBeGreaterThan(26);
    expect(perHpa).toBeLessThan(28.5);
  });

  it('1 hPa of static pressure is about 30 ft of height at 5,000 ft (common practice, no source)', () => {
    const stationHpa = stationPressureHpa(5000, 1013.25);
    const perHpa = pressureAltitudeFtForPressureHpa(stationHpa - 5) - pressureAltitudeFtForPressureHpa(stationHpa + 5);
    expect(perHpa / 10).toBeGreaterThan(29);
    expect(perHpa / 10).toBeLessThan(33);
  });

  it('a lower QNH means a higher pressure altitude (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 15000, noNaN: true }), fc.double({ min: 900, max: 1090, noNaN: true }), (elevationFt, qnhHpa) => {
        expect(pressureAltitudeFt(elevationFt, qnhHpa)).toBeGreaterThan(pressureAltitudeFt(elevationFt, qnhHpa + 5));
      }),
    );
  });

  it('refuses implausible QNH (e.g. inHg typed as hPa), elevations beyond the troposphere and NaN', () => {
    expectAeroError(() => pressureAltitudeFt(0, 29.92), 'pressure-out-of-range');
    expectAeroError(() => pressureAltitudeFt(0, 1200), 'pressure-out-of-range');
    expectAeroError(() => pressureAltitudeFt(40000, 1013), 'altitude-out-of-range');
    expectAeroError(() => pressureAltitudeFt(Number.NaN, 1013), 'not-a-number');
    expectAeroError(() => pressureAltitudeFt(0, Number.NaN), 'not-a-number');
    // Valid one by one, but the station pressure is beyond the bottom of the model:
    expectAeroError(() => pressureAltitudeFt(-16000, 1100), 'altitude-out-of-range');
  });
});

describe('densityAltitudeFt (ISO 2533 density; virtual temperature as in flight-physics.md)', () => {
  it('equals the pressure altitude on a standard dry day (definition of density altitude) (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -6000, max: 150000, noNaN: true }), (altitudeFt) => {
        const difference = densityAltitudeFt(altitudeFt, isaTemperatureC(altitudeFt)) - altitudeFt;
        expect(Math.abs(difference)).toBeLessThanOrEqual(1e-6 * Math.max(1000, Math.abs(altitudeFt)));
      }),
    );
  });

  it('about 120 ft per °C above ISA (common practice, no source: a loose check, ±15 %)', () => {
    for (const altitudeFt of [0, 3000, 6000]) {
      const perDegree = (densityAltitudeFt(altitudeFt, isaTemperatureC(altitudeFt, 10)) - altitudeFt) / 10;
      expect(perDegree).toBeGreaterThan(102);
      expect(perDegree).toBeLessThan(138);
    }
  });

  it('humid air is less dense, so the density altitude rises by a few hundred feet on a hot humid day (common practice, from memory)', () => {
    const dry = densityAltitudeFt(0, 35);
    const humid = densityAltitudeFt(0, 35, 25);
    expect(humid - dry).toBeGreaterThan(100);
    expect(humid - dry).toBeLessThan(600);
  });

  it('a very dry dew point changes nothing measurable', () => {
    expect(Math.abs(densityAltitudeFt(2000, 20, -60) - densityAltitudeFt(2000, 20))).toBeLessThan(2);
  });

  it('agrees with Tv ≈ T·(1 + 0.608·q), the specific-humidity form of the virtual temperature (common practice, from memory)', () => {
    const pressurePa = isa(0).pressurePa;
    const vapourPa = saturationVapourPressureHpa(25) * 100;
    const specificHumidity = (0.622 * vapourPa) / (pressurePa - 0.378 * vapourPa);
    const virtualK = (35 + 273.15) * (1 + 0.608 * specificHumidity);
    const densityKgM3 = pressurePa / (287.05287 * virtualK);
    const expectedFt = isaAltitudeOfDensityFt(densityKgM3);
    expect(Math.abs(densityAltitudeFt(0, 35, 25) - expectedFt)).toBeLessThan(5);
  });

  it('refuses a dew point above the air temperature, a boiling one, and NaN', () => {
    expectAeroError(() => densityAltitudeFt(0, 20, 21), 'dew-point-above-temperature');
    expectAeroError(() => densityAltitudeFt(150000, -2, -3), 'temperature-out-of-range');
    expectAeroError(() => densityAltitudeFt(0, 20, Number.NaN), 'not-a-number');
    expectAeroError(() => densityAltitudeFt(0, 20, -150), 'temperature-out-of-range');
    expectAeroError(() => densityAltitudeFt(0, 90), 'temperature-out-of-range');
  });
});

describe('saturationVapourPressureHpa (Magnus-type, Alduchov & Eskridge 1996)', () => {
  it.each([
    // Saturation vapour pressure over water, meteorological tables (from memory): 0 °C 6.11 hPa,
    // 20 °C 23.39 hPa, 30 °C 42.47 hPa. The formula's stated accuracy is better than 0.4 %.
    [0, 6.11],
    [20, 23.39],
    [30, 42.47],
  ])('at %d °C is %d hPa within 0.4 %%', (temperatureC, tableHpa) => {
    expectRelative(saturationVapourPressureHpa(temperatureC), tableHpa, 0.004);
  });
});

/** ISA altitude of a density by bisection on isa(): an independent inverse for the check above. */
function isaAltitudeOfDensityFt(densityKgM3: number): number {
  let low = -6000;
  let high = 40000;
  for (let i = 0; i < 100; i++) {
    const middle = (low + high) / 2;
    if (isa(middle).densityKgM3 > densityKgM3) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}
