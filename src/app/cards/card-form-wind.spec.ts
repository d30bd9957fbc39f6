import { COMMON_PRACTICE_APPROACH_POLICY } from '@shared/card';
import { cardInputsFrom, formFieldOfRefusal, type CardFormValue } from './card-form';
import { CANONICAL_UNITS } from './card-units';

/** The card form's wind fields into card inputs (the figures are as typed: degrees and kt, no conversion). */
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

describe('the card form’s wind', () => {
  it('gives no wind and no policy when the wind fields are empty', () => {
    const { inputs } = cardInputsFrom(formValue(), CANONICAL_UNITS, 7, COMMON_PRACTICE_APPROACH_POLICY);
    expect(inputs?.departure).toEqual({ elevationFt: 0, qnhHpa: 1013, oatC: 15 });
    expect(inputs?.approachAdditivePolicy).toBeUndefined();
  });

  it('reads the runway and wind (a comma as decimal point) and puts the operator’s policy in where the card lands', () => {
    const departure = { elevation: '0', qnh: '1013', oat: '15', dewPoint: '', runwayHeading: '270', windDirection: '300', windSpeed: '20', windGust: '30,5' };
    const { inputs } = cardInputsFrom(formValue({ departure }), CANONICAL_UNITS, 7, COMMON_PRACTICE_APPROACH_POLICY);
    expect(inputs?.departure).toMatchObject({ runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30.5 } });
    expect(inputs?.approachAdditivePolicy).toEqual(COMMON_PRACTICE_APPROACH_POLICY);
    // With a separate arrival without wind, the departure's wind is for the takeoff only: no policy.
    const withArrival = cardInputsFrom(formValue({ departure, hasArrival: true }), CANONICAL_UNITS, 7, COMMON_PRACTICE_APPROACH_POLICY);
    expect(withArrival.inputs?.approachAdditivePolicy).toBeUndefined();
  });

  it('names the wind field that is missing or not a number', () => {
    const departure = { elevation: '0', qnh: '1013', oat: '15', dewPoint: '', runwayHeading: '270', windDirection: 'W', windSpeed: '', windGust: '' };
    const { problems } = cardInputsFrom(formValue({ departure }), CANONICAL_UNITS, 7, COMMON_PRACTICE_APPROACH_POLICY);
    expect(problems).toEqual({
      'departure.windDirection': 'Type the departure wind direction in degrees as a number, such as 300.',
      'departure.windSpeed': 'Give the departure wind speed in kt with the rest of the wind, or leave all the wind fields empty.',
    });
  });

  it('points a refusal of a wind input at its field', () => {
    expect(formFieldOfRefusal('arrival.runwayHeadingDeg')).toBe('arrival.runwayHeading');
    expect(formFieldOfRefusal('departure.wind.gustKt')).toBe('departure.windGust');
    expect(formFieldOfRefusal('departure.wind')).toBe('departure.windDirection');
    expect(formFieldOfRefusal('approachAdditivePolicy')).toBeNull();
  });
});
