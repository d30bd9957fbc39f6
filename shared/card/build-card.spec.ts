/**
 * `buildCard` against cards worked by hand from the published formulas (flight-physics.md),
 * with the working beside each figure and the source named; then the refusals.
 *
 * The test types (testing/test-fixtures.ts) have two-point position-error tables, so IAS ↔ CAS is a
 * straight line read by linear interpolation (FAA Pilot's Handbook of Aeronautical Knowledge,
 * airspeed calibration; read as a flight-manual table is read):
 *   piston clean  CAS = 37 + 0.9·(IAS − 30)   IAS = 30 + (CAS − 37)/0.9
 *   piston flap   CAS = 33 + 0.9·(IAS − 25)   IAS = 25 + (CAS − 33)/0.9
 *   jet clean     CAS = IAS (100 to 450 kt)
 */
import { inhgToHpa } from '../aero';
import { buildCard } from './build-card';
import { CardRefusedError, type CardInputs, type CardRefusalCode, type SpeedCard } from './card';
import { handJetContent, handPistonContent, handPistonInputs, HAND_CONTEXT, revisionOf } from './testing/test-fixtures';

const piston = () => buildCard(revisionOf(handPistonContent()), handPistonInputs(), HAND_CONTEXT);
const speed = (card: SpeedCard, code: string) => card.speeds.find((s) => s.code === code)!;

function refusal(inputs: Partial<CardInputs>, content = handPistonContent()): CardRefusedError {
  try {
    buildCard(revisionOf(content), { ...handPistonInputs(), ...inputs }, HAND_CONTEXT);
  } catch (error) {
    if (error instanceof CardRefusedError) return error;
    throw error;
  }
  throw new Error('The card was not refused.');
}

function expectRefused(error: CardRefusedError, code: CardRefusalCode, field: string, sentence: RegExp): void {
  expect({ code: error.code, field: error.field }).toEqual({ code, field });
  expect(error.message).toMatch(sentence);
}

// ISA troposphere (ISO 2533:1975; ICAO Doc 7488/3): T = T0 − L·H, p/p0 = (T/T0)^(g0/(R·L)).
const T0 = 288.15;
const L = 0.0065;
const EXPONENT = 9.80665 / (287.05287 * L); // 5.25588
const FT = 0.3048;

describe('weight-scaled speeds, position error and rounding (hand-worked)', () => {
  it('scales VS1 by √(W/Wref) in CAS and reads the IAS through the two-point table; stall speeds round up', () => {
    // FAA PHAK (effect of weight on stall speed): V = Vref·√(W/Wref).
    // VS1 at 900 kg from 50 KCAS at 1,000 kg: 50·√0.9 = 47.434 KCAS → rounded up 48.
    // IAS = 30 + (47.434 − 37)/0.9 = 41.594 → rounded up 42.
    expect(speed(piston(), 'VS1')).toMatchObject({ weightKg: 900, casKt: 48, iasKt: 42, rounding: 'stall-up', kind: 'scaled' });
  });

  it('gives landing speeds at the landing weight', () => {
    // VS0 at 850 kg from 45 KCAS at 1,000 kg: 45·√0.85 = 41.488 KCAS → 42;
    // flap IAS = 25 + (41.488 − 33)/0.9 = 34.431 → 35.
    expect(speed(piston(), 'VS0')).toMatchObject({ weightKg: 850, casKt: 42, iasKt: 35, phase: 'landing' });
  });

  it('rises by the square-root law when the weight rises', () => {
    const heavy = buildCard(revisionOf(handPistonContent()), { ...handPistonInputs(), weightKg: 1000 }, HAND_CONTEXT);
    // At the reference weight VS1 is the reference, 50 KCAS; IAS = 30 + 13/0.9 = 44.44 → 45.
    expect(speed(heavy, 'VS1')).toMatchObject({ casKt: 50, iasKt: 45 });
  });

  it('reads a tabulated speed by trilinear interpolation and rounds it to the nearest knot', () => {
    // VR table (IAS) by weight [800, 1000] × pressure altitude [0, 4000] × OAT [−10, 30]:
    // at 900 kg, 2,000 ft, 0 °C the weight and altitude fractions are ½ and the OAT fraction ¼,
    // so each OAT pair gives v0 + ¼(v1 − v0): 50.25, 52.25, 56.25, 58.25; their mean is 54.25 KIAS → 54.
    // CAS through the flap table: 33 + 0.9·(54.25 − 25) = 59.325 → 59.
    expect(speed(piston(), 'VR')).toMatchObject({ iasKt: 54, casKt: 59, kind: 'tabulated', rounding: 'nearest' });
  });

  it('converts a fixed speed given as IAS to CAS', () => {
    // VY 80 KIAS: CAS = 37 + 0.9·50 = 82.
    expect(speed(piston(), 'VY')).toMatchObject({ iasKt: 80, casKt: 82, kind: 'fixed' });
  });

  it('lists only the takeoff speeds of the takeoff configuration', () => {
    const jet = buildCard(revisionOf(handJetContent()), { ...handPistonInputs(), weightKg: 7200, landingWeightKg: undefined, configuration: 'flap', cruise: { iasKt: 250 } }, HAND_CONTEXT);
    // V2 at 7,200 kg from 125 KCAS at 8,000 kg: 125·√0.9 = 118.585 → 119 KCAS; flap table
    // 84→250 KCAS over 80→250 KIAS: IAS = 80 + (118.585 − 84)·170/166 = 115.42.
    // V2 is a minimum speed: rounded up (flight-physics.md, "Rounding by kind"), 115.42 → 116.
    expect(speed(jet, 'V2')).toMatchObject({ casKt: 119, iasKt: 116 });
    expect(() => buildCard(revisionOf(handJetContent()), { ...handPistonInputs(), weightKg: 7200, configuration: 'clean' }, HAND_CONTEXT)).toThrow(CardRefusedError);
  });
});

