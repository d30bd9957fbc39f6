/**
 * Icing conditions on the card (issue 16, part 2): the book's ice increment added to the speeds
 * of its configuration, after rounding (common practice, from memory: flight manuals state the
 * increment as knots added to the normal indicated speed), stall and limit speeds untouched, a
 * note where the book states no increment, the ordering rules run on the iced figures.
 */
import { demoTwinTurbopropContent } from '../speed-book/demo-content';
import { revisionContentSchema, type RevisionContent } from '../speed-book/revision-content';
import { buildCard } from './build-card';
import { sweepEnvelope } from './coverage';
import type { CardInputs } from './card';
import { HAND_CONTEXT, revisionOf } from './testing/test-fixtures';

const inputs = (icing?: boolean): CardInputs => ({
  airframeId: HAND_CONTEXT.airframe.id,
  weightKg: 4600,
  landingWeightKg: 4600,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 0, qnhHpa: 1013.25, oatC: 15 },
  isaDeviationC: 0,
  cruise: { iasKt: 200 },
  altitudeStepFt: 5000,
  ...(icing === undefined ? {} : { icing }),
});

const card = (content: RevisionContent, icing?: boolean) => buildCard(revisionOf(revisionContentSchema.parse(content)), inputs(icing), HAND_CONTEXT);

describe('icing conditions on the card', () => {
  it('adds the stated increment to the printed IAS of VREF and VY (hand-worked)', () => {
    const iced = card(demoTwinTurbopropContent(), true);
    const byCode = new Map(iced.icing!.speeds.map((speed) => [speed.code, speed]));
    // VREF tabulated 97 kt IAS at 4,600 kg (the book's table entry), +10 kt for "Flaps down, gear down".
    expect(byCode.get('VREF')).toEqual({
      code: 'VREF', configurationKey: 'landing-flap', configurationLabel: 'Flaps down, gear down', iasKt: 97, icedIasKt: 107, incrementKt: 10, label: 'Final approach',
    });
    // VY: 125 kt IAS at 5,700 kg → 125.67 CAS (clean table, 120→121, 150→149), × √(4600/5700) = 112.89 CAS
    // → 111.61 IAS (90→92, 120→121) → 112 kt printed; +10 kt for "Flaps up, gear up" → 122 kt.
    expect(byCode.get('VY')).toMatchObject({ iasKt: 112, icedIasKt: 122, incrementKt: 10 });
    // The normal figures are the same as without icing.
    expect(iced.speeds).toEqual(card(demoTwinTurbopropContent()).speeds);
  });

  it('never increases stall or limit speeds', () => {
    const codes = card(demoTwinTurbopropContent(), true).icing!.speeds.map((speed) => speed.code);
    expect(codes).not.toContain('VS0');
    expect(codes).not.toContain('VS1');
    expect(codes.sort()).toEqual(['VREF', 'VY']);
  });

  it('says plainly where the book states no increment, and guesses none', () => {
    const icing = card(demoTwinTurbopropContent(), true).icing!;
    expect(icing.notes).toEqual(['No ice increment stated for Flaps approach: the book gives no iced figures for it; the normal speeds are shown.']);
    expect(icing.speeds.some((speed) => speed.configurationKey === 'takeoff-flap')).toBe(false);
  });

  it('has no icing part, and the same digest, when icing is not ticked or false', () => {
    const plain = card(demoTwinTurbopropContent());
    expect(plain.icing).toBeUndefined();
    expect(card(demoTwinTurbopropContent(), true).digest).not.toBe(plain.digest);
    // `false` is kept in the inputs (it was entered), so its digest differs only by the input.
    expect(card(demoTwinTurbopropContent(), false).icing).toBeUndefined();
  });

  it('refuses the card when the iced speeds break an ordering rule (VX iced above VY iced)', () => {
    const content = demoTwinTurbopropContent();
    // VX 110 kt in "Flaps approach" (+20 kt iced → 130) and VY 112 kt clean (+10 kt → 122): VX ≤ VY breaks only iced.
    content.configurations[1] = { ...content.configurations[1], iceIncrementKt: 20 };
    content.speeds.push({ code: 'VX', label: 'Best angle of climb', phase: 'climb', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'fixed', valueKt: 110 });
    expect(card(content).speeds.find((speed) => speed.code === 'VX')!.iasKt).toBe(110);
    expect(() => card(content, true)).toThrow(expect.objectContaining({ code: 'ordering-rule-broken' }) as unknown as Error);
  });

  it('lets the review’s envelope sweep see a rule only the iced speeds break', () => {
    const content = demoTwinTurbopropContent();
    content.configurations[1] = { ...content.configurations[1], iceIncrementKt: 20 };
    content.speeds.push({ code: 'VX', label: 'Best angle of climb', phase: 'climb', configurationKey: 'takeoff-flap', basis: 'ias', kind: 'fixed', valueKt: 110 });
    const report = sweepEnvelope(revisionContentSchema.parse(content));
    expect(report.rules.map((rule) => rule.ruleId)).toContain('vx-vy');
    expect(report.passes).toBe(false);
    // The demo turboprop as shipped (+10 kt clean and landing) passes its sweep with the iced figures.
    expect(sweepEnvelope(revisionContentSchema.parse(demoTwinTurbopropContent())).passes).toBe(true);
  });

  it('refuses the card when an iced speed lies beyond its position-error table, never extrapolated', () => {
    const content = demoTwinTurbopropContent();
    // Landing table cut to 55–110 kt IAS (VFE 108 kt inside it): VREF 97 kt is read, 97 + 40 = 137 kt is not.
    content.configurations[2] = { ...content.configurations[2], iceIncrementKt: 40, positionError: content.configurations[2].positionError.slice(0, 4) };
    content.limits = { ...content.limits, vfeKt: { ...content.limits.vfeKt, 'landing-flap': 108 } };
    expect(card(content).speeds.find((speed) => speed.code === 'VREF')!.iasKt).toBe(97);
    expect(() => card(content, true)).toThrow(expect.objectContaining({ code: 'outside-flight-manual-data', field: 'icing' }) as unknown as Error);
  });
});
