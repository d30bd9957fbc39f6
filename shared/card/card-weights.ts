/**
 * The weights of the day: the takeoff and landing weights checked against the flight manual's
 * (the card is refused outside them, never extrapolated), and the landing weight the approach
 * and landing speeds use.
 */
import type { RevisionContent } from '../speed-book/revision-content';
import type { CardInputs, CardLanding } from './card';
import { refuse } from './card-refusal';
import { kg } from './card-rounding';

/** Refuses weights outside the flight manual's (takeoff, landing, and landing above takeoff). */
export function checkWeights(content: RevisionContent, inputs: CardInputs): void {
  const { minimumKg, maximumTakeoffKg, maximumLandingKg } = content.weights;
  const { weightKg, landingWeightKg } = inputs;
  if (weightKg > maximumTakeoffKg) {
    refuse('weight-out-of-range', 'weightKg', `The takeoff weight ${kg(weightKg)} is above the maximum takeoff weight of ${kg(maximumTakeoffKg)}.`);
  }
  if (weightKg < minimumKg) {
    refuse('weight-out-of-range', 'weightKg', `The takeoff weight ${kg(weightKg)} is below the flight manual's lowest weight of ${kg(minimumKg)}.`);
  }
  if (landingWeightKg === undefined) return;
  if (landingWeightKg > maximumLandingKg) {
    refuse('landing-weight-out-of-range', 'landingWeightKg', `The landing weight ${kg(landingWeightKg)} is above the maximum landing weight of ${kg(maximumLandingKg)}.`);
  }
  if (landingWeightKg < minimumKg) {
    refuse('landing-weight-out-of-range', 'landingWeightKg', `The landing weight ${kg(landingWeightKg)} is below the flight manual's lowest weight of ${kg(minimumKg)}.`);
  }
  if (landingWeightKg > weightKg) {
    refuse('landing-weight-out-of-range', 'landingWeightKg', `The landing weight ${kg(landingWeightKg)} cannot be above the takeoff weight ${kg(weightKg)}.`);
  }
}

/**
 * The landing weight the approach and landing speeds use: the one entered; else the takeoff
 * weight when it is within the maximum landing weight; else the maximum landing weight, which
 * the card says in words (the pilot may enter the landing weight instead).
 */
export function landingWeight(content: RevisionContent, inputs: CardInputs): CardLanding {
  const { maximumLandingKg } = content.weights;
  if (inputs.landingWeightKg !== undefined) {
    return { source: 'entered', statement: `Landing speeds at the landing weight entered, ${kg(inputs.landingWeightKg)}.`, weightKg: inputs.landingWeightKg };
  }
  if (inputs.weightKg <= maximumLandingKg) {
    return { source: 'takeoff-weight', statement: `Landing speeds at the takeoff weight, ${kg(inputs.weightKg)}; enter a landing weight for lighter landing speeds.`, weightKg: inputs.weightKg };
  }
  return {
    source: 'maximum-landing-weight',
    statement: `The takeoff weight ${kg(inputs.weightKg)} is above the maximum landing weight, so the landing speeds are for the maximum landing weight, ${kg(maximumLandingKg)}; enter the landing weight for the day's figures.`,
    weightKg: maximumLandingKg,
  };
}
