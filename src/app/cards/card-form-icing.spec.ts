import { buildCard } from '@shared/card';
import { demoTwinTurbopropContent } from '@shared/speed-book/demo-content';
import { contentSha256 } from '@shared/speed-book/canonical';
import { cardInputsFrom, type CardFormValue } from './card-form';
import { CANONICAL_UNITS } from './card-units';

/** The card form's "Icing conditions" checkbox into card inputs, and the card it gives. Invented demo data — not for flight. */
const NO_WIND = { runwayHeading: '', windDirection: '', windSpeed: '', windGust: '' };

function formValue(overrides: Partial<CardFormValue> = {}): CardFormValue {
  return {
    configuration: 'takeoff-flap',
    weight: '4600',
    landingWeight: '',
    departure: { elevation: '0', qnh: '1013.25', oat: '15', dewPoint: '', ...NO_WIND },
    hasArrival: false,
    arrival: { elevation: '0', qnh: '1013', oat: '15', dewPoint: '', ...NO_WIND },
    isaDeviation: '0',
    cruiseKind: 'ias',
    cruiseIas: '200',
    cruiseMach: '',
    altitudeStepFt: 5000,
    icing: false,
    ...overrides,
  };
}

describe('the card form’s icing conditions', () => {
  it('leaves icing out of the inputs when not ticked, so the card keeps its digest', () => {
    const { inputs } = cardInputsFrom(formValue(), CANONICAL_UNITS, 7);
    expect(inputs).not.toBeNull();
    expect('icing' in inputs!).toBe(false);
  });

  it('puts icing: true in the inputs when ticked, and the card shows VREF 97 → 107 kt on the demo turboprop', () => {
    const { inputs } = cardInputsFrom(formValue({ icing: true }), CANONICAL_UNITS, 7);
    expect(inputs?.icing).toBe(true);
    const content = demoTwinTurbopropContent();
    const card = buildCard(
      { id: 1, number: 1, publishedAt: null, contentSha256: contentSha256(content), content },
      inputs!,
      { airframe: { id: 7, registration: 'ZZ-KFB' }, aircraftType: { designator: 'ZZT2', name: 'Demo turboprop' }, speedBook: { id: 1, title: 'Demo' }, demo: true },
    );
    // VREF tabulated 97 kt IAS at 4,600 kg, +10 kt ice increment for the landing configuration (invented demo data).
    expect(card.icing?.speeds.find((speed) => speed.code === 'VREF')).toMatchObject({ iasKt: 97, icedIasKt: 107, incrementKt: 10 });
  });
});
