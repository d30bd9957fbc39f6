import { cardInputsFrom, parseTyped, type CardFormValue } from './card-form';
import { CANONICAL_UNITS, formatInUnit, fromCanonical, toCanonical, type UnitChoice } from './card-units';

// Published conversion factors (flight-physics.md, "Constants"): 1 kt = 1.852 km/h exactly
// (international nautical mile, 1852 m), 1 ft = 0.3048 m exactly, 1 inHg = 33.8639 hPa
// (conventional), 1 lb = 0.45359237 kg exactly (international pound); °F = °C × 9/5 + 32, and a
// temperature difference of 1 °C is 9/5 °F (definition of the Fahrenheit degree).
const KMH_PER_KT = 1.852;
const M_PER_FT = 0.3048;
const HPA_PER_INHG = 33.8639;
const KG_PER_LB = 0.45359237;

const NO_WIND = { runwayHeading: '', windDirection: '', windSpeed: '', windGust: '' };

function formValue(overrides: Partial<CardFormValue> = {}): CardFormValue {
  return {
    configuration: 'takeoff-flap',
    weight: '1000',
    landingWeight: '',
    departure: { elevation: '0', qnh: '1013', oat: '15', dewPoint: '', ...NO_WIND },
    hasArrival: false,
    arrival: { elevation: '0', qnh: '1013', oat: '15', dewPoint: '', ...NO_WIND },
    isaDeviation: '0',
    cruiseKind: 'ias',
    cruiseIas: '100',
    cruiseMach: '',
    altitudeStepFt: 1000,
    icing: false,
    ...overrides,
  };
}

describe('card units', () => {
  it('converts each unit to the canonical one by the published factors', () => {
    expect(toCanonical('km/h', 185.2, 'speed')).toBeCloseTo(185.2 / KMH_PER_KT, 9);
    expect(toCanonical('m', 1000, 'length')).toBeCloseTo(1000 / M_PER_FT, 9);
    expect(toCanonical('inHg', 29.92, 'pressure')).toBeCloseTo(29.92 * HPA_PER_INHG, 3);
    expect(toCanonical('lb', 2425, 'mass')).toBeCloseTo(2425 * KG_PER_LB, 9);
    expect(toCanonical('°F', 59, 'temperature')).toBeCloseTo(15, 9);
    expect(toCanonical('°F', -40, 'temperature')).toBeCloseTo(-40, 9);
    // A deviation is a difference: +9 °F above ISA is +5 °C, with no 32° offset.
    expect(toCanonical('°F', 9, 'temperatureDifference')).toBeCloseTo(5, 9);
    expect(toCanonical('kt', 120, 'speed')).toBe(120);
  });

  it('converts back for display and rounds to what each unit is read to', () => {
    expect(fromCanonical('km/h', 100, 'speed')).toBeCloseTo(100 * KMH_PER_KT, 9);
    expect(fromCanonical('lb', 1100, 'mass')).toBeCloseTo(1100 / KG_PER_LB, 9);
    expect(formatInUnit('lb', fromCanonical('lb', 1100, 'mass'))).toBe('2425');
    expect(formatInUnit('inHg', fromCanonical('inHg', 1013, 'pressure'))).toBe(String(Math.round((1013 / HPA_PER_INHG) * 100) / 100));
    expect(formatInUnit('°F', fromCanonical('°F', -5, 'temperatureDifference'))).toBe('-9');
  });

  it('reads a point or a comma as decimal separator and nothing else as a number', () => {
    expect(parseTyped('1013,2')).toBe(1013.2);
    expect(parseTyped(' 29.92 ')).toBe(29.92);
    expect(parseTyped('-3')).toBe(-3);
    expect(parseTyped('12a')).toBeNull();
    expect(parseTyped('1e3')).toBeNull();
    expect(parseTyped('')).toBeNull();
  });

  it('turns a form typed in lb, m, inHg, °F and km/h into canonical card inputs', () => {
    const units: UnitChoice = {
      ...CANONICAL_UNITS,
      weight: 'lb',
      departureElevation: 'm',
      departureQnh: 'inHg',
      departureOat: '°F',
      departureDewPoint: '°F',
      isaDeviation: '°F',
      cruiseIas: 'km/h',
    };
    const reading = cardInputsFrom(
      formValue({ weight: '2300', departure: { elevation: '450', qnh: '29.92', oat: '68', dewPoint: '50', ...NO_WIND }, isaDeviation: '9', cruiseIas: '200' }),
      units,
      7,
    );
    expect(reading.problems).toBeNull();
    const inputs = reading.inputs!;
    expect(inputs.airframeId).toBe(7);
    expect(inputs.weightKg).toBeCloseTo(2300 * KG_PER_LB, 9);
    expect(inputs.departure.elevationFt).toBeCloseTo(450 / M_PER_FT, 9);
    expect(inputs.departure.qnhHpa).toBeCloseTo(29.92 * HPA_PER_INHG, 3);
    expect(inputs.departure.oatC).toBeCloseTo(20, 9);
    expect(inputs.departure.dewPointC).toBeCloseTo(10, 9);
    expect(inputs.isaDeviationC).toBeCloseTo(5, 9);
    expect(inputs.cruise).toEqual({ iasKt: expect.closeTo(200 / KMH_PER_KT, 9) });
    expect(inputs).not.toHaveProperty('landingWeightKg');
    expect(inputs).not.toHaveProperty('arrival');
  });

  it('names each field it cannot read, in the unit chosen for it', () => {
    const reading = cardInputsFrom(formValue({ weight: '', cruiseIas: 'fast' }), { ...CANONICAL_UNITS, weight: 'lb' }, 7);
    expect(reading.inputs).toBeNull();
    expect(reading.problems).toEqual({
      weight: 'Give the takeoff weight in lb.',
      cruiseIas: 'Type the cruise IAS as a number in kt, such as 120.',
    });
  });
});
