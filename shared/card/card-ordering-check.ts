/**
 * The ordering rules (ordering-rules.ts) applied to a card: the figures they read, the rules a
 * book records an exception for, and the refusal for the first rule broken without one.
 */
import type { RevisionContent } from '../speed-book/revision-content';
import { speedRole } from '../speed-book/speed-class';
import type { CardLimitSpeed } from './card';
import type { ComputedLimits } from './card-limits';
import { refuse } from './card-refusal';
import type { ComputedSpeed } from './card-speeds';
import { ORDERING_RULES, type OrderingFigure, type OrderingFigures, type OrderingViolation } from './ordering-rules';

/** The ids of the rules `content` records an exception for (the flight manual's reason). */
export function exceptedRuleIds(content: RevisionContent): Set<string> {
  return new Set((content.ruleExceptions ?? []).map((exception) => exception.ruleId));
}

/** Refuses the card for the first broken rule the book records no exception for. */
export function refuseBrokenRules(content: RevisionContent, violations: readonly OrderingViolation[]): void {
  const excepted = exceptedRuleIds(content);
  const broken = violations.find((violation) => !excepted.has(violation.ruleId));
  if (!broken) return;
  const rule = ORDERING_RULES.find((candidate) => candidate.id === broken.ruleId)!;
  refuse(
    'ordering-rule-broken',
    'revision',
    `This speed book breaks the rule ${rule.title} at these inputs: ${broken.message} The card is refused; ask the fleet engineer to correct the book.`,
  );
}

/** The figures the ordering rules read, from this card's speeds and the book's limits. */
export function orderingFiguresOf(content: RevisionContent, speeds: readonly ComputedSpeed[], limits: ComputedLimits): OrderingFigures {
  const figure = (speed: ComputedSpeed): OrderingFigure => ({
    code: speed.card.code,
    iasKt: speed.card.iasKt,
    casKt: speed.card.casKt,
    exactCasKt: speed.casKt,
    weightKg: speed.card.weightKg,
  });
  const byRole = (role: string) => {
    const found = speeds.find((speed) => speedRole(speed.card.code) === role);
    return found ? figure(found) : undefined;
  };
  const basis = content.indicatorMarkingBasis;
  const inBasis = (speed: CardLimitSpeed | null) => (speed ? (basis === 'ias' ? speed.iasKt : speed.casKt) : undefined);
  const card = limits.card;
  return {
    v1: byRole('V1'),
    vr: byRole('VR'),
    v2: byRole('V2'),
    vref: speeds.filter((speed) => speedRole(speed.card.code) === 'VREF').map(figure),
    vs0: byRole('VS0'),
    vs1: byRole('VS1') ?? byRole('VS'),
    vx: byRole('VX'),
    vy: byRole('VY'),
    vmc: card.vmc && limits.vmcCasKt !== null ? { code: 'VMC', iasKt: card.vmc.iasKt, casKt: card.vmc.casKt, exactCasKt: limits.vmcCasKt, weightKg: null } : undefined,
    vnoKt: inBasis(card.vno),
    vneKt: inBasis(card.vne),
    vleKt: inBasis(card.vle),
    vloKt: inBasis(card.vlo),
    vfe: card.vfe.map((vfe) => ({ label: vfe.configurationLabel, kt: inBasis(vfe)! })),
    mmo: limits.mmo ?? undefined,
    referenceStallSpeeds: content.statesReferenceStallSpeeds === true,
  };
}