describe('stall speed in turns (hand-worked)', () => {
  it('is VS1·√n with n = 1/cos(bank), rounded up, as CAS and as IAS', () => {
    // FAA Airplane Flying Handbook (load factor in turns): Vs·√(1/cos φ). VS1 = 47.434 KCAS.
    //  0°: ×1          47.434 → 48; IAS 30 + 10.434/0.9 = 41.59 → 42
    // 15°: ×1.017486   48.264 → 49; IAS 30 + 11.264/0.9 = 42.52 → 43
    // 30°: ×1.074570   50.971 → 51; IAS 30 + 13.971/0.9 = 45.52 → 46
    // 45°: ×1.189207   56.409 → 57; IAS 30 + 19.409/0.9 = 51.57 → 52
    // 60°: ×1.414214   67.082 → 68; IAS 30 + 30.082/0.9 = 63.42 → 64
    expect(piston().stallInTurn).toEqual([
      { bankDeg: 0, loadFactor: 1, casKt: 48, iasKt: 42 },
      { bankDeg: 15, loadFactor: 1.04, casKt: 49, iasKt: 43 },
      { bankDeg: 30, loadFactor: 1.15, casKt: 51, iasKt: 46 },
      { bankDeg: 45, loadFactor: 1.41, casKt: 57, iasKt: 52 },
      { bankDeg: 60, loadFactor: 2, casKt: 68, iasKt: 64 },
    ]);
    // The FAA handbook's percentages, +7 % at 30°, +19 % at 45°, +41 % at 60°, from 47.434:
    expect(47.434 * 1.07).toBeCloseTo(50.75, 1);
  });
});

