/**
 * The ordering and consistency rules of a speed book's speeds, checked on every card (a card
 * that breaks one is refused unless the book records the flight manual's reason for the
 * exception) and at every point of the envelope sweep. One table, stable ids: the review page
 * shows `title` and `source` from the coverage report, and `ruleExceptions[].ruleId` names them.
 *
 * Sources are the airworthiness codes as we know them (CS-23/CS-25, 14 CFR Parts 23/25); where
 * the paragraph is quoted from memory the source says so (flight-physics.md, "Ordering").
 *
 * Ratio and minimum rules (V2 ≥ 1.1 VMC, VREF ≥ 1.3 VS0, VREF ≥ VMC) compare calibrated
 * airspeeds, as the codes define them, before rounding; order rules compare the figures as
 * printed, in IAS and in CAS, so that no printed pair is out of order. Stall speeds are brought
 * to the weight of the speed they are compared with by V = Vs·√(W/Ws) (FAA handbooks).
 */

import { ORDERING_RULES, type OrderingRule, type OrderingRuleId } from '../speed-book/ordering-rule-table';

export { ORDERING_RULES, type OrderingRule, type OrderingRuleId };

const RULES_BY_ID: ReadonlyMap<string, OrderingRule> = new Map(ORDERING_RULES.map((rule) => [rule.id, rule]));

/** The rule with `id`, or undefined for an id that names none. */
export function orderingRule(id: string): OrderingRule | undefined {
  return RULES_BY_ID.get(id);
}

/** One figure a rule reads: as printed (IAS and CAS) and its unrounded CAS. */
export interface OrderingFigure {
  /** The code as the book spells it (VSO, VS1G …), for the sentence. */
  readonly code: string;
  readonly iasKt: number;
  readonly casKt: number;
  readonly exactCasKt: number;
  /** The weight it was computed at, kg; null for a fixed limit. */
  readonly weightKg: number | null;
}

/** What the rules read from one card (or one sweep point). Absent figures skip their rules. */
export interface OrderingFigures {
  readonly v1?: OrderingFigure;
  readonly vr?: OrderingFigure;
  readonly v2?: OrderingFigure;
  /** Every VREF of the card (one per landing configuration). */
  readonly vref: readonly OrderingFigure[];
  readonly vs0?: OrderingFigure;
  readonly vs1?: OrderingFigure;
  readonly vx?: OrderingFigure;
  readonly vy?: OrderingFigure;
  readonly vmc?: OrderingFigure;
  /** Limits in the book's marking basis, as printed. */
  readonly vnoKt?: number;
  readonly vneKt?: number;
  readonly vleKt?: number;
  readonly vloKt?: number;
  /** VFE per configuration in the book's order (least flap first), as printed in the marking basis. */
  readonly vfe: readonly { readonly label: string; readonly kt: number }[];
  readonly mmo?: number;
  /** The book states reference stall speeds (VSR): VREF ≥ 1.23 VSR0 instead of 1.3 VS0. */
  readonly referenceStallSpeeds: boolean;
}

export interface OrderingViolation {
  readonly ruleId: OrderingRuleId;
  /** One sentence with the figures. */
  readonly message: string;
}

const kt = (value: number) => `${Math.round(value * 10) / 10} kt`;

/** A stall speed at `weightKg` (V = Vs·√(W/Ws)); the figure itself when either weight is unknown. */
function stallAt(stall: OrderingFigure, weightKg: number | null): number {
  if (weightKg === null || stall.weightKg === null) return stall.exactCasKt;
  return stall.exactCasKt * Math.sqrt(weightKg / stall.weightKg);
}

/** Both printed columns of `low` at or below those of `high`. */
function printedInOrder(low: OrderingFigure, high: OrderingFigure): boolean {
  return low.iasKt <= high.iasKt && low.casKt <= high.casKt;
}

/** Every rule `figures` break, in the order of `ORDERING_RULES`; empty when none. */
export function orderingViolations(figures: OrderingFigures): OrderingViolation[] {
  const found: OrderingViolation[] = [];
  const add = (ruleId: OrderingRuleId, message: string) => found.push({ ruleId, message });
  const { v1, vr, v2, vs0, vs1, vx, vy, vmc } = figures;

  const takeoff = [v1, vr, v2].filter((figure): figure is OrderingFigure => figure !== undefined);
  for (let i = 1; i < takeoff.length; i++) {
    if (!printedInOrder(takeoff[i - 1], takeoff[i])) {
      add('v1-vr-v2', `${takeoff[i].code} ${takeoff[i].iasKt} KIAS is below ${takeoff[i - 1].code} ${takeoff[i - 1].iasKt} KIAS; V1 ≤ VR ≤ V2 must hold.`);
      break;
    }
  }
  if (v2 && vmc && v2.exactCasKt < 1.1 * vmc.exactCasKt - 1e-9) {
    add('v2-vmc', `${v2.code} ${kt(v2.exactCasKt)} CAS is below 1.1 × ${vmc.code} (${kt(1.1 * vmc.exactCasKt)} CAS).`);
  }
  for (const vref of figures.vref) {
    if (vs0) {
      const factor = figures.referenceStallSpeeds ? 1.23 : 1.3;
      const stallKt = stallAt(vs0, vref.weightKg);
      if (vref.exactCasKt < factor * stallKt - 1e-9) {
        add(figures.referenceStallSpeeds ? 'vref-vsr0' : 'vref-vs0', `${vref.code} ${kt(vref.exactCasKt)} CAS is below ${factor} × ${vs0.code} (${kt(factor * stallKt)} CAS) at the same weight.`);
      }
    }
    if (vmc && vref.exactCasKt < vmc.exactCasKt - 1e-9) {
      add('vref-vmc', `${vref.code} ${kt(vref.exactCasKt)} CAS is below ${vmc.code} ${kt(vmc.exactCasKt)} CAS.`);
    }
  }
  if (vs0 && vs1 && stallAt(vs0, vs1.weightKg) > vs1.exactCasKt + 1e-9) {
    add('vs0-vs1', `${vs0.code} (${kt(stallAt(vs0, vs1.weightKg))} CAS) is above ${vs1.code} (${kt(vs1.exactCasKt)} CAS) at the same weight.`);
  }
  if (vx && vy && !printedInOrder(vx, vy)) {
    add('vx-vy', `${vx.code} ${vx.iasKt} KIAS is above ${vy.code} ${vy.iasKt} KIAS.`);
  }
  if (figures.vnoKt !== undefined && figures.vneKt !== undefined && !(figures.vnoKt < figures.vneKt)) {
    add('vno-vne', `VNO ${figures.vnoKt} kt is not below VNE ${figures.vneKt} kt.`);
  }
  for (let i = 1; i < figures.vfe.length; i++) {
    const less = figures.vfe[i - 1];
    const more = figures.vfe[i];
    if (more.kt > less.kt) {
      add('vfe-flap', `VFE ${more.kt} kt for ${more.label} is above VFE ${less.kt} kt for ${less.label}, which has less flap.`);
      break;
    }
  }
  if (figures.vleKt !== undefined && figures.vloKt !== undefined && figures.vloKt > figures.vleKt) {
    add('vle-vlo', `VLO ${figures.vloKt} kt is above VLE ${figures.vleKt} kt.`);
  }
  if (figures.mmo !== undefined && !(figures.mmo < 1)) {
    add('mmo-below-1', `MMO ${figures.mmo} is not below Mach 1.`);
  }
  return found;
}
