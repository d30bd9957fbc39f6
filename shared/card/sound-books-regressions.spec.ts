/**
 * One regression test per defect listed in issue 11's first section; each failed on the code
 * before the issue. Figures are the demo books' (invented demo data — not for flight).
 */
import { isaDeviationC } from '../aero';
import { demoLightTwinJetContent, demoPistonTrainerContent, demoTwinTurbopropContent } from '../speed-book/demo-content';
import { revisionContentProblems, revisionContentSchema, type RevisionContent } from '../speed-book/revision-content';
import { buildCard, takeoffConfigurationKeys } from './build-card';
import { CardRefusedError, type CardInputs, type SpeedCard } from './card';
import { sweepEnvelope } from './coverage';
import { enRouteDeviationCheck, isaDeviationFromTat } from './en-route-deviation';
import { HAND_CONTEXT, revisionOf } from './testing/test-fixtures';

function inputs(content: RevisionContent, overrides: Partial<CardInputs> = {}): CardInputs {
  return {
    airframeId: HAND_CONTEXT.airframe.id,
    weightKg: content.weights.maximumLandingKg,
    configuration: takeoffConfigurationKeys(content)[0],
    departure: { elevationFt: 0, qnhHpa: 1013.25, oatC: 15 },
    isaDeviationC: 0,
    cruise: { mach: 0.3 },
    altitudeStepFt: 5000,
    ...overrides,
  };
}
const card = (content: RevisionContent, overrides: Partial<CardInputs> = {}): SpeedCard => buildCard(revisionOf(content), inputs(content, overrides), HAND_CONTEXT);
const speed = (c: SpeedCard, code: string) => c.speeds.find((s) => s.code === code)!;
function refusal(content: RevisionContent, overrides: Partial<CardInputs>): CardRefusedError {
  try {
    card(content, overrides);
  } catch (error) {
    if (error instanceof CardRefusedError) return error;
    throw error;
  }
  throw new Error('expected a refusal');
}

describe('issue 11: a sea-level field on a high-pressure or cold day gets a card', () => {
  it('the jet at a sea-level field with QNH 1020 hPa (pressure altitude −184 ft, ICAO altimeter law) gets a card', () => {
    const c = card(demoLightTwinJetContent(), { departure: { elevationFt: 0, qnhHpa: 1020, oatC: 15 } });
    expect(c.departure.pressureAltitudeFt).toBe(-184);
  });

  it('the turboprop at QNH 1014 hPa gets a card', () => {
    expect(card(demoTwinTurbopropContent(), { departure: { elevationFt: 0, qnhHpa: 1014, oatC: 15 } }).departure.pressureAltitudeFt).toBeLessThan(0);
  });

  it('at −35 °C on the ramp with QNH 1040 the card is given: density altitude (about −8,000 ft) is a figure, not a refusal', () => {
    const c = card(demoLightTwinJetContent(), { departure: { elevationFt: 0, qnhHpa: 1040, oatC: -35 } });
    // Below the old −2 km (−6,562 ft) floor of the model; ICAO Doc 7488 tabulates to −5 km.
    expect(c.departure.densityAltitudeFt).toBeLessThan(-6562);
  });
});