describe('limits (hand-worked)', () => {
  it('rounds limits down, both ways through the cruise table, and VFE through its own', () => {
    // VNO 120 KIAS → 37 + 0.9·90 = 118 KCAS; VNE 135 KIAS → 37 + 0.9·105 = 131.5 → 131 (down);
    // VFE 90 KIAS flap → 33 + 0.9·65 = 91.5 → 91 (down).
    const { limits } = piston();
    expect(limits).toMatchObject({ basis: 'ias', vno: { iasKt: 120, casKt: 118 }, vne: { iasKt: 135, casKt: 131 }, vmo: null, mmo: null });
    expect(limits.vfe).toEqual([{ configurationKey: 'flap', configurationLabel: 'Flaps down', iasKt: 90, casKt: 91 }]);
  });

  it('marks the airspeed indicator as the airworthiness rules define it, at this weight', () => {
    // 14 CFR 23.1545 (from memory): white VS0–VFE, green VS1–VNO, yellow VNO–VNE, red line VNE,
    // on the speed book's basis (IAS here), with the stall speeds worked above.
    expect(piston().indicator).toEqual({
      basis: 'ias',
      arcs: [
        { colour: 'white', fromKt: 35, toKt: 90 },
        { colour: 'green', fromKt: 42, toKt: 120 },
        { colour: 'yellow', fromKt: 120, toKt: 135 },
      ],
      lines: [{ colour: 'red', code: 'VNE', kt: 135 }],
    });
  });

  it('gives the crossover altitude of VMO and MMO from the pitot relation', () => {
    // NASA RP 1046: qc = p0·[(1 + 0.2·(VMO/a0)²)^3.5 − 1] = p·[(1 + 0.2·MMO²)^3.5 − 1];
    // a0 = 661.4786 kt (flight-physics.md). Solve for p, then the ISA altitude of p
    // (troposphere, ISO 2533): H = (T0/L)·(1 − (p/p0)^(1/5.25588)).
    const qcOverP0 = Math.pow(1 + 0.2 * (300 / 661.4786) ** 2, 3.5) - 1;
    const pOverP0 = qcOverP0 / (Math.pow(1 + 0.2 * 0.8 ** 2, 3.5) - 1);
    const handFt = ((T0 / L) * (1 - Math.pow(pOverP0, 1 / EXPONENT))) / FT;
    const jet = buildCard(revisionOf(handJetContent()), { ...handPistonInputs(), weightKg: 7200, landingWeightKg: undefined, cruise: { iasKt: 250 } }, HAND_CONTEXT);
    expect(Math.abs(jet.crossoverAltitudeFt! - handFt)).toBeLessThan(1);
    expect(jet.crossoverAltitudeFt).toBe(30595); // the hand figure above, rounded to the foot
    expect(jet.limits).toMatchObject({ basis: 'cas', vmo: { iasKt: 300, casKt: 300 }, mmo: 0.8, vmc: { casKt: 105 }, vyse: { casKt: 140 } });
    expect(jet.indicator).toEqual({ basis: 'cas', arcs: [], lines: [{ colour: 'red', code: 'VMO', kt: 300 }] });
  });
});

describe('pressure and density altitude', () => {
  it('gives the FAA worked example: a sea-level field with 29.70 inHg is at about 205 ft pressure altitude', () => {
    const card = buildCard(revisionOf(handPistonContent()), { ...handPistonInputs(), departure: { elevationFt: 0, qnhHpa: inhgToHpa(29.7), oatC: 15 } }, HAND_CONTEXT);
    // Exact relation (flight-physics.md, "Altimetry"): at elevation 0 the station pressure is
    // QNH, so PA = (T0/L)·(1 − (QNH/1013.25)^(1/5.25588)).
    const exactFt = ((T0 / L) * (1 - Math.pow(inhgToHpa(29.7) / 1013.25, 1 / EXPONENT))) / FT;
    expect(card.departure.pressureAltitudeFt).toBe(Math.round(exactFt));
    expect(Math.abs(card.departure.pressureAltitudeFt - 205)).toBeLessThanOrEqual(5); // FAA example, ≈ 205 ft
  });

  it('gives density altitude from the gas law in the ISA troposphere', () => {
    // PA 2,000 ft (standard QNH): T_ISA = 288.15 − 0.0065·609.6 = 284.188 K (11.04 °C); OAT 0 °C.
    // σ = (p/p0)·(T0/T) with p/p0 = (284.188/288.15)^5.25588; ISA density ratio (T/T0)^4.25588 = σ
    // gives T_DA, and DA = (T0 − T_DA)/L.
    const isaK = T0 - L * 2000 * FT;
    const sigma = Math.pow(isaK / T0, EXPONENT) * (T0 / 273.15);
    const daFt = (T0 - T0 * Math.pow(sigma, 1 / (EXPONENT - 1))) / L / FT;
    const { departure } = piston();
    expect(departure).toEqual({ pressureAltitudeFt: 2000, densityAltitudeFt: Math.round(daFt), isaDeviationC: -11, highDensityAltitude: false });
    // Rule of thumb (common practice, a loose check): DA ≈ PA + 120 ft per °C from ISA = 2000 − 1,325.
    expect(Math.abs(departure.densityAltitudeFt - (2000 - 120 * 11.04))).toBeLessThan(250);
  });

  it('cautions when density altitude is high', () => {
    const hot = buildCard(revisionOf(handPistonContent()), { ...handPistonInputs(), departure: { elevationFt: 2000, qnhHpa: 1013.25, oatC: 29 } }, HAND_CONTEXT);
    // ISA + 18 °C at 2,000 ft: about 2,000 + 120·18 = 4,160 ft (rule of thumb, common practice),
    // more than 2,000 ft above the field: the card's caution.
    expect(Math.abs(hot.departure.densityAltitudeFt - 4160)).toBeLessThan(300);
    expect(hot.departure.highDensityAltitude).toBe(true);
  });
});

