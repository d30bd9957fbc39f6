/**
 * `buildCard`: the speed card for one day's weight and atmosphere, from a revision's content.
 * Pure and deterministic (no clock, no I/O, no Node or DOM APIs), so the device computes it
 * offline and the server re-derives the same card, to the digest, from the same inputs.
 *
 * Methods (all numeric work is the flight-physics library's, shared/aero):
 * - pressure altitude from elevation and QNH by the ISA altimeter relation, density altitude
 *   with the virtual temperature (flight-physics.md, "Altimetry");
 * - weight-scaled speeds V = Vref·√(W/Wref), applied to the calibrated airspeed (the lift at a
 *   fixed angle of attack follows the dynamic pressure, which CAS stands for at these speeds —
 *   common practice), then IAS through the configuration's position-error table;
 * - tabulated speeds read by linear interpolation, never extrapolated;
 * - stall speed in a level turn Vs·√n, n = 1/cos(bank);
 * - CAS/EAS/TAS/Mach by the pitot–static relations of NASA RP 1046; crossover of VMO and MMO;
 * - rounding as printed: limits down, stall speeds up, others nearest (flight-physics.md).
 *
 * The concerns live beside it, one a file: inputs (card-inputs.ts), the checked content
 * (checked-content.ts), weights (card-weights.ts), the day's atmosphere (card-atmosphere.ts),
 * the envelope (card-envelope-check.ts), speeds and stall in a turn (card-speeds.ts), limits
 * (card-limits.ts), the ordering rules (card-ordering-check.ts), cruise and altitude table
 * (card-cruise.ts, card-altitude-table.ts), icing conditions (card-icing.ts), the day's wind and the approach speed by the
 * operator's additive policy (card-wind.ts), the indicator (card-indicator.ts), rounding
 * (card-rounding.ts) and refusals (card-refusal.ts).
 *
 * Anything outside the flight manual's data or the modelled atmosphere refuses the card with a
 * `CardRefusedError` naming the input at fault.
 */
import type { RevisionContent } from '../speed-book/revision-content';
import { CARD_VERSION, type AerodromeConditions, type CardAerodrome, type CardContext, type CardInputs, type CardRevision, type CardSpeed, type SpeedCard } from './card';
import { altitudeTable } from './card-altitude-table';
import { aerodrome } from './card-atmosphere';
import { plannedCruise } from './card-cruise';
import { cardDigest } from './card-digest';
import { checkEnvelope, checkPhaseEnvelope } from './card-envelope-check';
import { cardIndicator } from './card-indicator';
import { parseInputs, sortedKeys } from './card-inputs';
import { orderingFiguresOf, refuseBrokenRules } from './card-ordering-check';
import { refuse } from './card-refusal';
import { cardSpeeds, stallInTurn } from './card-speeds';
import { checkWeights, landingWeight } from './card-weights';
import { checkedContent } from './checked-content';
import { orderingViolations, type OrderingViolation } from './ordering-rules';
import { SpeedBook } from './speed-book-reader';
import { cardApproach, cardWind } from './card-wind';
import { cardIcing, icedViolations } from './card-icing';

// The public names that used to live here, so every import of build-card keeps working.
export { HIGH_DENSITY_ALTITUDE_ABOVE_FIELD_FT, HIGH_DENSITY_ALTITUDE_FT } from './card-atmosphere';
export { exceptedRuleIds } from './card-ordering-check';
export { takeoffConfigurationKeys } from './speed-book-reader';

/**
 * How much of the card the envelope sweep needs: one phase's speeds and the ordering rules,
 * without the altitude table or the digest. Internal to shared/card (coverage.ts).
 */
export interface CardScope {
  readonly phase: 'takeoff' | 'landing';
  /** Landing only: the approach and landing speeds of this configuration (every one when absent). */
  readonly landingConfigurationKey?: string;
}

/** A card's speeds and the ordering rules they break, before any refusal for a broken rule. */
export interface CardFigures {
  readonly speeds: readonly CardSpeed[];
  readonly violations: readonly OrderingViolation[];
}

/**
 * The speed card for `inputs`, from `revision` (content checked against its hash first) for
 * the airframe, type, speed book and operator of `context`.
 *
 * @example buildCard(revision, { airframeId: 7, weightKg: 1000, configuration: 'takeoff-flap',
 *   departure: { elevationFt: 500, qnhHpa: 1013, oatC: 20 }, isaDeviationC: 5,
 *   cruise: { iasKt: 110 }, altitudeStepFt: 1000 }, context)
 * @throws CardRefusedError when the card cannot be given (see `CARD_REFUSAL_CODES`)
 */
