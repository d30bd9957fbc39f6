import { ORDERING_RULES, orderingViolations, type OrderingFigure, type OrderingFigures } from './ordering-rules';

/** A figure printed as `kt` in IAS and CAS, with that exact CAS, at `weightKg`. */
const at = (code: string, kt: number, weightKg: number | null = 1000): OrderingFigure => ({ code, iasKt: Math.round(kt), casKt: Math.round(kt), exactCasKt: kt, weightKg });
const none: OrderingFigures = { vref: [], vfe: [], referenceStallSpeeds: false };
const broken = (figures: Partial<OrderingFigures>) => orderingViolations({ ...none, ...figures }).map((violation) => violation.ruleId);

describe('ORDERING_RULES: one table with stable ids, each with its source', () => {
  it('names every rule of flight-physics.md once, each with a title and a source', () => {
    expect(ORDERING_RULES.map((rule) => rule.id)).toEqual(['v1-vr-v2', 'v2-vmc', 'vref-vs0', 'vref-vsr0', 'vref-vmc', 'vs0-vs1', 'vx-vy', 'vno-vne', 'vfe-flap', 'vle-vlo', 'mmo-below-1']);
    for (const rule of ORDERING_RULES) {
      expect(rule.title.length).toBeGreaterThan(4);
      expect(rule.source).toMatch(/CFR|CS|FAA|NASA/);
    }
  });

  it('finds nothing in figures that keep every rule', () => {
    expect(
      broken({ v1: at('V1', 100), vr: at('VR', 104), v2: at('V2', 110), vmc: at('VMC', 90, null), vref: [at('VREF', 112)], vs0: at('VS0', 80), vs1: at('VS1', 90), vx: at('VX', 95), vy: at('VY', 110), vnoKt: 150, vneKt: 180, vleKt: 160, vloKt: 150, vfe: [{ label: 'Flaps 10°', kt: 150 }, { label: 'Flaps 30°', kt: 120 }], mmo: 0.7 }),
    ).toEqual([]);
  });
});

describe('each rule, with its source', () => {
  it('V1 ≤ VR ≤ V2 — CS 25.107(e) / 14 CFR 25.107(e) (from memory): the demo jet’s old V2 97 below VR 98', () => {
    expect(broken({ v1: at('V1', 94), vr: at('VR', 98), v2: at('V2', 97) })).toEqual(['v1-vr-v2']);
    expect(broken({ v1: at('V1', 99), vr: at('VR', 98), v2: at('V2', 105) })).toEqual(['v1-vr-v2']);
    expect(broken({ v1: at('V1', 98), vr: at('VR', 98), v2: at('V2', 98) })).toEqual([]); // equal is allowed
  });

  it('V2 ≥ 1.1 × VMC — CS 25.107(b) / 14 CFR 25.107(b) (from memory): 1.1 × 90 = 99 KCAS', () => {
    expect(broken({ v2: at('V2', 98.9), vmc: at('VMC', 90, null) })).toEqual(['v2-vmc']);
    expect(broken({ v2: at('V2', 99), vmc: at('VMC', 90, null) })).toEqual([]);
  });

  it('VREF ≥ 1.3 × VS0 for small aeroplanes — 14 CFR 23.73 / CS 23.73 before 2017 (from memory): 1.3 × 50 = 65 KCAS', () => {
    expect(broken({ vref: [at('VREF', 64.9)], vs0: at('VS0', 50) })).toEqual(['vref-vs0']);
    expect(broken({ vref: [at('VREF', 65)], vs0: at('VS0', 50) })).toEqual([]);
    // VS0 at 1,000 kg is 50 KCAS; at VREF's 810 kg it is 50·√0.81 = 45 (V = Vs·√(W/Ws), FAA handbooks): 1.3 × 45 = 58.5.
    expect(broken({ vref: [at('VREF', 58.6, 810)], vs0: at('VS0', 50, 1000) })).toEqual([]);
    expect(broken({ vref: [at('VREF', 58.4, 810)], vs0: at('VS0', 50, 1000) })).toEqual(['vref-vs0']);
  });

  it('VREF ≥ 1.23 × VSR0 where the book states reference stall speeds — CS 25.125(b)(2)(i) / 14 CFR 25.125(b)(2)(i) (from memory)', () => {
    expect(broken({ vref: [at('VREF', 122.9)], vs0: at('VSR0', 100), referenceStallSpeeds: true })).toEqual(['vref-vsr0']);
    expect(broken({ vref: [at('VREF', 123)], vs0: at('VSR0', 100), referenceStallSpeeds: true })).toEqual([]);
  });

  it('VREF ≥ VMC — 14 CFR 23.73 and 25.125(b)(2)(ii) (from memory)', () => {
    expect(broken({ vref: [at('VREF', 88)], vmc: at('VMC', 88.5, null) })).toEqual(['vref-vmc']);
    expect(broken({ vref: [at('VREF', 89)], vmc: at('VMC', 88.5, null) })).toEqual([]);
  });

  it('VS0 ≤ VS1 — 14 CFR 1.2 definitions (from memory), compared at one weight', () => {
    expect(broken({ vs0: at('VSO', 61), vs1: at('VS1', 60) })).toEqual(['vs0-vs1']);
    // VS0 56 KCAS at 1,000 kg is 50.1 at 800 kg (√0.8): below VS1 52 at 800 kg.
    expect(broken({ vs0: at('VS0', 56, 1000), vs1: at('VS1', 52, 800) })).toEqual([]);
  });

  it('VX ≤ VY — FAA Airplane Flying Handbook (from memory)', () => {
    expect(broken({ vx: at('VX', 80), vy: at('VY', 78) })).toEqual(['vx-vy']);
    expect(broken({ vx: at('VX', 78), vy: at('VY', 80) })).toEqual([]);
  });

  it('VNO < VNE — 14 CFR 23.1505(b) / CS 23.1505(b) (from memory)', () => {
    expect(broken({ vnoKt: 160, vneKt: 160 })).toEqual(['vno-vne']);
    expect(broken({ vnoKt: 125, vneKt: 160 })).toEqual([]);
  });

  it('VFE falls as flap rises — 14 CFR 23.1511 / 25.1511 (from memory); configurations listed from least to most flap', () => {
    expect(broken({ vfe: [{ label: 'Flaps 10°', kt: 110 }, { label: 'Flaps 30°', kt: 115 }] })).toEqual(['vfe-flap']);
    expect(broken({ vfe: [{ label: 'Flaps 10°', kt: 110 }, { label: 'Flaps 30°', kt: 110 }] })).toEqual([]);
  });

  it('VLO ≤ VLE — 14 CFR 25.1515 / CS 25.1515 (from memory)', () => {
    expect(broken({ vleKt: 160, vloKt: 175 })).toEqual(['vle-vlo']);
    expect(broken({ vleKt: 175, vloKt: 160 })).toEqual([]);
  });

  it('MMO < 1 — 14 CFR 25.1505 (from memory); the pitot relations used are subsonic (NASA RP 1046)', () => {
    expect(broken({ mmo: 1 })).toEqual(['mmo-below-1']);
    expect(broken({ mmo: 0.99 })).toEqual([]);
  });
});