describe('issue 11: speeds in their natural order at every weight', () => {
  it('the jet at 3,400 kg: V1 ≤ VR ≤ V2 (was V2 97 < VR 98)', () => {
    const c = card(demoLightTwinJetContent(), { weightKg: 3400 });
    expect(speed(c, 'V1').iasKt).toBeLessThanOrEqual(speed(c, 'VR').iasKt);
    expect(speed(c, 'VR').iasKt).toBeLessThanOrEqual(speed(c, 'V2').iasKt);
  });

  it('the turboprop at 4,000 kg: VR ≤ V2 (was V2 92 < VR 95)', () => {
    const c = card(demoTwinTurbopropContent(), { weightKg: 4000 });
    expect(speed(c, 'VR').iasKt).toBeLessThanOrEqual(speed(c, 'V2').iasKt);
  });

  it('at the lowest weight V2 ≥ 1.1 × VMC and VREF ≥ VMC (CS 25.107(b), 14 CFR 23.73; from memory)', () => {
    for (const content of [demoLightTwinJetContent(), demoTwinTurbopropContent()]) {
      const c = card(content, { weightKg: content.weights.minimumKg });
      expect(speed(c, 'V2').casKt).toBeGreaterThanOrEqual(1.1 * c.limits.vmc!.casKt - 1);
      expect(speed(c, 'VREF').casKt).toBeGreaterThanOrEqual(c.limits.vmc!.casKt);
    }
  });

  it('a book that still breaks V1 ≤ VR ≤ V2 (the old jet V2, scaled from 118 KCAS) is refused on the card and found by the sweep', () => {
    const old = demoLightTwinJetContent();
    old.speeds = old.speeds.map((s) => (s.code === 'V2' ? { code: 'V2', label: 'Takeoff safety speed', phase: 'takeoff', configurationKey: 'takeoff-flap', basis: 'cas', kind: 'scaled', referenceKt: 118 } : s));
    const error = refusal(old, { weightKg: 3400 });
    expect(error.code).toBe('ordering-rule-broken');
    expect(error.message).toMatch(/V1 ≤ VR ≤ V2/);
    const report = sweepEnvelope(revisionContentSchema.parse(old));
    expect(report.passes).toBe(false);
    expect(report.rules.map((rule) => rule.ruleId)).toContain('v1-vr-v2');
    // With the flight manual's reason recorded, the rule no longer blocks, and the card is given.
    // The old V2 also fell below 1.1 × VMC at light weights (99.3 < 104.3 KCAS at 3,400 kg).
    expect(report.rules.map((rule) => rule.ruleId)).toContain('v2-vmc');
    old.ruleExceptions = [{ ruleId: 'v1-vr-v2', reason: 'Flight manual section 5 gives V2 at light weights below VR.' }];
    const partly = sweepEnvelope(revisionContentSchema.parse(old));
    expect(partly.rules.find((rule) => rule.ruleId === 'v1-vr-v2')?.exception).toMatch(/section 5/);
    expect(partly.passes).toBe(false); // v2-vmc still blocks
    expect(refusal(old, { weightKg: 3400 }).message).toMatch(/V2 ≥ 1\.1 × VMC/);
    old.ruleExceptions.push({ ruleId: 'v2-vmc', reason: 'Flight manual section 5: V2 at light weights is limited by VMCA with the stated bank.' });
    const excepted = sweepEnvelope(revisionContentSchema.parse(old));
    expect(excepted.counts.ruleBroken).toBeGreaterThan(0); // still drawn as rule-broken for the approver
    expect(excepted.passes).toBe(true);
    expect(() => card(old, { weightKg: 3400 })).not.toThrow();
  });
});

describe('issue 11: review accepts nothing the card refuses (one rule set)', () => {
  it('the old trainer (flaps-30° table from 40 KCAS) is refused at review, where the card at 700 kg was refused: VS0 39.4 KCAS', () => {
    const old = demoPistonTrainerContent();
    old.configurations[2].positionError[0] = { iasKt: 30, casKt: 40 };
    expect(Object.values(revisionContentProblems(old)).join(' ')).toMatch(/VS0 runs from 39\.3\d? to 49\.3\d? kt CAS over the weight range, outside the landing-flap position-error table \(40 to 93 kt CAS\)/);
  });

  it('the demo trainer at its own minimum weight (700 kg) gets a card', () => {
    expect(card(demoPistonTrainerContent(), { weightKg: 700 }).speeds.length).toBeGreaterThan(0);
  });

  it('a bank-angle stall line beyond the position-error table leaves that line out; the card is given and the weight is not blamed', () => {
    const content = demoPistonTrainerContent();
    content.speeds = content.speeds.map((s) => (s.code === 'VS1' && s.kind === 'scaled' ? { ...s, referenceKt: 120 } : s));
    const c = card(content, { weightKg: 1100 });
    // VS1 120 KIAS is 119 KCAS; ×√2 at 60° (n = 1/cos 60°) is 168 KCAS, beyond the table's 157.
    expect(c.stallInTurn.map((line) => line.bankDeg)).toEqual([0, 15, 30, 45]);
  });
});

