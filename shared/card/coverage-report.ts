/**
 * The envelope proof of a speed book: where, inside the envelope the book declares, it gives a
 * card and where it does not. Made by sweeping a grid of weight × pressure altitude × OAT for every
 * configuration (takeoff and landing) through `buildCard` and the ordering rules; read by the
 * server (submit answers 422 with it), the editor (live) and the review page (as a picture).
 *
 * Types only: this file is the contract between the sweep and the screens that draw it.
 */

/** What one grid point gave: a card, a refusal, or a card whose speeds break an ordering rule. */
export const COVERAGE_OUTCOMES = ['issued', 'refused', 'rule-broken'] as const;
export type CoverageOutcome = (typeof COVERAGE_OUTCOMES)[number];

/** Takeoff points sweep the takeoff envelope at takeoff weights; landing points the landing one. */
export type CoveragePhase = 'takeoff' | 'landing';

/** An inclusive range, low first. */
export type CoverageRange = readonly [number, number];

/** The envelope the book declares, as the sweep read it (canonical units). */
export interface CoverageEnvelope {
  takeoff: { pressureAltitudeFt: CoverageRange; oatC: CoverageRange; weightKg: CoverageRange };
  landing: { pressureAltitudeFt: CoverageRange; oatC: CoverageRange; weightKg: CoverageRange };
}

/** The axes of one sheet's grid, each rising. */
export interface CoverageGrid {
  weightsKg: number[];
  pressureAltitudesFt: number[];
  oatsC: number[];
}

/** One grid point and what it gave. */
export interface CoverageCell {
  weightKg: number;
  pressureAltitudeFt: number;
  oatC: number;
  outcome: CoverageOutcome;
  /** One sentence a person reads: the card's refusal, or the rules broken here. Absent when issued. */
  reason?: string;
  /** The ids of the ordering rules broken at this point (outcome 'rule-broken'). */
  ruleIds?: string[];
}

/**
 * One configuration in one phase. `cells` holds one cell per grid point, ordered by OAT (the
 * temperature band), then pressure altitude, then weight — so a picture draws one weight ×
 * altitude grid per temperature band by slicing it.
 */
export interface CoverageSheet {
  phase: CoveragePhase;
  configurationKey: string;
  configurationLabel: string;
  grid: CoverageGrid;
  cells: CoverageCell[];
}

/** An ordering rule broken somewhere in the sweep. */
export interface CoverageRuleFinding {
  /** Stable id, e.g. 'v1-vr-v2'. */
  ruleId: string;
  /** The rule as a person reads it, e.g. 'V1 ≤ VR ≤ V2'. */
  title: string;
  /** Where the rule comes from, e.g. 'CS 25.107 and 14 CFR 25.107 (from memory)'. */
  source: string;
  /** How many grid points break it. */
  brokenAt: number;
  /** The sentence at the first point that breaks it (with that point's weight, altitude, OAT). */
  firstMessage: string;
  /** The flight manual's reason for the exception, as the engineer recorded it; when present the rule does not block submit. */
  exception?: string;
}

export interface CoverageReport {
  envelope: CoverageEnvelope;
  sheets: CoverageSheet[];
  rules: CoverageRuleFinding[];
  counts: { points: number; issued: number; refused: number; ruleBroken: number };
  /** True when no point is refused and every broken rule carries a recorded exception. */
  passes: boolean;
}
