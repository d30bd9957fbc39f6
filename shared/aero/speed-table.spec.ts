import fc from 'fast-check';
import { type SpeedTable, checkSpeedTable, interpolateSpeedTableKt } from './speed-table';
import { expectAeroError, expectRelative } from './testing/test-helpers';

// Invented demo data — not for flight.
const BY_WEIGHT: SpeedTable = { byWeightKg: [900, 1000, 1200], valuesKt: [55, 58, 63] };
const BY_ALL: SpeedTable = {
  byWeightKg: [5000, 6000],
  byPressureAltitudeFt: [0, 4000],
  byOatC: [0, 40],
  valuesKt: [
    [
      [100, 102],
      [101, 104],
    ],
    [
      [108, 110],
      [109, 112],
    ],
  ],
};

/** A speed that is linear in weight, altitude and temperature: reproduced exactly by multilinear interpolation. */
const linearKt = (weightKg: number, altitudeFt: number, oatC: number) => 40 + 0.01 * weightKg + 0.002 * altitudeFt + 0.1 * oatC;

// Flight-manual tables are read by linear interpolation between entries (FAA PHAK); the checks
// follow from the definition of (multi)linear interpolation (common practice, no outside source).
describe('interpolateSpeedTableKt', () => {
  it('against weight: exact at the entries, linear between', () => {
    expect(interpolateSpeedTableKt(BY_WEIGHT, { weightKg: 1000 })).toBe(58);
    expect(interpolateSpeedTableKt(BY_WEIGHT, { weightKg: 1100 })).toBeCloseTo(60.5, 12);
    expect(interpolateSpeedTableKt(BY_WEIGHT, { weightKg: 950, pressureAltitudeFt: 9000 })).toBeCloseTo(56.5, 12);
  });

  it('against weight × altitude × temperature: the centre of the cube is the mean of its corners', () => {
    expect(interpolateSpeedTableKt(BY_ALL, { weightKg: 5500, pressureAltitudeFt: 2000, oatC: 20 })).toBeCloseTo(105.75, 12);
    expect(interpolateSpeedTableKt(BY_ALL, { weightKg: 6000, pressureAltitudeFt: 4000, oatC: 0 })).toBe(109);
  });

  it('against weight × altitude and weight × temperature', () => {
    const byAltitude: SpeedTable = { byWeightKg: [1000, 2000], byPressureAltitudeFt: [0, 8000], valuesKt: [[60, 64], [70, 76]] };
    expect(interpolateSpeedTableKt(byAltitude, { weightKg: 1500, pressureAltitudeFt: 4000 })).toBeCloseTo(67.5, 12);
    const byOat: SpeedTable = { byWeightKg: [1000, 2000], byOatC: [-20, 40], valuesKt: [[60, 66], [70, 76]] };
    expect(interpolateSpeedTableKt(byOat, { weightKg: 1000, oatC: 10 })).toBeCloseTo(63, 12);
  });

  it('reproduces a speed linear in every axis anywhere inside a random grid (property, fast-check)', () => {
    const axis = (min: number, max: number) =>
      fc.uniqueArray(fc.integer({ min, max }), { minLength: 2, maxLength: 5 }).map((values) => [...values].sort((a, b) => a - b));
    fc.assert(
      fc.property(axis(500, 9000), axis(-2000, 14000), axis(-40, 50), fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), (weights, altitudes, temperatures, [u, v, w]) => {
        const table: SpeedTable = {
          byWeightKg: weights,
          byPressureAltitudeFt: altitudes,
          byOatC: temperatures,
          valuesKt: weights.map((weightKg) => altitudes.map((altitudeFt) => temperatures.map((oatC) => linearKt(weightKg, altitudeFt, oatC)))),
        };
        const inside = (values: number[], fraction: number) => Math.min(values[values.length - 1], values[0] + fraction * (values[values.length - 1] - values[0]));
        const query = { weightKg: inside(weights, u), pressureAltitudeFt: inside(altitudes, v), oatC: inside(temperatures, w) };
        expectRelative(interpolateSpeedTableKt(table, query), linearKt(query.weightKg, query.pressureAltitudeFt, query.oatC), 1e-9);
      }),
    );
  });

  it('never extrapolates', () => {
    expectAeroError(() => interpolateSpeedTableKt(BY_WEIGHT, { weightKg: 1250 }), 'outside-table');
    expectAeroError(() => interpolateSpeedTableKt(BY_ALL, { weightKg: 5500, pressureAltitudeFt: 4500, oatC: 20 }), 'outside-table');
    const error = expectAeroError(() => interpolateSpeedTableKt(BY_ALL, { weightKg: 5500, pressureAltitudeFt: 2000, oatC: 45 }), 'outside-table');
    expect(error.message).toBe("A temperature of 45.0 °C is outside the flight manual's table (0.0 to 40.0 °C); the speed cannot be given there.");
    expect(error.field).toBe('oatC');
  });

  it('asks for the inputs the table needs, and refuses NaN and weights at or below zero', () => {
    expectAeroError(() => interpolateSpeedTableKt(BY_ALL, { weightKg: 5500, oatC: 20 }), 'missing-input');
    expectAeroError(() => interpolateSpeedTableKt(BY_ALL, { weightKg: 5500, pressureAltitudeFt: 1000 }), 'missing-input');
    expectAeroError(() => interpolateSpeedTableKt(BY_WEIGHT, { weightKg: Number.NaN }), 'not-a-number');
    expectAeroError(() => interpolateSpeedTableKt(BY_WEIGHT, { weightKg: 0 }), 'weight-not-positive');
  });
});

describe('checkSpeedTable', () => {
  it.each<[string, unknown]>([
    ['a one-entry axis', { byWeightKg: [900], valuesKt: [55] }],
    ['a decreasing axis', { byWeightKg: [1000, 900], valuesKt: [55, 58] }],
    ['a NaN on an axis', { byWeightKg: [900, Number.NaN], valuesKt: [55, 58] }],
    ['too few values', { byWeightKg: [900, 1000, 1100], valuesKt: [55, 58] }],
    ['a flat list where a grid is needed', { byWeightKg: [900, 1000], byOatC: [0, 10], valuesKt: [55, 58] }],
    ['a ragged grid', { byWeightKg: [900, 1000], byOatC: [0, 10], valuesKt: [[55, 56], [58]] }],
    ['a speed of zero', { byWeightKg: [900, 1000], valuesKt: [0, 58] }],
    ['a speed that is not a number', { byWeightKg: [900, 1000], valuesKt: ['55', 58] }],
  ])('refuses %s', (_, table) => {
    expectAeroError(() => checkSpeedTable(table as SpeedTable), 'invalid-table');
  });

  it('refuses a weight axis at or below zero', () => {
    expectAeroError(() => checkSpeedTable({ byWeightKg: [-100, 1000], valuesKt: [50, 58] }), 'weight-not-positive');
  });

  it('accepts valid tables', () => {
    expect(() => checkSpeedTable(BY_WEIGHT)).not.toThrow();
    expect(() => checkSpeedTable(BY_ALL)).not.toThrow();
  });
});
