import fc from 'fast-check';
import {
  STATED_DECIMALS,
  describeFigure,
  describeFigures,
  fromCanonical,
  quantityAtPath,
  restateFigures,
  statedUnitWords,
  statedUnitsOf,
  toCanonical,
  type StatedUnits,
} from './stated-units';

const LB_MPH: StatedUnits = { weight: 'lb', speed: 'mph' };
const KG_KMH: StatedUnits = { weight: 'kg', speed: 'kmh' };
const KG_KT: StatedUnits = { weight: 'kg', speed: 'kt' };

describe('stated units: conversions', () => {
  it('converts pounds with the exact factor of the 1959 international yard and pound agreement (1 lb = 0.453 592 37 kg)', () => {
    expect(toCanonical(1, 'weight', LB_MPH)).toBe(0.45359237);
    expect(toCanonical(2500, 'weight', LB_MPH)).toBeCloseTo(1133.980925, 9);
  });

  it('converts mph with the exact mile (1 609.344 m, 1959 agreement) over the nautical mile (1 852 m, SI brochure)', () => {
    expect(toCanonical(1852, 'speed', LB_MPH)).toBeCloseTo(1609.344, 9);
    // 100 kt = 115.077 944 8… mph (1852 / 1609.344 · 100)
    expect(fromCanonical(100, 'speed', LB_MPH)).toBe(115.0779);
  });

  it('converts km/h with 1 kt = 1.852 km/h exactly (SI definition of the nautical mile)', () => {
    expect(toCanonical(185.2, 'speed', KG_KMH)).toBeCloseTo(100, 12);
    expect(fromCanonical(100, 'speed', KG_KMH)).toBe(185.2);
  });

  it('passes kg and kt through untouched, unrounded', () => {
    expect(toCanonical(123.456789, 'speed', KG_KT)).toBe(123.456789);
    expect(fromCanonical(1000.123456789, 'weight', KG_KT)).toBe(1000.123456789);
  });

  it('gives back any figure entered in mph, km/h or lb exactly after storing it canonical (fast-check)', () => {
    // Any figure a flight manual prints: up to 999 999.9999 with at most four decimals.
    const figure = fc.integer({ min: 1, max: 9_999_999_999 }).map((n) => n / 10 ** STATED_DECIMALS);
    const units = fc.record({ weight: fc.constantFrom('kg' as const, 'lb' as const), speed: fc.constantFrom('kt' as const, 'mph' as const, 'kmh' as const) });
    fc.assert(
      fc.property(figure, units, fc.constantFrom('weight' as const, 'speed' as const), (entered, stated, quantity) => {
        const stored = toCanonical(entered, quantity, stated);
        const storedAfterJson = JSON.parse(JSON.stringify(stored)) as number;
        expect(fromCanonical(storedAfterJson, quantity, stated)).toBe(entered);
        // a second save of the shown figure stores the same number again: no drift
        expect(toCanonical(fromCanonical(stored, quantity, stated), quantity, stated)).toBe(stored);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('stated units: reading and describing', () => {
  it('reads a content’s stated units, kg and kt when it has none or a wrong one', () => {
    expect(statedUnitsOf({ statedUnits: { weight: 'lb', speed: 'mph' } })).toEqual(LB_MPH);
    expect(statedUnitsOf({})).toEqual(KG_KT);
    expect(statedUnitsOf(null)).toEqual(KG_KT);
    expect(statedUnitsOf({ statedUnits: { weight: 'stone', speed: 'kmh' } })).toEqual(KG_KMH);
  });

  it('names the stated figure first and the stored one beside it', () => {
    expect(describeFigure(toCanonical(161, 'speed', LB_MPH), 'speed', LB_MPH)).toBe('161 mph (139.9 kt)');
    expect(describeFigure(toCanonical(2300, 'weight', LB_MPH), 'weight', LB_MPH)).toBe('2300 lb (1043.3 kg)');
    expect(describeFigure(toCanonical(250, 'speed', KG_KMH), 'speed', KG_KMH)).toBe('250 km/h (135 kt)');
    expect(describeFigure(140, 'speed', KG_KT)).toBe('140 kt');
    expect(describeFigure(1043.25, 'weight', KG_KT)).toBe('1043.25 kg');
  });

  it('finds the quantity of a path in the schema’s and in the diff’s spelling', () => {
    expect(quantityAtPath('limits.vneKt')).toBe('speed');
    expect(quantityAtPath('limits.vfeKt.landing-flap')).toBe('speed');
    expect(quantityAtPath('limits.vfeKt.clean')).toBe('speed');
    expect(quantityAtPath('limits.mmo')).toBeNull();
    expect(quantityAtPath('speeds.0.valuesKt.1.2')).toBe('speed');
    expect(quantityAtPath('speeds[VR@takeoff-flap].byWeightKg.0')).toBe('weight');
    expect(quantityAtPath('configurations[clean].positionError.1.casKt')).toBe('speed');
    expect(quantityAtPath('configurations[clean].positionError')).toBeNull();
    expect(quantityAtPath('weights.minimumKg')).toBe('weight');
    expect(quantityAtPath('aircraft.ceilingFt')).toBeNull();
    expect(quantityAtPath('statedUnits.speed')).toBeNull();
  });

  it('describes every weight and speed inside a whole record or table', () => {
    const mph = (figure: number) => toCanonical(figure, 'speed', LB_MPH);
    expect(
      describeFigures({ code: 'VX', kind: 'tabulated', byWeightKg: [toCanonical(2000, 'weight', LB_MPH)], valuesKt: [[mph(70), mph(72)]], byOatC: [0] }, null, LB_MPH),
    ).toEqual({ code: 'VX', kind: 'tabulated', byWeightKg: ['2000 lb (907.2 kg)'], valuesKt: [['70 mph (60.8 kt)', '72 mph (62.6 kt)']], byOatC: [0] });
    expect(describeFigures({ vfeKt: { 'landing-flap': mph(100) }, mmo: 0.5 }, null, LB_MPH)).toEqual({ vfeKt: { 'landing-flap': '100 mph (86.9 kt)' }, mmo: 0.5 });
    expect(describeFigures([{ iasKt: mph(60), casKt: mph(63) }], null, LB_MPH)).toEqual([{ iasKt: '60 mph (52.1 kt)', casKt: '63 mph (54.7 kt)' }]);
  });
});

describe('stated units: sentences about stored figures', () => {
  it('restates kt and kg figures of a sentence in the stated units, the stored ones in brackets', () => {
    // 160 kt = 184.1247 mph; 1 100 kg = 2 425.0849 lb; 55.4 kt = 102.6 km/h (exact factors above).
    expect(restateFigures('VNE 160 kt is outside the clean table (35 to 150 kt IAS).', LB_MPH)).toBe(
      'VNE 184.12 mph (160 kt) is outside the clean table (40.28 to 172.62 mph (35 to 150 kt) IAS).',
    );
    expect(restateFigures('1,100 kg is outside the weight range.', LB_MPH)).toBe('2,425.08 lb (1,100 kg) is outside the weight range.');
    expect(restateFigures('55.4 kt at 1,100 kg', KG_KMH)).toBe('102.6 km/h (55.4 kt) at 1,100 kg');
    expect(restateFigures('VNE 160 kt at 1,100 kg, MMO 0.7', KG_KT)).toBe('VNE 160 kt at 1,100 kg, MMO 0.7');
  });

  it('names the stated units in a field’s words', () => {
    expect(statedUnitWords('Weights › minimum weight (kg)', LB_MPH)).toBe('Weights › minimum weight (lb)');
    expect(statedUnitWords('Limits › VFE of landing-flap (kt)', KG_KMH)).toBe('Limits › VFE of landing-flap (km/h)');
  });
});
