/**
 * The operator's approach additive policy: how much it adds to VREF for the day's wind. An
 * operator sets its own numbers (`PATCH /api/operator/settings`); devices receive them with the
 * sync and put them into the card's inputs, so a card keeps the policy it was made with after
 * the operator changes it, and the check page re-derives it from the QR code alone.
 *
 * additive = headwindFraction × steady headwind (a tailwind counts as none)
 *          + gustFraction × gust increment (gust − steady speed),
 * then held within [minimumKt, maximumKt] (card-wind.ts computes it).
 *
 * Written with zod's small build (`zod/mini`), like the card inputs it is part of.
 */
import * as z from 'zod/mini';

/** The bounds an operator may choose within (kt); above 30 kt an additive is no longer a wind allowance. */
export const APPROACH_ADDITIVE_BOUNDS_KT = { min: 0, max: 30 } as const;

const fraction = (what: string) =>
  z
    .number({ error: (issue) => (issue.input === undefined ? `Give the fraction of ${what}.` : `The fraction of ${what} must be a number.`) })
    .check(z.minimum(0, `The fraction of ${what} must be 0 or more.`), z.maximum(1, `The fraction of ${what} must be at most 1 (the whole of it).`));

const knots = (what: string) =>
  z
    .number({ error: (issue) => (issue.input === undefined ? `Give the ${what} in kt.` : `The ${what} must be a number of knots.`) })
    .check(
      z.minimum(APPROACH_ADDITIVE_BOUNDS_KT.min, `The ${what} must be ${APPROACH_ADDITIVE_BOUNDS_KT.min} kt or more.`),
      z.maximum(APPROACH_ADDITIVE_BOUNDS_KT.max, `The ${what} must be at most ${APPROACH_ADDITIVE_BOUNDS_KT.max} kt.`),
    );

export const approachAdditivePolicySchema = z
  .strictObject({
    /** Share of the steady headwind component added, 0–1 (½ in common practice). */
    headwindFraction: fraction('the steady headwind'),
    /** Share of the gust increment (gust − steady speed) added, 0–1 (the whole in common practice). */
    gustFraction: fraction('the gust increment'),
    /** The least additive, kt, whatever the wind (also with a tailwind). */
    minimumKt: knots('minimum additive'),
    /** The most additive, kt, whatever the wind. */
    maximumKt: knots('maximum additive'),
  })
  .check(z.refine((policy) => policy.minimumKt <= policy.maximumKt, { message: 'The maximum additive must be at least the minimum.', path: ['maximumKt'] }));
export type ApproachAdditivePolicy = z.infer<typeof approachAdditivePolicySchema>;

/**
 * The common practice (from memory, not a rule; flight-physics.md "The day's wind"): half the
 * steady headwind plus the whole gust increment, at least 5 kt and at most 20 kt. An operator
 * that has not chosen its own numbers has these.
 */
export const COMMON_PRACTICE_APPROACH_POLICY: ApproachAdditivePolicy = { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 };

const FRACTION_WORDS: Readonly<Record<string, string>> = { '0': 'none of the', '0.25': 'a quarter of the', '0.5': 'half the', '0.75': 'three quarters of the', '1': 'the whole' };

function fractionWords(fraction: number): string {
  return FRACTION_WORDS[String(fraction)] ?? `${Math.round(fraction * 1000) / 1000} × the`;
}

/**
 * The policy in one sentence, as the card and the settings page name it.
 * @example approachPolicyStatement(COMMON_PRACTICE_APPROACH_POLICY)
 *   // 'half the steady headwind plus the whole gust increment, at least 5 kt and at most 20 kt'
 */
export function approachPolicyStatement(policy: ApproachAdditivePolicy): string {
  return `${fractionWords(policy.headwindFraction)} steady headwind plus ${fractionWords(policy.gustFraction)} gust increment, at least ${policy.minimumKt} kt and at most ${policy.maximumKt} kt`;
}