describe('the altitude table', () => {
  const jetCard = (cruise: CardInputs['cruise']) =>
    buildCard(revisionOf(handJetContent()), { ...handPistonInputs(), weightKg: 7200, landingWeightKg: undefined, cruise, altitudeStepFt: 10000 }, HAND_CONTEXT);
  const row = (card: SpeedCard, ft: number) => card.altitudeTable.find((r) => r.pressureAltitudeFt === ft)!;

  it('has rows from 0 ft every step up to the ceiling, OAT at the day’s ISA deviation', () => {
    const card = piston(); // ceiling 10,000 ft, step 2,500 ft
    expect(card.altitudeTable.map((r) => r.pressureAltitudeFt)).toEqual([0, 2500, 5000, 7500, 10000]);
    // ISO 2533 Table 5 (flight-physics.md): 288.15 K at 0; at 10,000 ft (3,048 m) 288.15 − 19.812 = 268.338 K.
    expect(card.altitudeTable.map((r) => r.oatC)).toEqual([15, 10, 5.1, 0.1, -4.8]);
    const odd = buildCard(revisionOf(handPistonContent()), { ...handPistonInputs(), altitudeStepFt: 3000 }, HAND_CONTEXT);
    expect(odd.altitudeTable.map((r) => r.pressureAltitudeFt)).toEqual([0, 3000, 6000, 9000, 10000]);
  });

  it('matches NASA RP 1046: 250 KCAS at 10,000 ft on a standard day is 248.10 KEAS and 288.70 KTAS', () => {
    expect(row(jetCard({ iasKt: 250 }), 10000)).toMatchObject({ iasKt: 250, casKt: 250, easKt: 248, tasKt: 289, limitKind: 'vmo', limitCasKt: 300, aboveLimit: false });
  });

  it('dashes an IAS cruise that would be supersonic: 400 KCAS at 30,000 ft is 602.6 KTAS (NASA RP 1046), Mach 1.02', () => {
    // Issue 11 (regression): the row used to print 603 KTAS and Mach 1.02 silently; now it gives
    // no figure and says why, while the limit column still stands.
    const supersonic = row(jetCard({ iasKt: 400 }), 30000);
    expect(supersonic).toMatchObject({ iasKt: 400, casKt: null, easKt: null, tasKt: null, mach: null, aboveLimit: true, limitKind: 'vmo', limitCasKt: 300 });
    expect(supersonic.cruiseNote).toMatch(/^At 30,000 ft the cruise IAS of 400 kt would be Mach 1\.02\d?, at or above Mach 1; no figure is given\.$/);
    // At 10,000 ft the same IAS is subsonic (Mach 0.72): every figure, no note.
    expect(row(jetCard({ iasKt: 400 }), 10000)).toMatchObject({ casKt: 400, cruiseNote: null });
  });

  it('matches NASA RP 1046: Mach 0.8 at 30,000 ft is 471.46 KTAS; MMO governs above the crossover', () => {
    const card = jetCard({ mach: 0.8 });
    // 30,000 ft is below the crossover (30,595 ft): VMO governs, and M 0.8 there is above 300 KCAS.
    expect(row(card, 30000)).toMatchObject({ mach: 0.8, tasKt: 471, limitKind: 'vmo', aboveLimit: true });
    // At 40,000 ft, above the crossover, MMO governs and Mach 0.8 is the limit itself.
    expect(row(card, 40000)).toMatchObject({ mach: 0.8, limitKind: 'mmo', aboveLimit: false });
    // M 0.8 at sea level (529 KCAS) is beyond the position-error table: no IAS, never extrapolated.
    expect(row(card, 0)).toMatchObject({ iasKt: null, casKt: 529, limitKind: 'vmo', aboveLimit: true });
  });
});

