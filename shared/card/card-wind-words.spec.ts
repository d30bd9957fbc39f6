/** The wind in words, as the card page, the printed card, the check page and the card log say it. */
import { COMMON_PRACTICE_APPROACH_POLICY } from './approach-policy';
import { compactPolicyWords, crosswindWords, directionWords, headwindWords, landingWindWords, windWords } from './card-wind-words';
import { handPistonInputs } from './testing/test-fixtures';

describe('wind words', () => {
  it('writes directions in three figures with their reference, and the wind as reported', () => {
    expect(directionWords(90)).toBe('090°M');
    expect(directionWords(45.5)).toBe('045.5°M');
    expect(windWords({ directionDeg: 300, speedKt: 20, gustKt: 30 })).toBe('300°M 20 kt gusting 30 kt');
    expect(windWords({ directionDeg: 300, speedKt: 20, gustKt: null })).toBe('300°M 20 kt');
  });

  it('says a tailwind as a tailwind and the side of a crosswind', () => {
    expect(headwindWords(17)).toBe('headwind 17 kt');
    expect(headwindWords(-8)).toBe('tailwind 8 kt');
    expect(headwindWords(0)).toBe('no headwind');
    expect(crosswindWords({ crosswindKt: 10, crosswindFrom: 'right' })).toBe('crosswind 10 kt from the right');
    expect(crosswindWords({ crosswindKt: 0, crosswindFrom: null })).toBe('no crosswind');
  });

  it('gives the card log the wind where the card lands and the policy it used, or a dash', () => {
    expect(compactPolicyWords(COMMON_PRACTICE_APPROACH_POLICY)).toBe('½ headwind + gust, 5–20 kt');
    expect(landingWindWords(handPistonInputs())).toBe('–');
    expect(landingWindWords({ nothing: 'of a card' })).toBe('–');
    const inputs = { ...handPistonInputs(), departure: { ...handPistonInputs().departure, runwayHeadingDeg: 270, wind: { directionDeg: 300, speedKt: 20, gustKt: 30 } }, approachAdditivePolicy: COMMON_PRACTICE_APPROACH_POLICY };
    expect(landingWindWords(inputs)).toBe('rwy 270°M · 300°M 20G30 kt · ½ headwind + gust, 5–20 kt');
  });
});
