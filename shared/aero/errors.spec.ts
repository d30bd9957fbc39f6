import fc from 'fast-check';
import * as aero from './index';
import { AERO_INPUT_ERROR_CODES, AeroInputError } from './errors';
import { obeysErrorPolicy } from './testing/test-helpers';

// The error policy is the library's own (style.md "one error policy", issue 3); no outside source.
describe('AeroInputError', () => {
  it('is an Error named "AeroInputError" with a code, a field and a message', () => {
    const error = new AeroInputError('outside-table', 'iasKt', 'Outside the table.');
    expect(error).toBeInstanceOf(Error);
    expect(error).toBeInstanceOf(AeroInputError);
    expect(error.name).toBe('AeroInputError');
    expect(error.code).toBe('outside-table');
    expect(error.field).toBe('iasKt');
    expect(error.message).toBe('Outside the table.');
    expect(String(error)).toBe('AeroInputError: Outside the table.');
  });

  it('has a documented list of distinct codes', () => {
    expect(new Set(AERO_INPUT_ERROR_CODES).size).toBe(AERO_INPUT_ERROR_CODES.length);
  });
});

/** Invented demo data — not for flight. */
const POSITION_ERROR = [
  { iasKt: 50, casKt: 54 },
  { iasKt: 100, casKt: 101 },
  { iasKt: 250, casKt: 247 },
];
const SPEED_TABLE = {
  byWeightKg: [5000, 6000],
  byPressureAltitudeFt: [0, 4000],
  byOatC: [0, 40],
  valuesKt: [
    [[100, 102], [101, 104]],
    [[108, 110], [109, 112]],
  ],
};

/** Every public function, called with random numbers for every numeric argument. */
const CALLS: Readonly<Record<string, (n: number[]) => unknown>> = {
  isa: ([h, d]) => aero.isa(h, d),
  isaTemperatureC: ([h, d]) => aero.isaTemperatureC(h, d),
  isaDeviationC: ([h, t]) => aero.isaDeviationC(h, t),
  pressureAltitudeFtForPressureHpa: ([p]) => aero.pressureAltitudeFtForPressureHpa(p),
  pressureAltitudeFt: ([e, q]) => aero.pressureAltitudeFt(e, q),
  stationPressureHpa: ([e, q]) => aero.stationPressureHpa(e, q),
  densityAltitudeFt: ([h, t, d]) => aero.densityAltitudeFt(h, t, d),
  convertAirspeed: ([h, t, v, which]) => {
    const key = (['casKt', 'easKt', 'tasKt', 'mach'] as const)[Math.abs(Math.trunc(which || 0)) % 4];
    return aero.convertAirspeed({ pressureAltitudeFt: h, oatC: t, [key]: v } as unknown as aero.AirspeedInput);
  },
  iasToCasKt: ([v]) => aero.iasToCasKt(POSITION_ERROR, v),
  casToIasKt: ([v]) => aero.casToIasKt(POSITION_ERROR, v),
  checkPositionErrorTable: ([a, b, c, d]) => aero.checkPositionErrorTable([{ iasKt: a, casKt: b }, { iasKt: c, casKt: d }]),
  crossoverAltitudeFt: ([v, m]) => aero.crossoverAltitudeFt(v, m),
  weightScaledSpeedKt: ([v, w0, w]) => aero.weightScaledSpeedKt(v, w0, w),
  interpolateSpeedTableKt: ([w, h, t]) => aero.interpolateSpeedTableKt(SPEED_TABLE, { weightKg: w, pressureAltitudeFt: h, oatC: t }),
  checkSpeedTable: ([a, b, c, d]) => aero.checkSpeedTable({ byWeightKg: [a, b], valuesKt: [c, d] }),
  stallSpeedInTurnKt: ([v, b]) => aero.stallSpeedInTurnKt(v, b),
  tatToSatC: ([t, m, k]) => aero.tatToSatC(t, m, k),
  loadFactorInTurn: ([b]) => aero.loadFactorInTurn(b),
  geopotentialAltitudeM: ([z]) => aero.geopotentialAltitudeM(z),
  geometricAltitudeM: ([h]) => aero.geometricAltitudeM(h),
  roundLimitKt: ([v]) => aero.roundLimitKt(v),
  roundStallKt: ([v]) => aero.roundStallKt(v),
  roundSpeedKt: ([v]) => aero.roundSpeedKt(v),
  ktToMps: ([v]) => aero.ktToMps(v),
  mpsToKt: ([v]) => aero.mpsToKt(v),
  ktToKmh: ([v]) => aero.ktToKmh(v),
  kmhToKt: ([v]) => aero.kmhToKt(v),
  ktToMph: ([v]) => aero.ktToMph(v),
  mphToKt: ([v]) => aero.mphToKt(v),
  ftToM: ([v]) => aero.ftToM(v),
  mToFt: ([v]) => aero.mToFt(v),
  hpaToInhg: ([v]) => aero.hpaToInhg(v),
  inhgToHpa: ([v]) => aero.inhgToHpa(v),
  cToF: ([v]) => aero.cToF(v),
  fToC: ([v]) => aero.fToC(v),
  cToK: ([v]) => aero.cToK(v),
  kToC: ([v]) => aero.kToC(v),
  kgToLb: ([v]) => aero.kgToLb(v),
  lbToKg: ([v]) => aero.lbToKg(v),
};

/** Any double, weighted towards the awkward ones and towards the plausible range. */
const anyNumber = fc.oneof(
  fc.double(),
  fc.double({ min: -1000, max: 60000, noNaN: true }),
  fc.double({ min: -100, max: 1100, noNaN: true }),
  fc.constantFrom(Number.NaN, Infinity, -Infinity, 0, -0, 1, 0.5, 90, 1e308, -1e308, 5e-324, Number.MAX_VALUE),
);

describe('error policy: no input yields NaN or Infinity (property, fast-check)', () => {
  it('covers every function of the barrel', () => {
    const exported = Object.entries(aero)
      .filter(([name, value]) => typeof value === 'function' && name !== 'AeroInputError')
      .map(([name]) => name)
      .sort();
    expect(Object.keys(CALLS).sort()).toEqual(exported);
  });

  it.each(Object.keys(CALLS))('%s returns finite numbers or throws AeroInputError', (name) => {
    fc.assert(
      fc.property(fc.array(anyNumber, { minLength: 4, maxLength: 4 }), (numbers) => {
        expect(obeysErrorPolicy(() => CALLS[name](numbers))).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('every refusal is a sentence: a capital or a digit first, a full stop last', () => {
    fc.assert(
      fc.property(fc.constantFrom(...Object.keys(CALLS)), fc.array(anyNumber, { minLength: 4, maxLength: 4 }), (name, numbers) => {
        try {
          CALLS[name](numbers);
        } catch (error) {
          expect((error as AeroInputError).message).toMatch(/^[A-Z0-9-].*\.$/s);
        }
      }),
      { numRuns: 1000 },
    );
  });
});
