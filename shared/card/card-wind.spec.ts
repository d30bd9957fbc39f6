/**
 * The day's wind on the runway and the approach additive (card-wind.ts), against examples worked
 * by hand. Method: resolution of the wind vector along and across the runway (flight-physics.md,
 * "The day's wind"): headwind = V cos(θw − θr), crosswind = V sin(θw − θr). The policy numbers in
 * these tests are an operator's (named per test); the common practice they start from — half the
 * steady headwind plus the whole gust increment, 5 to 20 kt — is from memory, not a rule.
 * Rounding rule of this card: components to the nearest knot for printing; the additive from the
 * unrounded components, held within the policy's bounds, then rounded UP to the whole knot.
 */
import fc from 'fast-check';
import { buildCard } from './build-card';
import { CardRefusedError, cardInputsSchema, type CardInputs } from './card';
import { COMMON_PRACTICE_APPROACH_POLICY, approachAdditivePolicySchema, approachPolicyStatement, type ApproachAdditivePolicy } from './approach-policy';
import { cardWind, roundAdditiveUpKt, unroundedAdditiveKt, windComponents } from './card-wind';
import { HAND_CONTEXT, handPistonContent, handPistonInputs, revisionOf } from './testing/test-fixtures';

/** Operator "Kestrel Fen" (invented) uses the common practice: ½ headwind + whole gust, 5–20 kt. */
const KESTREL_POLICY: ApproachAdditivePolicy = { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 };
/** Operator "Larkspur" (invented) adds a third of the headwind and half the gust, 0–15 kt. */
const LARKSPUR_POLICY: ApproachAdditivePolicy = { headwindFraction: 1 / 3, gustFraction: 0.5, minimumKt: 0, maximumKt: 15 };

describe('wind components', () => {
  it('runway 270, wind 300/20: headwind 20·cos 30° = 17.32 kt, crosswind 20·sin 30° = 10 kt from the right', () => {
    const { headwindKt, crosswindKt } = windComponents(270, 300, 20);
    expect(headwindKt).toBeCloseTo(17.3205, 4); // 20 × 0.866025
    expect(crosswindKt).toBeCloseTo(10, 10); // 20 × 0.5, positive: from the right
  });

  it('runway 090, wind 045/12: headwind 12·cos 45° = 8.49 kt, crosswind 12·sin(−45°) = −8.49 kt (from the left)', () => {
    const { headwindKt, crosswindKt } = windComponents(90, 45, 12);
    expect(headwindKt).toBeCloseTo(8.4853, 4); // 12 × 0.707107
    expect(crosswindKt).toBeCloseTo(-8.4853, 4);
  });

  it('runway 360, wind 180/10 is a 10 kt tailwind (negative headwind), no crosswind', () => {
    const { headwindKt, crosswindKt } = windComponents(360, 180, 10);
    expect(headwindKt).toBeCloseTo(-10, 10); // 10 × cos 180° = −10
    expect(Math.abs(crosswindKt)).toBeLessThan(1e-9);
  });

  it('across north: runway 010, wind 350/15 is 15·cos(−20°) = 14.10 kt head, 15·sin(−20°) = −5.13 kt (from the left)', () => {
    const { headwindKt, crosswindKt } = windComponents(10, 350, 15);
    expect(headwindKt).toBeCloseTo(14.0954, 4); // 15 × 0.939693
    expect(crosswindKt).toBeCloseTo(-5.1303, 4); // 15 × −0.342020
  });

  it('the card block: runway 270, wind 300/20G30 prints 17 kt head, 10 kt from the right, gust 26 head 15 across', () => {
    const wind = cardWind({ elevationFt: 0, qnhHpa: 1013, oatC: 15, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } }, handPistonContent().limits)!;
    // gust: 30 × cos 30° = 25.98 → 26; 30 × sin 30° = 15
    expect(wind).toEqual({
      runwayHeadingDeg: 270, directionDeg: 300, speedKt: 20, gustKt: 30,
      headwindKt: 17, crosswindKt: 10, crosswindFrom: 'right', gust: { headwindKt: 26, crosswindKt: 15 }, cautions: [],
    });
  });

  it('cautions (not refusals) above the book’s demonstrated crosswind and tailwind limit, in the gust too', () => {
    const limits = { ...handPistonContent().limits, demonstratedCrosswindKt: 12, maximumTailwindKt: 5 };
    const cross = cardWind({ elevationFt: 0, qnhHpa: 1013, oatC: 15, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } }, limits)!;
    expect(cross.cautions).toEqual(['The crosswind (in the gusts 15 kt) exceeds the 12 kt crosswind the flight manual states as demonstrated.']);
    // runway 090, wind 250/8: 8 × cos 160° = −7.52 → 8 kt tail; 8 × sin 160° = 2.74 → 3 kt from the right
    const tail = cardWind({ elevationFt: 0, qnhHpa: 1013, oatC: 15, runwayHeadingDeg: 90, wind: { directionDeg: 250, speedKt: 8 } }, limits)!;
    expect(tail).toMatchObject({ headwindKt: -8, crosswindKt: 3, crosswindFrom: 'right' });
    expect(tail.cautions).toEqual(['The tailwind (8 kt) exceeds the 5 kt tailwind limit the flight manual states.']);
    const within = cardWind({ elevationFt: 0, qnhHpa: 1013, oatC: 15, runwayHeadingDeg: 90, wind: { directionDeg: 90, speedKt: 25 } }, limits)!;
    expect(within.cautions).toEqual([]);
  });
});