describe('refusals', () => {
  it('refuses a takeoff weight above the maximum', () => {
    expectRefused(refusal({ weightKg: 1001 }), 'weight-out-of-range', 'weightKg', /above the maximum takeoff weight of 1,000 kg/);
  });

  it('refuses a takeoff weight below the flight manual’s lowest', () => {
    expectRefused(refusal({ weightKg: 599 }), 'weight-out-of-range', 'weightKg', /below the flight manual's lowest weight of 600 kg/);
  });

  it('refuses a landing weight above the maximum landing weight', () => {
    expectRefused(refusal({ weightKg: 1000, landingWeightKg: 960 }), 'landing-weight-out-of-range', 'landingWeightKg', /above the maximum landing weight of 950 kg/);
  });

  // The hand-worked book declares no envelope (content from before envelopes): its envelope is
  // derived from its tables (envelope.ts), so a day beyond a table is refused in one sentence
  // that names the envelope, before any table is read — never extrapolated.
  it('refuses a day beyond its tables’ altitudes as outside the envelope derived from them, never extrapolating', () => {
    // VR is tabulated from 0 to 4,000 ft; a 5,000 ft field on a standard QNH is at 5,000 ft.
    const error = refusal({ departure: { elevationFt: 5000, qnhHpa: 1013.25, oatC: 0 } });
    expectRefused(error, 'outside-book-envelope', 'departure.elevationFt', /^The day is outside this book's takeoff envelope: the departure pressure altitude of 5,000 ft is above its range of 0 to 4,000 ft\.$/);
  });

  it('refuses a day beyond its tables’ temperatures as outside the envelope derived from them', () => {
    expectRefused(refusal({ departure: { elevationFt: 2000, qnhHpa: 1013.25, oatC: 35 } }), 'outside-book-envelope', 'departure.oatC', /^The day is outside this book's takeoff envelope: the departure temperature of 35 °C is above its range of/);
  });

  it('refuses content that does not match its published hash', () => {
    const revision = revisionOf(handPistonContent());
    const tampered = { ...revision, content: { ...handPistonContent(), limits: { vnoKt: 125, vneKt: 135, vfeKt: { flap: 90 } } } };
    try {
      buildCard(tampered, handPistonInputs(), HAND_CONTEXT);
      throw new Error('not refused');
    } catch (error) {
      expectRefused(error as CardRefusedError, 'content-hash-mismatch', 'revision', /does not match its published hash/);
    }
  });

  it('refuses an absurd OAT with the flight-physics library’s sentence', () => {
    expectRefused(refusal({ departure: { elevationFt: 2000, qnhHpa: 1013.25, oatC: 90 } }), 'out-of-envelope', 'departure.oatC', /^Departure: The outside air temperature of 90.0 °C at 2,000 ft is not plausible/);
  });

  it('refuses a QNH typed in inches of mercury', () => {
    expectRefused(refusal({ departure: { elevationFt: 2000, qnhHpa: 29.92, oatC: 10 } }), 'out-of-envelope', 'departure.qnhHpa', /convert first/);
  });

  it('refuses an ISA deviation the altitude table cannot take', () => {
    expectRefused(refusal({ isaDeviationC: 60 }), 'out-of-envelope', 'isaDeviationC', /^At 0 ft: The temperature at ISA \+60.0 °C/);
  });

  it('gives the card but dashes every altitude row for a cruise IAS outside the cruise configuration’s position-error table', () => {
    // Issue 11: the cruise is no reason to refuse the takeoff and landing speeds; the table says why it has no figure.
    const card = buildCard(revisionOf(handPistonContent()), { ...handPistonInputs(), cruise: { iasKt: 160 } }, HAND_CONTEXT);
    expect(card.cruise).toEqual({ casKt: null, iasKt: 160 });
    for (const altitudeRow of card.altitudeTable) {
      expect(altitudeRow).toMatchObject({ casKt: null, tasKt: null, mach: null });
      expect(altitudeRow.cruiseNote).toMatch(/^The cruise IAS of 160 kt is outside the cruise configuration's position-error table \(30 to \d+ KIAS\); no figure is given\.$/);
    }
  });

  it('refuses inputs that are not numbers, an unknown configuration, and another airframe', () => {
    expectRefused(refusal({ weightKg: Number.NaN }), 'invalid-inputs', 'weightKg', /must be a number/);
    expectRefused(refusal({ configuration: 'gear-down' }), 'unknown-configuration', 'configuration', /no configuration gear-down; choose Flaps down \(flap\)/);
    expectRefused(refusal({ configuration: 'clean' }), 'unknown-configuration', 'configuration', /no takeoff speeds for Flaps up/);
    expectRefused(refusal({ airframeId: 8 }), 'airframe-mismatch', 'airframeId', /not ZZ-TST/);
  });
});