describe('issue 11: landing weight', () => {
  it('the jet at 4,800 kg (MLW 4,400) lands at the maximum landing weight, and the card says so in words', () => {
    const c = card(demoLightTwinJetContent(), { weightKg: 4800 });
    expect(c.landing).toMatchObject({ source: 'maximum-landing-weight', weightKg: 4400 });
    expect(c.landing.statement).toMatch(/above the maximum landing weight, so the landing speeds are for the maximum landing weight, 4,400 kg/);
    expect(speed(c, 'VREF').weightKg).toBe(4400);
  });

  it('always shows the landing weight it used: the one entered, or the takeoff weight within MLW', () => {
    expect(card(demoLightTwinJetContent(), { weightKg: 4000 }).landing).toMatchObject({ source: 'takeoff-weight', weightKg: 4000 });
    expect(card(demoLightTwinJetContent(), { weightKg: 4800, landingWeightKg: 3900 }).landing).toMatchObject({ source: 'entered', weightKg: 3900 });
  });
});

describe('issue 11: speeds by class, not spelling', () => {
  it('"VSO" and "VS1G" are stall speeds: rounded up, shown as spelt, and VSO starts the white arc', () => {
    const content = demoPistonTrainerContent();
    content.speeds = content.speeds.map((s) => (s.code === 'VS0' ? { ...s, code: 'VSO' } : s.code === 'VS1' ? { ...s, code: 'VS1G' } : s));
    const c = card(content, { weightKg: 1000 });
    expect(speed(c, 'VSO').rounding).toBe('stall-up');
    expect(speed(c, 'VS1G').rounding).toBe('stall-up');
    const white = c.indicator.arcs.find((arc) => arc.colour === 'white')!;
    expect(white.fromKt).toBe(speed(c, 'VSO').iasKt);
  });

  it('the white arc ends at the landing flap’s VFE (85), not the highest VFE (110) — 14 CFR 23.1545 (from memory)', () => {
    const c = card(demoPistonTrainerContent(), { weightKg: 1000 });
    expect(c.indicator.arcs.find((arc) => arc.colour === 'white')!.toKt).toBe(85);
  });

  it('VA (a limit) rounds down, V2 and VREF (minimum speeds) up, and MMO 0.7855 prints as 0.785', () => {
    expect(speed(card(demoPistonTrainerContent(), { weightKg: 1000 }), 'VA').rounding).toBe('limit-down');
    const jet = demoLightTwinJetContent();
    jet.limits.mmo = 0.7855;
    const c = card(jet, { weightKg: 4000 });
    expect(speed(c, 'V2').rounding).toBe('stall-up');
    expect(speed(c, 'VREF').rounding).toBe('stall-up');
    expect(c.limits.mmo).toBe(0.785);
  });
});

