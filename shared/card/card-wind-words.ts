/**
 * The day's wind and the approach speed in words, wherever a card shows them: the card screen,
 * the printed card and the check page say the same. Pure: no DOM, no Node.
 */
import type { CardApproach, CardApproachSpeed, CardWind, Wind } from './card';
import type { ApproachAdditivePolicy } from './approach-policy';
import { WIND_DIRECTION_REFERENCE, cardInputsSchema } from './card-inputs-schema';

/** The one sentence the form and the card give about the reference of headings and winds. */
export const WIND_REFERENCE_SENTENCE =
  WIND_DIRECTION_REFERENCE === 'magnetic'
    ? 'Runway heading and wind direction in degrees magnetic (°M), as the tower or ATIS gives them; turn a METAR’s true wind to magnetic first.'
    : 'Runway heading and wind direction in degrees true (°T).';

const UNIT = WIND_DIRECTION_REFERENCE === 'magnetic' ? '°M' : '°T';

/** The unit of headings and wind directions as printed: "°M" (magnetic) or "°T" (true). */
export function directionUnit(): string {
  return UNIT;
}

/** A direction as three figures: 90 → "090°M", 45.5 → "045.5°M". */
export function directionWords(deg: number): string {
  const [whole, fraction] = String(deg).split('.');
  return `${whole.padStart(3, '0')}${fraction ? `.${fraction}` : ''}${UNIT}`;
}

/** "300°M 20 kt gusting 30 kt", as entered. */
export function windWords(wind: Pick<Wind, 'directionDeg' | 'speedKt'> & { readonly gustKt?: number | null }): string {
  return `${directionWords(wind.directionDeg)} ${wind.speedKt} kt${wind.gustKt === undefined || wind.gustKt === null ? '' : ` gusting ${wind.gustKt} kt`}`;
}

/** "headwind 17 kt", "tailwind 8 kt" or "no headwind". */
export function headwindWords(headwindKt: number): string {
  if (headwindKt > 0) return `headwind ${headwindKt} kt`;
  if (headwindKt < 0) return `tailwind ${-headwindKt} kt`;
  return 'no headwind';
}

/** "crosswind 10 kt from the right" or "no crosswind". */
export function crosswindWords(wind: Pick<CardWind, 'crosswindKt' | 'crosswindFrom'>): string {
  return wind.crosswindKt === 0 || wind.crosswindFrom === null ? 'no crosswind' : `crosswind ${wind.crosswindKt} kt from the ${wind.crosswindFrom}`;
}

/** The components in one line: "headwind 17 kt · crosswind 10 kt from the right · in the gusts 26 kt head, 15 kt across". */
export function componentWords(wind: CardWind): string {
  const gust = wind.gust ? ` · in the gusts ${wind.gust.headwindKt < 0 ? `${-wind.gust.headwindKt} kt tail` : `${wind.gust.headwindKt} kt head`}, ${wind.gust.crosswindKt} kt across` : '';
  return `${headwindWords(wind.headwindKt)} · ${crosswindWords(wind)}${gust}`;
}

/** "runway 270°M, wind 300°M 20 kt gusting 30 kt". */
export function runwayAndWindWords(wind: CardWind): string {
  return `runway ${directionWords(wind.runwayHeadingDeg)}, wind ${windWords(wind)}`;
}

/** "VREF 62 + 19 = 81 KIAS". */
export function approachSpeedWords(speed: CardApproachSpeed, additiveKt: number): string {
  return `${speed.code} ${speed.vrefIasKt} + ${additiveKt} = ${speed.approachIasKt} KIAS`;
}

/** "Additive 19 kt, by the operator’s policy: half the steady headwind … (the arrival’s wind)." */
export function approachPolicyWords(approach: CardApproach): string {
  return `Additive ${approach.additiveKt} kt, by the operator’s policy: ${approach.policyStatement} (the ${approach.windAt}’s wind).`;
}

/** The wind in a kneeboard's short form: "rwy 270°M · 300°M 20G30 kt · head 17 · cross 10 R". */
export function shortWindWords(wind: CardWind, withRunway: boolean): string {
  const along = (kt: number) => (kt < 0 ? `tail ${-kt}` : `head ${kt}`);
  const cross = wind.crosswindFrom === null ? 'cross 0' : `cross ${wind.crosswindKt} ${wind.crosswindFrom === 'right' ? 'R' : 'L'}`;
  return `${withRunway ? `rwy ${directionWords(wind.runwayHeadingDeg)} · ` : ''}${directionWords(wind.directionDeg)} ${wind.speedKt}${wind.gustKt === null ? '' : `G${wind.gustKt}`} kt · ${along(wind.headwindKt)} · ${cross}`;
}

/** A policy in a few words: "½ headwind + gust, 5–20 kt" (a whole share is written without a figure). */
export function compactPolicyWords(policy: ApproachAdditivePolicy): string {
  const share = (fraction: number) => (fraction === 1 ? '' : fraction === 0.5 ? '½ ' : `${Math.round(fraction * 1000) / 1000} × `);
  return `${share(policy.headwindFraction)}headwind + ${share(policy.gustFraction)}gust, ${policy.minimumKt}–${policy.maximumKt} kt`;
}

/** "Approach: VREF + 11 kt, by the operator’s policy (⅓ headwind + ½ gust, 3–15 kt; departure wind)." (the printed card's fine print) */
export function approachShortPolicyWords(approach: CardApproach): string {
  return `Approach: VREF + ${approach.additiveKt} kt, by the operator’s policy (${compactPolicyWords(approach.policy)}; ${approach.windAt} wind).`;
}

/**
 * The wind where a card lands and the operator's policy it used, read from a card's inputs as the
 * card log keeps them: "rwy 270°M · 300°M 20G30 kt · ½ headwind + gust, 5–20 kt";
 * "–" without a wind (or for inputs that are not a card's).
 */
export function landingWindWords(rawInputs: unknown): string {
  const parsed = cardInputsSchema.safeParse(rawInputs);
  if (!parsed.success) return '–';
  const inputs = parsed.data;
  const landing = inputs.arrival ?? inputs.departure;
  if (!landing.wind || landing.runwayHeadingDeg === undefined) return '–';
  const policy = inputs.approachAdditivePolicy ? ` · ${compactPolicyWords(inputs.approachAdditivePolicy)}` : '';
  const { wind } = landing;
  return `rwy ${directionWords(landing.runwayHeadingDeg)} · ${directionWords(wind.directionDeg)} ${wind.speedKt}${wind.gustKt === undefined ? '' : `G${wind.gustKt}`} kt${policy}`;
}
