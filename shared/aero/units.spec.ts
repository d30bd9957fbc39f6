import fc from 'fast-check';
import { unit } from 'mathjs';
import {
  cToF,
  cToK,
  fToC,
  ftToM,
  hpaToInhg,
  inhgToHpa,
  kToC,
  kgToLb,
  kmhToKt,
  ktToKmh,
  ktToMph,
  ktToMps,
  lbToKg,
  mToFt,
  mphToKt,
  mpsToKt,
} from './units';
import { expectAeroError, expectRelative } from './testing/test-helpers';

/**
 * Reference library: mathjs (npm, devDependency). mathjs has no knot and no inch of mercury, so
 * those two are built from mathjs units and their definitions: 1 kt = 1852 m/h (international
 * nautical mile, BIPM SI Brochure), 1 inHg = 13 595.1 kg/m³ · 9.806 65 m/s² · 1 inch
 * (conventional mercury column; from memory).
 */
const knotInMps = unit(1852, 'm/h').toNumber('m/s');
const inhgInHpa = unit('13595.1 kg/m^3').multiply(unit('9.80665 m/s^2')).multiply(unit('1 inch')).toNumber('hPa');

describe('unit conversions against mathjs', () => {
  it('speed: kt ↔ m/s, km/h, mph', () => {
    expectRelative(ktToMps(1), knotInMps, 1e-15);
    expectRelative(ktToKmh(1), unit(1852, 'm/h').toNumber('km/h'), 1e-15);
    expectRelative(ktToMph(1), unit(1852, 'm/h').toNumber('mi/h'), 1e-15);
    expectRelative(mpsToKt(unit(250, 'km/h').toNumber('m/s')), kmhToKt(250), 1e-15);
    expectRelative(mphToKt(1), unit(1, 'mi/h').toNumber('m/s') / knotInMps, 1e-15);
  });

  it('length: ft ↔ m', () => {
    expectRelative(ftToM(1), unit(1, 'ft').toNumber('m'), 1e-15);
    expectRelative(mToFt(1000), unit(1000, 'm').toNumber('ft'), 1e-15);
  });

  it('pressure: hPa ↔ inHg (to 2e-7: the library uses NIST 3386.389 Pa, the mercury-column build gives 3386.3886)', () => {
    expectRelative(inhgToHpa(1), inhgInHpa, 2e-7);
    expectRelative(hpaToInhg(1013.25), 1013.25 / inhgInHpa, 2e-7);
  });

  it('temperature: °C ↔ °F, K', () => {
    for (const c of [-56.5, -40, 0, 15, 36.6]) {
      expectRelative(cToF(c), unit(c, 'degC').toNumber('degF'), 1e-12);
      expectRelative(cToK(c), unit(c, 'degC').toNumber('K'), 1e-12);
    }
    expectRelative(fToC(59), unit(59, 'degF').toNumber('degC'), 1e-12);
    expectRelative(kToC(216.65), unit(216.65, 'K').toNumber('degC'), 1e-12);
  });

  it('mass: kg ↔ lb (mathjs "lbm")', () => {
    expectRelative(kgToLb(1), unit(1, 'kg').toNumber('lbm'), 1e-15);
    expectRelative(lbToKg(12500), unit(12500, 'lbm').toNumber('kg'), 1e-15);
  });

  it('every pair round-trips to 1e-12 relative (property, fast-check)', () => {
    const pairs: ReadonlyArray<readonly [(x: number) => number, (x: number) => number]> = [
      [ktToMps, mpsToKt],
      [ktToKmh, kmhToKt],
      [ktToMph, mphToKt],
      [ftToM, mToFt],
      [hpaToInhg, inhgToHpa],
      [kgToLb, lbToKg],
      [cToF, fToC],
      [cToK, kToC],
    ];
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 1e6, noNaN: true }), (value) => {
        for (const [there, back] of pairs) {
          expect(Math.abs(back(there(value)) - value)).toBeLessThanOrEqual(1e-12 * Math.max(1, value) * 1000);
        }
      }),
    );
  });

  it('refuses NaN, infinity, temperatures below absolute zero, and overflowing results', () => {
    expectAeroError(() => ktToMps(Number.NaN), 'not-a-number');
    expectAeroError(() => ftToM(Infinity), 'not-a-number');
    expectAeroError(() => cToK(-273.16), 'temperature-out-of-range');
    expectAeroError(() => fToC(-460), 'temperature-out-of-range');
    expectAeroError(() => kToC(-1), 'temperature-out-of-range');
    expectAeroError(() => ktToKmh(Number.MAX_VALUE), 'result-out-of-range');
    expect(cToK(-273.15)).toBe(0);
  });
});