describe('approach additive', () => {
  it('Kestrel’s policy, runway 270, wind 300/20G30: ½ × 17.32 + (30 − 20) = 18.66 → 19 kt (rounded up)', () => {
    const raw = unroundedAdditiveKt(KESTREL_POLICY, windComponents(270, 300, 20).headwindKt, 20, 30);
    expect(raw).toBeCloseTo(18.6603, 4);
    expect(roundAdditiveUpKt(raw)).toBe(19);
  });

  it('Kestrel’s policy holds the additive within 5 and 20 kt', () => {
    // calm: 0 + 0 → the minimum, 5 kt
    expect(unroundedAdditiveKt(KESTREL_POLICY, 0, 0, undefined)).toBe(5);
    // runway 180, wind 180/30G45: ½ × 30 + 15 = 30 → the maximum, 20 kt
    expect(unroundedAdditiveKt(KESTREL_POLICY, windComponents(180, 180, 30).headwindKt, 30, 45)).toBe(20);
  });

  it('a tailwind never takes the additive below the minimum: runway 360, wind 180/10 → 5 kt with Kestrel’s policy', () => {
    expect(unroundedAdditiveKt(KESTREL_POLICY, windComponents(360, 180, 10).headwindKt, 10, undefined)).toBe(5);
  });

  it('Larkspur’s policy, runway 090, wind 120/18G28: ⅓ × 18·cos 30° + ½ × 10 = 5.196 + 5 = 10.196 → 11 kt', () => {
    const raw = unroundedAdditiveKt(LARKSPUR_POLICY, windComponents(90, 120, 18).headwindKt, 18, 28);
    expect(raw).toBeCloseTo(10.1962, 4); // 18 × 0.866025 / 3 = 5.19615
    expect(roundAdditiveUpKt(raw)).toBe(11);
  });

  it('rounds up only past floating-point noise: 10.000000000000002 kt is 10 kt, 10.001 kt is 11 kt', () => {
    expect(roundAdditiveUpKt(10.000000000000002)).toBe(10);
    expect(roundAdditiveUpKt(10.001)).toBe(11);
  });

  it('names the policy it used in a sentence', () => {
    expect(approachPolicyStatement(COMMON_PRACTICE_APPROACH_POLICY)).toBe('half the steady headwind plus the whole gust increment, at least 5 kt and at most 20 kt');
  });

  it('refuses a policy whose maximum is below its minimum, or whose fractions leave 0–1', () => {
    const max = approachAdditivePolicySchema.safeParse({ ...KESTREL_POLICY, maximumKt: 4 });
    expect(max.success).toBe(false);
    expect(max.error?.issues[0]).toMatchObject({ path: ['maximumKt'], message: 'The maximum additive must be at least the minimum.' });
    expect(approachAdditivePolicySchema.safeParse({ ...KESTREL_POLICY, headwindFraction: 1.5 }).success).toBe(false);
    expect(approachAdditivePolicySchema.safeParse({ ...KESTREL_POLICY, maximumKt: Number.NaN }).success).toBe(false);
  });
});

