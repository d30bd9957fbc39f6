/**
 * The ordering and consistency rules of a speed book, as a table: stable ids, the rule as a
 * person reads it, and its source. The checks themselves are in shared/card/ordering-rules.ts
 * (they read a card's figures); the content rules use the ids to check recorded exceptions.
 * Sources are the airworthiness codes as we know them; "from memory" where not quoted.
 */
export interface OrderingRule {
  /** Stable id, lower-case words joined by hyphens. */
  readonly id: string;
  /** The rule as a person reads it. */
  readonly title: string;
  /** Where the rule comes from. */
  readonly source: string;
}

export const ORDERING_RULES = [
  { id: 'v1-vr-v2', title: 'V1 ≤ VR ≤ V2', source: 'CS 25.107(e) and 14 CFR 25.107(e): VR not less than V1; V2 reached by 35 ft after rotation at VR (from memory)' },
  { id: 'v2-vmc', title: 'V2 ≥ 1.1 × VMC', source: 'CS 25.107(b) and 14 CFR 25.107(b): V2MIN not less than 1.1 VMCA (from memory)' },
  { id: 'vref-vs0', title: 'VREF ≥ 1.3 × VS0', source: '14 CFR 23.73 and CS 23.73 before their 2017 rewrite: VREF not less than 1.3 VS0 for small aeroplanes (from memory)' },
  { id: 'vref-vsr0', title: 'VREF ≥ 1.23 × VSR0', source: 'CS 25.125(b)(2)(i) and 14 CFR 25.125(b)(2)(i): VREF not less than 1.23 VSR0 (from memory)' },
  { id: 'vref-vmc', title: 'VREF ≥ VMC', source: '14 CFR 23.73 (VREF not less than VMC) and 14 CFR 25.125(b)(2)(ii) (not less than VMCL) (from memory)' },
  { id: 'vs0-vs1', title: 'VS0 ≤ VS1', source: '14 CFR 1.2 definitions of VS0 (landing configuration) and VS1 (a specified configuration); CS-Definitions (from memory)' },
  { id: 'vx-vy', title: 'VX ≤ VY', source: 'FAA Airplane Flying Handbook (FAA-H-8083-3), best angle and best rate of climb (from memory)' },
  { id: 'vno-vne', title: 'VNO < VNE', source: '14 CFR 23.1505(b) and CS 23.1505(b): VNO not greater than 0.89 VNE (from memory)' },
  { id: 'vfe-flap', title: 'VFE falls as flap rises', source: '14 CFR 23.1511 and 25.1511 (flap extended speed for each setting; from memory); configurations are listed from least to most flap' },
  { id: 'vle-vlo', title: 'VLO ≤ VLE', source: '14 CFR 25.1515 and CS 25.1515: VLE not less than VLO (from memory)' },
  { id: 'mmo-below-1', title: 'MMO < 1', source: '14 CFR 25.1505 (MMO of a subsonic aeroplane); the pitot relations used here are subsonic (NASA RP 1046)' },
] as const satisfies readonly OrderingRule[];

export type OrderingRuleId = (typeof ORDERING_RULES)[number]['id'];


/** Every rule id, in table order. */
export const ORDERING_RULE_IDS: readonly string[] = ORDERING_RULES.map((rule) => rule.id);