export function buildCard(revision: CardRevision, rawInputs: CardInputs, context: CardContext): SpeedCard {
  const inputs = parseInputs(rawInputs);
  const content = checkedContent(revision);
  if (context.airframe.id !== inputs.airframeId) {
    refuse('airframe-mismatch', 'airframeId', `These inputs are for airframe ${inputs.airframeId}, not ${context.airframe.registration}.`);
  }
  const book = SpeedBook.of(content);
  const takeoffConfiguration = book.takeoffConfiguration(inputs.configuration);
  checkWeights(content, inputs);
  const landing = landingWeight(content, inputs);

  const departure = aerodrome(inputs.departure, 'departure');
  const arrival = inputs.arrival ? aerodrome(inputs.arrival, 'arrival') : null;
  checkEnvelope(book.envelope, departure, arrival, inputs);
  const speeds = cardSpeeds(book, inputs, landing.weightKg, takeoffConfiguration.key, departure, arrival);
  const limits = book.limits();
  refuseBrokenRules(content, orderingViolations(orderingFiguresOf(content, speeds, limits)));
  // The iced speeds keep the ordering rules too; the key exists only when icing is ticked.
  const icing = cardIcing(content, inputs.icing, speeds, limits);
  const cruise = plannedCruise(book, inputs.cruise);
  const cardSpeedList = speeds.map((speed) => speed.card);
  // Approach and landing use the arrival's conditions, or the departure's without an arrival.
  const landingAt = inputs.arrival ? { conditions: inputs.arrival, where: 'arrival' as const } : { conditions: inputs.departure, where: 'departure' as const };
  const approach = cardApproach(landingAt, inputs.approachAdditivePolicy, cardSpeedList, limits.card.vfe);
  // The wind keys exist only when a wind was given, so cards without one keep their digest.
  const withWind = (card: CardAerodrome, conditions: AerodromeConditions): CardAerodrome => {
    const wind = cardWind(conditions, content.limits);
    return wind ? { ...card, wind } : card;
  };

  // Every object of the card is written with its keys in RFC 8785 order, so that the digest
  // can use JSON.stringify as it is (card-digest.ts); the order is checked there, not trusted.
  const body: Omit<SpeedCard, 'digest'> = {
    aircraftType: {
      category: content.aircraft.category,
      ceilingFt: content.aircraft.ceilingFt,
      designator: context.aircraftType.designator,
      engines: content.aircraft.engines,
      name: context.aircraftType.name,
    },
    airframe: { id: context.airframe.id, registration: context.airframe.registration },
    altitudeTable: altitudeTable(book, inputs, cruise, limits),
    ...(approach ? { approach } : {}),
    arrival: arrival && inputs.arrival ? withWind(arrival.card, inputs.arrival) : null,
    cardVersion: CARD_VERSION,
    crossoverAltitudeFt: limits.crossoverFt,
    cruise: cruise.card,
    demo: context.demo,
    departure: withWind(departure.card, inputs.departure),
    ...(icing ? { icing } : {}),
    indicator: cardIndicator(content, speeds, limits),
    inputs: sortedKeys(inputs),
    landing,
    limits: limits.card,
    revision: { contentSha256: revision.contentSha256, id: revision.id, number: revision.number, publishedAt: revision.publishedAt },
    speedBook: { id: context.speedBook.id, title: context.speedBook.title },
    speeds: cardSpeedList,
    stallInTurn: stallInTurn(speeds),
    takeoffConfiguration: { key: takeoffConfiguration.key, label: takeoffConfiguration.label },
  };
  return { digest: cardDigest(body), ...body };
}

/**
 * The speeds of one phase of a card and the ordering rules they break, for the envelope sweep:
 * the same reading of the book, the same tables and rounding as `buildCard`, from content
 * already parsed. Refusals throw `CardRefusedError` as `buildCard` does; broken rules are
 * returned rather than thrown, so the sweep can tell "refused" from "rule broken".
 * Takeoff: the takeoff configuration's speeds at `inputs.departure`; landing: the approach and
 * landing speeds at `inputs.arrival` and `inputs.landingWeightKg`. Both check the envelope.
 * When the book states ice increments, the rules broken by the iced figures are returned too,
 * and an iced speed beyond its position-error table refuses, as the card with icing would.
 */
export function cardFigures(content: RevisionContent, inputs: CardInputs, scope: CardScope): CardFigures {
  const book = SpeedBook.of(content);
  const takeoffKey = scope.phase === 'takeoff' ? book.takeoffConfiguration(inputs.configuration).key : null;
  checkWeights(content, inputs);
  const landing = landingWeight(content, inputs);
  const conditions = scope.phase === 'takeoff' ? inputs.departure : inputs.arrival ?? inputs.departure;
  const where = aerodrome(conditions, scope.phase === 'takeoff' ? 'departure' : 'arrival');
  if (scope.phase === 'takeoff') checkPhaseEnvelope(book.envelope.takeoff, where, 'departure', 'takeoff');
  else checkPhaseEnvelope(book.envelope.landing, where, 'arrival', 'landing');
  const speeds = cardSpeeds(book, inputs, landing.weightKg, takeoffKey, where, where, scope.phase, scope.landingConfigurationKey);
  const limits = book.limits();
  const violations = orderingViolations(orderingFiguresOf(content, speeds, limits));
  // A book with ice increments: the rules must hold for the iced figures too (a rule broken both ways counts once).
  const iced = icedViolations(content, speeds, limits).filter((violation) => !violations.some((normal) => normal.ruleId === violation.ruleId));
  return { speeds: speeds.map((speed) => speed.card), violations: [...violations, ...iced] };
}