describe('wind inputs', () => {
  const departure = { elevationFt: 2000, qnhHpa: 1013.25, oatC: 0 };
  const issueOf = (conditions: Record<string, unknown>) => {
    const result = cardInputsSchema.safeParse({ ...handPistonInputs(), departure: { ...departure, ...conditions } });
    return result.success ? null : { path: result.error.issues[0].path.join('.'), message: result.error.issues[0].message };
  };

  it('takes a runway heading 1–360 and a wind whose gust is at least its speed', () => {
    expect(issueOf({ runwayHeadingDeg: 360, wind: { directionDeg: 1, speedKt: 0 } })).toBeNull();
    expect(issueOf({ runwayHeadingDeg: 0, wind: { directionDeg: 90, speedKt: 5 } })).toEqual({
      path: 'departure.runwayHeadingDeg',
      message: 'The runway heading in degrees must be from 1 to 360 degrees (north is 360).',
    });
    expect(issueOf({ runwayHeadingDeg: 90, wind: { directionDeg: 361, speedKt: 5 } })?.path).toBe('departure.wind.directionDeg');
    expect(issueOf({ runwayHeadingDeg: 90, wind: { directionDeg: 90, speedKt: 20, gustKt: 15 } })).toEqual({
      path: 'departure.wind.gustKt',
      message: 'The gust must be at least the steady wind speed.',
    });
    expect(issueOf({ runwayHeadingDeg: 90, wind: { directionDeg: 90, speedKt: 151 } })?.path).toBe('departure.wind.speedKt');
    expect(issueOf({ runwayHeadingDeg: 90, wind: { directionDeg: 90, speedKt: Number.NaN } })?.path).toBe('departure.wind.speedKt');
  });

  it('wants the runway heading and the wind together', () => {
    expect(issueOf({ wind: { directionDeg: 90, speedKt: 5 } })).toEqual({ path: 'departure.runwayHeadingDeg', message: 'Give the runway heading with the wind.' });
    expect(issueOf({ runwayHeadingDeg: 90 })).toEqual({ path: 'departure.wind', message: 'Give the wind with the runway heading.' });
  });
});