describe('issue 11: the en-route atmosphere and the altitude range', () => {
  it('an en-route ISA deviation more than 20 °C from the departure’s asks for confirmation (OAT +40 °C at sea level is ISA +25; ISA −30 differs by 55)', () => {
    const departureC = isaDeviationC(0, 40);
    expect(enRouteDeviationCheck(departureC, -30)).toMatch(/differs from the departure's \(ISA \+25 °C\) by 55 °C/);
    expect(enRouteDeviationCheck(departureC, 10)).toBeNull();
  });

  it('an IAS cruise that would be supersonic shows a dash with its reason, never a figure', () => {
    const jet = demoLightTwinJetContent();
    jet.configurations[0].positionError.push({ iasKt: 450, casKt: 445 }); // a table reaching 450 KIAS
    jet.limits.vmoKt = 440;
    const c = card(jet, { cruise: { iasKt: 400 }, altitudeStepFt: 10000 });
    const top = c.altitudeTable[c.altitudeTable.length - 1];
    expect(top).toMatchObject({ pressureAltitudeFt: 41000, mach: null, tasKt: null });
    expect(top.cruiseNote).toMatch(/at or above Mach 1/);
  });

  it('a departure above the book’s declared altitude range (the turboprop to 8,000 ft) is refused with that reason', () => {
    const error = refusal(demoTwinTurbopropContent(), { departure: { elevationFt: 9000, qnhHpa: 1013.25, oatC: 0 } });
    expect(error.code).toBe('outside-book-envelope');
    expect(error.field).toBe('departure.elevationFt');
    expect(error.message).toBe("The day is outside this book's takeoff envelope: the departure pressure altitude of 9,000 ft is above its range of −1,000 to 8,000 ft.");
  });
});

describe('issue 11: an en-route deviation from a TAT reading', () => {
  it('TAT −30 °C at Mach 0.78 and 35,000 ft is SAT −56.4 °C, ISA −2.0 °C (SAT = TAT/(1 + 0.2·K·M²), NASA RP 1046; ISA −54.34 °C there, ISO 2533)', () => {
    const { satC, isaDeviationC: deviation } = isaDeviationFromTat({ tatC: -30, pressureAltitudeFt: 35000, mach: 0.78 });
    expect(satC).toBeCloseTo(-56.377, 2);
    expect(deviation).toBeCloseTo(-56.377 + 54.344, 2);
  });

  it('uses the book’s recovery factor', () => {
    expect(isaDeviationFromTat({ tatC: -30, pressureAltitudeFt: 35000, mach: 0.78, recoveryFactor: 0.8 }).satC).toBeCloseTo(221.5805 - 273.15, 3);
  });
});

describe('issue 11: a cold surface day carried aloft', () => {
  it('dashes the rows whose temperature leaves the atmosphere model, and still gives the card (ISA −46 °C at 41,000 ft is −102.5 °C)', () => {
    const c = card(demoLightTwinJetContent(), { departure: { elevationFt: 0, qnhHpa: 1035, oatC: -30 }, isaDeviationC: -46, altitudeStepFt: 10000 });
    const top = c.altitudeTable[c.altitudeTable.length - 1];
    expect(top).toMatchObject({ pressureAltitudeFt: 41000, oatC: -102.5, casKt: null, tasKt: null, mach: null, limitKind: null });
    expect(top.cruiseNote).toMatch(/^At 41,000 ft: The temperature at ISA -46\.0 °C of -102\.5 °C .* is not plausible/);
    expect(c.altitudeTable[0]).toMatchObject({ pressureAltitudeFt: 0, cruiseNote: null });
  });
});

describe('issue 11: density altitude is a figure, never a refusal', () => {
  it('air denser than ISA at −5 km (−90 °C at a sea-level field, QNH 1100 hPa: 2.09 kg/m³ against 1.93) gives a card without a density altitude', () => {
    const content = demoPistonTrainerContent();
    content.envelope = {
      takeoff: { pressureAltitudeFt: { min: -3000, max: 10000 }, oatC: { min: -100, max: 50 } },
      landing: { pressureAltitudeFt: { min: -3000, max: 10000 }, oatC: { min: -100, max: 50 } },
    };
    const c = card(content, { weightKg: 1000, departure: { elevationFt: 0, qnhHpa: 1100, oatC: -90 } });
    expect(c.departure.densityAltitudeFt).toBeNull();
    expect(c.departure.highDensityAltitude).toBe(false);
    expect(c.speeds.length).toBeGreaterThan(0);
  });
});
