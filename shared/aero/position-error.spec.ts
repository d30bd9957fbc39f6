import fc from 'fast-check';
import { type PositionErrorTable, casToIasKt, checkPositionErrorTable, iasToCasKt } from './position-error';
import { expectAeroError, expectRelative } from './testing/test-helpers';

/** Invented demo data — not for flight. */
const TABLE: PositionErrorTable = [
  { iasKt: 50, casKt: 55 },
  { iasKt: 70, casKt: 72 },
  { iasKt: 90, casKt: 91 },
  { iasKt: 120, casKt: 119 },
  { iasKt: 160, casKt: 158 },
];

/** Random valid tables: 2 to 12 points, strictly increasing in both columns. */
const tables = fc
  .record({
    iasStartKt: fc.double({ min: 20, max: 100, noNaN: true }),
    casStartKt: fc.double({ min: 20, max: 100, noNaN: true }),
    steps: fc.array(fc.tuple(fc.double({ min: 0.5, max: 40, noNaN: true }), fc.double({ min: 0.5, max: 40, noNaN: true })), {
      minLength: 1,
      maxLength: 11,
    }),
  })
  .map(({ iasStartKt, casStartKt, steps }) => {
    const table = [{ iasKt: iasStartKt, casKt: casStartKt }];
    for (const [iasStep, casStep] of steps) {
      const last = table[table.length - 1];
      table.push({ iasKt: last.iasKt + iasStep, casKt: last.casKt + casStep });
    }
    return table as PositionErrorTable;
  });

// Flight-manual calibration tables are read linearly between points (FAA PHAK, airspeed
// calibration); the checks below follow from the definition of linear interpolation.
describe('iasToCasKt / casToIasKt', () => {
  it('returns the tabulated CAS at each tabulated IAS, and back', () => {
    for (const { iasKt, casKt } of TABLE) {
      expect(iasToCasKt(TABLE, iasKt)).toBe(casKt);
      expect(casToIasKt(TABLE, casKt)).toBe(iasKt);
    }
  });

  it('interpolates linearly between points', () => {
    expect(iasToCasKt(TABLE, 60)).toBeCloseTo(63.5, 12);
    expect(iasToCasKt(TABLE, 140)).toBeCloseTo(138.5, 12);
    expect(casToIasKt(TABLE, 105)).toBeCloseTo(90 + (30 * 14) / 28, 12);
  });

  it('IAS → CAS → IAS round-trips to 1e-9 relative (property, fast-check)', () => {
    fc.assert(
      fc.property(tables, fc.double({ min: 0, max: 1, noNaN: true }), (table, fraction) => {
        const first = table[0].iasKt;
        const last = table[table.length - 1].iasKt;
        const iasKt = Math.min(last, first + fraction * (last - first));
        expectRelative(casToIasKt(table, iasToCasKt(table, iasKt)), iasKt, 1e-9);
      }),
    );
  });

  it('a higher IAS gives a higher CAS (property, fast-check)', () => {
    fc.assert(
      fc.property(tables, fc.double({ min: 0, max: 0.99, noNaN: true }), fc.double({ min: 0.001, max: 0.01, noNaN: true }), (table, fraction, step) => {
        const first = table[0].iasKt;
        const span = table[table.length - 1].iasKt - first;
        expect(iasToCasKt(table, first + (fraction + step) * span)).toBeGreaterThan(iasToCasKt(table, first + fraction * span));
      }),
    );
  });

  it('never extrapolates: outside the table is refused, rounding noise at an end is not', () => {
    expectAeroError(() => iasToCasKt(TABLE, 49.9), 'outside-table');
    expectAeroError(() => iasToCasKt(TABLE, 160.1), 'outside-table');
    expectAeroError(() => casToIasKt(TABLE, 54), 'outside-table');
    expect(iasToCasKt(TABLE, 160 * (1 + 1e-13))).toBe(158);
    const error = expectAeroError(() => iasToCasKt(TABLE, 30), 'outside-table');
    expect(error.message).toBe(
      "30.0 KIAS is outside this configuration's position-error table (50.0 to 160.0 KIAS); the flight manual gives no correction there.",
    );
  });

  it('refuses NaN and speeds at or below zero', () => {
    expectAeroError(() => iasToCasKt(TABLE, Number.NaN), 'not-a-number');
    expectAeroError(() => casToIasKt(TABLE, 0), 'speed-not-positive');
  });
});

describe('checkPositionErrorTable', () => {
  it.each<[string, unknown]>([
    ['empty', []],
    ['a single point', [{ iasKt: 50, casKt: 55 }]],
    ['not an array', { iasKt: 50, casKt: 55 }],
    ['IAS not increasing', [{ iasKt: 50, casKt: 55 }, { iasKt: 50, casKt: 60 }]],
    ['CAS not increasing', [{ iasKt: 50, casKt: 55 }, { iasKt: 60, casKt: 54 }]],
    ['a NaN', [{ iasKt: 50, casKt: 55 }, { iasKt: Number.NaN, casKt: 60 }]],
    ['a negative speed', [{ iasKt: -50, casKt: 55 }, { iasKt: 60, casKt: 60 }]],
    ['a missing speed', [{ iasKt: 50, casKt: 55 }, { iasKt: 60 }]],
    ['a null point', [{ iasKt: 50, casKt: 55 }, null]],
  ])('refuses a table with %s', (_, table) => {
    expectAeroError(() => checkPositionErrorTable(table as PositionErrorTable), 'invalid-table');
    expectAeroError(() => iasToCasKt(table as PositionErrorTable, 55), 'invalid-table');
  });

  it('names the offending point', () => {
    const error = expectAeroError(() => checkPositionErrorTable([TABLE[0], TABLE[1], { iasKt: 65, casKt: 80 }]), 'invalid-table');
    expect(error.field).toBe('positionErrorTable[2]');
    expect(error.message).toMatch(/point 3 \(65\.0 KIAS, 80\.0 KCAS\) does not rise strictly above point 2/);
  });

  it('accepts a valid table', () => {
    expect(() => checkPositionErrorTable(TABLE)).not.toThrow();
  });
});