describe('the approach speed on the card', () => {
  /** The hand piston with a fixed VREF of 65 KIAS at flaps down (VFE 90) and the book's wind limits. */
  const content = () => {
    const base = handPistonContent();
    return {
      ...base,
      speeds: [...base.speeds, { code: 'VREF', label: 'Final approach', phase: 'landing' as const, configurationKey: 'flap', basis: 'ias' as const, kind: 'fixed' as const, valueKt: 65 }],
      limits: { ...base.limits, demonstratedCrosswindKt: 12 },
    };
  };
  const gustyCrosswind = (): CardInputs => ({
    ...handPistonInputs(),
    departure: { elevationFt: 2000, qnhHpa: 1013.25, oatC: 0, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } },
    approachAdditivePolicy: KESTREL_POLICY,
  });

  it('VREF 65 + Kestrel’s 19 kt = 84 KIAS for runway 270, wind 300/20G30 (no arrival: the departure’s wind), with the crosswind caution', () => {
    const card = buildCard(revisionOf(content()), gustyCrosswind(), HAND_CONTEXT);
    expect(card.approach).toEqual({
      windAt: 'departure',
      policy: KESTREL_POLICY,
      policyStatement: 'half the steady headwind plus the whole gust increment, at least 5 kt and at most 20 kt',
      additiveKt: 19,
      speeds: [{ code: 'VREF', configurationKey: 'flap', configurationLabel: 'Flaps down', vrefIasKt: 65, approachIasKt: 84, caution: null }],
    });
    expect(card.departure.wind).toMatchObject({ headwindKt: 17, crosswindKt: 10, crosswindFrom: 'right' });
    expect(card.departure.wind?.cautions).toHaveLength(1);
    // The card records the policy it used in its inputs, so a later policy cannot change it.
    expect(card.inputs.approachAdditivePolicy).toEqual(KESTREL_POLICY);
  });

  it('with an arrival, the arrival’s wind sets the approach; the departure’s only gives its components', () => {
    const inputs: CardInputs = { ...gustyCrosswind(), arrival: { elevationFt: 1000, qnhHpa: 1013.25, oatC: 5, runwayHeadingDeg: 90, wind: { directionDeg: 90, speedKt: 4 } } };
    const card = buildCard(revisionOf(content()), inputs, HAND_CONTEXT);
    // ½ × 4 = 2 → the minimum, 5 kt
    expect(card.approach).toMatchObject({ windAt: 'arrival', additiveKt: 5, speeds: [{ approachIasKt: 70 }] });
    expect(card.arrival?.wind).toMatchObject({ headwindKt: 4, crosswindKt: 0, crosswindFrom: null });
  });

  it('cautions when VREF + additive reaches the landing flap’s VFE', () => {
    const base = content();
    const card = buildCard(revisionOf({ ...base, limits: { ...base.limits, vfeKt: { flap: 82 } } }), gustyCrosswind(), HAND_CONTEXT);
    expect(card.approach?.speeds[0].caution).toBe('VREF + 19 kt reaches the Flaps down VFE of 82 kt: the approach speed must stay below it.');
  });

  it('refuses rather than guesses when the operator’s policy is missing', () => {
    const { approachAdditivePolicy: _policy, ...inputs } = gustyCrosswind();
    expect(() => buildCard(revisionOf(content()), inputs, HAND_CONTEXT)).toThrow(CardRefusedError);
    try {
      buildCard(revisionOf(content()), inputs, HAND_CONTEXT);
    } catch (error) {
      expect((error as CardRefusedError).field).toBe('approachAdditivePolicy');
    }
  });

  it('a card without wind has no wind or approach keys (its digest is as before)', () => {
    const card = buildCard(revisionOf(content()), handPistonInputs(), HAND_CONTEXT);
    expect('approach' in card).toBe(false);
    expect('wind' in card.departure).toBe(false);
  });
});

describe('properties (fast-check)', () => {
  const degrees = fc.double({ min: 1, max: 360, noNaN: true });
  const knots = fc.double({ min: 0, max: 150, noNaN: true });
  const policy = fc
    .record({
      headwindFraction: fc.double({ min: 0, max: 1, noNaN: true }),
      gustFraction: fc.double({ min: 0, max: 1, noNaN: true }),
      a: fc.double({ min: 0, max: 30, noNaN: true }),
      b: fc.double({ min: 0, max: 30, noNaN: true }),
    })
    .map(({ a, b, ...fractions }) => ({ ...fractions, minimumKt: Math.min(a, b), maximumKt: Math.max(a, b) }));

  it('the components’ magnitude equals the wind speed (Pythagoras: cos² + sin² = 1)', () => {
    fc.assert(
      fc.property(degrees, degrees, knots, (runway, direction, speed) => {
        const { headwindKt, crosswindKt } = windComponents(runway, direction, speed);
        expect(Math.hypot(headwindKt, crosswindKt)).toBeCloseTo(speed, 9);
      }),
    );
  });

  it('the additive stays within the policy’s minimum and maximum, and the approach speed is never below VREF nor NaN', () => {
    fc.assert(
      fc.property(policy, degrees, degrees, knots, fc.double({ min: 0, max: 50, noNaN: true }), fc.integer({ min: 40, max: 180 }), (p, runway, direction, speed, gustIncrement, vrefKt) => {
        const gust = Math.min(150, speed + gustIncrement);
        const raw = unroundedAdditiveKt(p, windComponents(runway, direction, speed).headwindKt, speed, gust);
        expect(raw).toBeGreaterThanOrEqual(p.minimumKt);
        expect(raw).toBeLessThanOrEqual(p.maximumKt);
        const approachKt = vrefKt + roundAdditiveUpKt(raw);
        expect(Number.isFinite(approachKt)).toBe(true);
        expect(approachKt).toBeGreaterThanOrEqual(vrefKt);
        expect(approachKt).toBeLessThanOrEqual(vrefKt + Math.ceil(p.maximumKt));
      }),
    );
  });
});
