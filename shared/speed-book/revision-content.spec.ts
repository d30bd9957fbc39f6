import { demoLightTwinJetContent, demoPistonTrainerContent, demoTwinTurbopropContent } from './demo-content';
import { revisionContentProblems, revisionContentSchema, type RevisionContent, type TabulatedSpeed } from './revision-content';

/** The problems of the trainer's content after `change`; `{}` when none. */
function problemsAfter(change: (content: RevisionContent) => void, base = demoPistonTrainerContent): Record<string, string> {
  const content = base();
  change(content);
  return revisionContentProblems(content);
}

const speedIndex = (content: RevisionContent, code: string, configurationKey?: string) =>
  content.speeds.findIndex((s) => s.code === code && (configurationKey === undefined || s.configurationKey === configurationKey));

describe('revision content schema', () => {
  it.each([
    ['trainer', demoPistonTrainerContent],
    ['turboprop', demoTwinTurbopropContent],
    ['jet', demoLightTwinJetContent],
  ])('accepts the demo %s', (_name, make) => {
    expect(revisionContentProblems(make())).toEqual({});
    expect(revisionContentSchema.parse(make())).toEqual(make());
  });

  it('names missing and mistyped fields with a sentence each', () => {
    const problems = revisionContentProblems({ schemaVersion: 2, aircraft: { category: 'glider', engines: 1.5 } });
    expect(problems).toMatchObject({
      schemaVersion: 'This is revision content of schema version 1.',
      'aircraft.category': 'Choose piston-single, piston-twin, turboprop or jet.',
      'aircraft.engines': 'The number of engines must be a whole number.',
      'aircraft.ceilingFt': 'Give the ceiling.',
      weights: expect.any(String),
      configurations: 'Give the configurations as a list.',
    });
  });

  it('refuses fields it does not know', () => {
    expect(problemsAfter((c) => Object.assign(c.weights, { zeroFuelKg: 900 }))).toEqual({ 'weights.zeroFuelKg': 'This field is not expected here.' });
  });

  it('takes an ice increment of whole kt from 0 to 40 per configuration, and refuses others with a sentence', () => {
    expect(problemsAfter((c) => (c.configurations[2].iceIncrementKt = 0))).toEqual({});
    expect(problemsAfter((c) => (c.configurations[2].iceIncrementKt = 40))).toEqual({});
    expect(problemsAfter((c) => (c.configurations[2].iceIncrementKt = 41))).toEqual({ 'configurations.2.iceIncrementKt': 'The ice increment must be at most 40 kt.' });
    expect(problemsAfter((c) => (c.configurations[2].iceIncrementKt = -5))).toEqual({ 'configurations.2.iceIncrementKt': 'The ice increment must be at least 0 kt.' });
    expect(problemsAfter((c) => (c.configurations[2].iceIncrementKt = 7.5))).toEqual({ 'configurations.2.iceIncrementKt': 'The ice increment must be whole knots.' });
  });

  it('refuses a speed of zero or below', () => {
    expect(problemsAfter((c) => (c.limits.vneKt = 0))).toMatchObject({ 'limits.vneKt': 'VNE must be above zero.' });
  });

  it('refuses a position-error table that does not rise strictly', () => {
    const problems = problemsAfter((c) => {
      c.configurations[0].positionError[2] = { iasKt: 60, casKt: 62 };
    });
    expect(problems['configurations.0.positionError.2.iasKt']).toMatch(/IAS column must increase strictly: 60 kt does not exceed 60 kt/);
    expect(problems['configurations.0.positionError.2.casKt']).toMatch(/CAS column must increase strictly: 62 kt does not exceed 63 kt/);
  });

  it('refuses a position-error table of one point', () => {
    expect(problemsAfter((c) => (c.configurations[1].positionError = [{ iasKt: 60, casKt: 62 }]))).toMatchObject({
      'configurations.1.positionError': 'A position-error table needs at least two IAS/CAS points.',
    });
  });

  it('refuses an empty position-error table with a sentence instead of failing (cruise and flap configurations)', () => {
    for (const index of [0, 1]) {
      expect(problemsAfter((c) => (c.configurations[index].positionError = []))).toEqual({
        [`configurations.${index}.positionError`]: 'A position-error table needs at least two IAS/CAS points.',
      });
    }
  });

  it('refuses a table axis that does not rise strictly', () => {
    const problems = problemsAfter((c) => {
      (c.speeds[speedIndex(c, 'V1')] as TabulatedSpeed).byPressureAltitudeFt = [0, 8000, 4000];
    }, demoTwinTurbopropContent);
    expect(problems).toEqual({ 'speeds.2.byPressureAltitudeFt.2': 'The pressure altitude axis must increase strictly: 4,000 does not exceed 8,000 before it.' });
  });

  it('refuses tabulated values whose shape does not match the axes', () => {
    const rowShort = problemsAfter((c) => {
      (c.speeds[speedIndex(c, 'VR')] as TabulatedSpeed).valuesKt = [[95, 93, 91], [101, 99], [107, 105, 103]];
    }, demoTwinTurbopropContent);
    expect(rowShort).toEqual({ 'speeds.3.valuesKt.1': 'This must list 3 entries, one per pressure altitude of the table.' });

    const tooFewWeights = problemsAfter((c) => {
      (c.speeds[speedIndex(c, 'VR')] as TabulatedSpeed).valuesKt = [[95, 93, 91]];
    }, demoTwinTurbopropContent);
    expect(tooFewWeights).toEqual({ 'speeds.3.valuesKt': 'This must list 3 entries, one per weight of the table.' });

    const flatForTwoAxes = problemsAfter((c) => {
      (c.speeds[speedIndex(c, 'VR')] as TabulatedSpeed).valuesKt = [95, 101, 107];
    }, demoTwinTurbopropContent);
    expect(flatForTwoAxes).toEqual({ 'speeds.3.valuesKt.0': 'This must list 3 entries, one per pressure altitude of the table.' });
  });

  it('refuses a table weight outside the weight range', () => {
    const problems = problemsAfter((c) => {
      (c.speeds[speedIndex(c, 'V1')] as TabulatedSpeed).byWeightKg = [4000, 4800, 6000];
    }, demoTwinTurbopropContent);
    expect(problems).toEqual({ 'speeds.2.byWeightKg.2': '6,000 kg is outside the weight range (3,600 to 5,700 kg).' });
  });

  it('refuses weights out of order', () => {
    expect(problemsAfter((c) => (c.weights.maximumLandingKg = 1200))).toEqual({
      'weights.maximumLandingKg': 'The maximum landing weight cannot exceed the maximum takeoff weight.',
    });
    expect(problemsAfter((c) => (c.weights.minimumKg = 1100))).toMatchObject({ 'weights.minimumKg': 'The minimum weight must be below the maximum landing weight.' });
    expect(problemsAfter((c) => (c.weights.referenceKg = 1150))).toEqual({
      'weights.referenceKg': 'The reference weight must be above the minimum weight (700 kg) and at most the maximum takeoff weight (1,100 kg).',
    });
  });

  it('refuses a scaled speed without a reference weight', () => {
    expect(problemsAfter((c) => delete c.weights.referenceKg)).toEqual({ 'weights.referenceKg': 'Give the reference weight: weight-scaled speeds are published at it.' });
  });

  it('refuses a speed in a configuration that does not exist', () => {
    expect(problemsAfter((c) => (c.speeds[0].configurationKey = 'gear-down'))).toEqual({
      'speeds.0.configurationKey': 'There is no configuration gear-down; use one of clean, takeoff-flap, landing-flap.',
    });
  });

  it('refuses two configurations with one key', () => {
    expect(problemsAfter((c) => (c.configurations[1].key = 'clean'))).toMatchObject({
      'configurations.1.key': 'The configuration key clean is used twice; each configuration needs its own.',
    });
  });

  it('refuses a VFE for a configuration that does not exist', () => {
    expect(problemsAfter((c) => (c.limits.vfeKt['gear-down'] = 100))).toEqual({ 'limits.vfeKt.gear-down': 'There is no configuration gear-down for this VFE.' });
  });

  it('refuses a VFE not above its configuration’s stall speed at the maximum takeoff weight', () => {
    // VS0 is 44 KIAS at the reference weight, which is the maximum takeoff weight.
    const problems = problemsAfter((c) => {
      c.limits.vfeKt['landing-flap'] = 44;
    });
    expect(problems['limits.vfeKt.landing-flap']).toBe('VFE 44 kt is not above VS0 at the maximum takeoff weight (44 kt IAS); the flaps could not be used.');
  });

  it('compares a VFE with a stall speed in CAS through the position-error table', () => {
    // VS0 given as 52 KCAS: linear between the landing-flap points (45 KIAS, 50 KCAS) and
    // (55, 58), 52 KCAS ↔ 47.5 KIAS (arithmetic on the table; linear reading is common practice).
    const ok = problemsAfter((c) => {
      const vs0 = c.speeds[speedIndex(c, 'VS0')];
      if (vs0.kind === 'scaled') Object.assign(vs0, { basis: 'cas', referenceKt: 52 });
      c.limits.vfeKt['landing-flap'] = 48;
    });
    expect(ok).toEqual({});
    const refused = problemsAfter((c) => {
      const vs0 = c.speeds[speedIndex(c, 'VS0')];
      if (vs0.kind === 'scaled') Object.assign(vs0, { basis: 'cas', referenceKt: 52 });
      c.limits.vfeKt['landing-flap'] = 47;
    });
    expect(refused['limits.vfeKt.landing-flap']).toMatch(/^VFE 47 kt is not above VS0 .*\(47\.5 kt IAS\)/);
  });

  it('asks a jet for VMO and MMO', () => {
    expect(problemsAfter((c) => delete c.limits.mmo, demoLightTwinJetContent)).toEqual({
      'limits.mmo': 'With VMO, give MMO too: above the crossover altitude the Mach limit governs.',
    });
    expect(problemsAfter((c) => delete c.limits.vmoKt, demoLightTwinJetContent)).toEqual({ 'limits.vmoKt': 'A jet needs VMO.' });
  });

  it('asks a turboprop with VMO for MMO', () => {
    expect(problemsAfter((c) => delete c.limits.mmo, demoTwinTurbopropContent)).toEqual({
      'limits.mmo': 'With VMO, give MMO too: above the crossover altitude the Mach limit governs.',
    });
  });

  it('asks a piston type for VNE and VNO, VNO below VNE', () => {
    expect(problemsAfter((c) => delete c.limits.vneKt)).toEqual({ 'limits.vneKt': 'A piston type needs VNE.' });
    expect(problemsAfter((c) => delete c.limits.vnoKt)).toEqual({ 'limits.vnoKt': 'A piston type needs VNO.' });
    expect(problemsAfter((c) => (c.limits.vnoKt = 160))).toEqual({ 'limits.vnoKt': 'VNO must be below VNE.' });
  });

  it('asks a multi-engine type for VMC and VYSE', () => {
    const problems = problemsAfter((c) => {
      delete c.limits.vmcKt;
      delete c.limits.vyseKt;
    }, demoTwinTurbopropContent);
    expect(problems).toEqual({ 'limits.vmcKt': 'A multi-engine type needs VMC.', 'limits.vyseKt': 'A multi-engine type needs VYSE.' });
  });

  it('refuses a single-engine piston type with two engines', () => {
    expect(problemsAfter((c) => (c.aircraft.engines = 2))).toMatchObject({ 'aircraft.engines': 'A single-engine piston type has exactly one engine.' });
  });

  it('refuses one speed code twice in a configuration, and allows it in another', () => {
    expect(
      problemsAfter((c) => c.speeds.push({ code: 'VREF', label: 'Again', phase: 'landing', configurationKey: 'landing-flap', basis: 'ias', kind: 'fixed', valueKt: 65 })),
    ).toEqual({ 'speeds.8.code': 'VREF appears twice in configuration landing-flap; each code once per configuration.' });
    expect(
      problemsAfter((c) => c.speeds.push({ code: 'VREF', label: 'Flaps 10°', phase: 'landing', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'fixed', valueKt: 68 })),
    ).toEqual({});
  });

  it('refuses a speed outside its configuration’s position-error table over the weight range', () => {
    // Scaled as the card scales it, in CAS (√(W/Wref), FAA handbooks): VS1 50 KIAS reads 54 KCAS
    // through the changed table (50 → 54, 60 → 63) and scales to 54·√(700/1100) = 43.08 KCAS at 700 kg.
    expect(problemsAfter((c) => (c.configurations[0].positionError[0] = { iasKt: 50, casKt: 54 }))).toMatchObject({
      'speeds.0.referenceKt': expect.stringMatching(/^VS1 runs from 43\.08 to 54 kt CAS over the weight range, outside the clean position-error table \(54 to 157 kt CAS\)\.$/),
    });
    expect(
      problemsAfter((c) => c.speeds.push({ code: 'VFAST', label: 'Too fast', phase: 'cruise', configurationKey: 'clean', basis: 'ias', kind: 'fixed', valueKt: 170 })),
    ).toEqual({ 'speeds.8.valueKt': 'VFAST runs from 170 to 170 kt IAS over the weight range, outside the clean position-error table (30 to 160 kt IAS).' });
  });

  it('refuses a limit outside the cruise configuration’s table', () => {
    expect(problemsAfter((c) => (c.limits.vmoKt = 300), demoTwinTurbopropContent)).toEqual({
      'limits.vmoKt': '300 kt is outside the clean position-error table (65 to 260 kt IAS); the first configuration is the cruise configuration.',
    });
  });

  it('refuses a speed kind it does not know', () => {
    expect(problemsAfter((c) => Object.assign(c.speeds[0], { kind: 'guessed' }))).toEqual({ 'speeds.0.kind': 'Choose the speed’s kind: scaled, tabulated or fixed.' });
  });
});
