/**
 * Icing conditions on the card: the speeds of a configuration up by the flight manual's ice
 * increment for that configuration (`iceIncrementKt`, content-shape.ts), shown beside the
 * normal figures.
 *
 * Rule (common practice, from memory: flight manuals state the ice increment as knots to add to
 * the normal indicated speed): the increment is added to the speed as printed, after rounding,
 * so the card's two figures differ by exactly the increment the book states. It applies to the
 * speeds of class takeoff, minimum (V2, VREF; never VMC), climb and approach; stall and limit
 * speeds (and the book's "other" speeds) are not increased. A configuration without a stated
 * increment gets a note, never a guessed figure — the cautious and clearly-stated option: the
 * card still gives the normal speeds and says plainly that the book gives no iced figure.
 *
 * The iced speeds keep the ordering rules (ordering-rules.ts): they are run on the iced figures
 * (CAS through the configuration's position-error table), and the card is refused when one is
 * broken or an iced speed lies beyond the table — nothing is extrapolated.
 */
import * as aero from '../aero';
import type { RevisionContent } from '../speed-book/revision-content';
import { speedClassOf, speedRole, type SpeedClass } from '../speed-book/speed-class';
import type { CardIcedSpeed, CardIcing } from './card-icing-model';
import type { ComputedLimits } from './card-limits';
import { orderingFiguresOf, refuseBrokenRules } from './card-ordering-check';
import { guarded } from './card-refusal';
import { ROUNDERS } from './card-rounding';
import type { ComputedSpeed } from './card-speeds';
import { orderingViolations, type OrderingViolation } from './ordering-rules';

const { iasToCasKt } = aero;

/** The speed classes an ice increment applies to (stall, limit and other speeds never). */
export const ICED_SPEED_CLASSES: ReadonlySet<SpeedClass> = new Set<SpeedClass>(['takeoff', 'minimum', 'climb', 'approach']);

/** Whether the ice increment applies to `speed` (VMC, a minimum-control limit, never). */
export function takesIceIncrement(speed: { readonly code: string; readonly speedClass?: SpeedClass }): boolean {
  return ICED_SPEED_CLASSES.has(speedClassOf(speed)) && speedRole(speed.code) !== 'VMC';
}

/**
 * The icing part of the card for `speeds` (the card's computed speeds, in order), or undefined
 * when icing is not ticked. Refuses the card (`CardRefusedError`, field `icing`) when an iced
 * speed lies beyond its configuration's position-error table or breaks an ordering rule.
 */
export function cardIcing(content: RevisionContent, icing: boolean | undefined, speeds: readonly ComputedSpeed[], limits: ComputedLimits): CardIcing | undefined {
  if (icing !== true) return undefined;
  const { card, icedSpeeds } = icedFigures(content, speeds);
  refuseBrokenRules(content, orderingViolations(orderingFiguresOf(content, icedSpeeds, limits)));
  return card;
}

/**
 * The ordering rules the iced speeds break, for the envelope sweep (coverage.ts), so that the
 * review sees a book whose iced speeds a card would refuse; none when the book states no
 * increment. Throws `CardRefusedError` for an iced speed beyond its position-error table.
 */
export function icedViolations(content: RevisionContent, speeds: readonly ComputedSpeed[], limits: ComputedLimits): OrderingViolation[] {
  if (!content.configurations.some((configuration) => configuration.iceIncrementKt !== undefined)) return [];
  return orderingViolations(orderingFiguresOf(content, icedFigures(content, speeds).icedSpeeds, limits));
}

/** The iced speeds (as the card shows them) and the card's speeds with the iced figures in place. */
function icedFigures(content: RevisionContent, speeds: readonly ComputedSpeed[]): { card: CardIcing; icedSpeeds: ComputedSpeed[] } {
  const incrementOf = new Map(content.configurations.map((configuration) => [configuration.key, configuration.iceIncrementKt]));
  const bookSpeedOf = new Map(content.speeds.map((speed) => [`${speed.configurationKey}\u0000${speed.code}`, speed]));
  const iced: CardIcedSpeed[] = [];
  const icedComputed: ComputedSpeed[] = [];
  const missing: string[] = [];
  for (const speed of speeds) {
    const bookSpeed = bookSpeedOf.get(`${speed.card.configurationKey}\u0000${speed.card.code}`);
    if (!bookSpeed || !takesIceIncrement(bookSpeed)) {
      icedComputed.push(speed);
      continue;
    }
    const incrementKt = incrementOf.get(speed.card.configurationKey);
    if (incrementKt === undefined) {
      if (!missing.includes(speed.card.configurationLabel)) missing.push(speed.card.configurationLabel);
      icedComputed.push(speed);
      continue;
    }
    const icedIasKt = speed.card.iasKt + incrementKt;
    const icedCasKt = guarded(
      () => iasToCasKt(speed.table, icedIasKt),
      () => 'icing',
      `${speed.card.code} (${speed.card.label}) in icing conditions, ${icedIasKt} kt: `,
    );
    iced.push({
      code: speed.card.code,
      configurationKey: speed.card.configurationKey,
      configurationLabel: speed.card.configurationLabel,
      iasKt: speed.card.iasKt,
      icedIasKt,
      incrementKt,
      label: speed.card.label,
    });
    icedComputed.push({ ...speed, casKt: icedCasKt, card: { ...speed.card, iasKt: icedIasKt, casKt: ROUNDERS[speed.card.rounding](icedCasKt) } });
  }
  const notes = missing.map((label) => `No ice increment stated for ${label}: the book gives no iced figures for it; the normal speeds are shown.`);
  return { card: { notes, speeds: iced }, icedSpeeds: icedComputed };
}
