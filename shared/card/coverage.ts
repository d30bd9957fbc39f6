/**
 * The envelope proof of a speed book (`CoverageReport`, coverage-report.ts): a grid of weight ×
 * pressure altitude × OAT over the envelope the book declares, every takeoff configuration at
 * the departure and every landing configuration at the arrival, each point read through the
 * card's own computation (`cardFigures`, build-card.ts: the same tables, scaling basis and
 * rounding as `buildCard`) and the ordering rules (ordering-rules.ts).
 *
 * The grid holds each axis's ends, every breakpoint of the book's tables inside the range
 * (where interpolation bends), and evenly spaced points between them, so that no gap between
 * two grid points is wider than the steps below. Every axis is bounded (`MAX_POINTS_PER_AXIS`),
 * and the whole sweep to `MAX_SWEEP_POINTS`, so the work is bounded whatever the content.
 */
import { bookEnvelope, formatWhole, LANDING_PHASES, type EnvelopeRange } from '../speed-book/envelope';
import type { RevisionContent } from '../speed-book/revision-content';
import { cardFigures, exceptedRuleIds, takeoffConfigurationKeys } from './build-card';
import { CardRefusedError, type CardInputs } from './card';
import type { CoverageCell, CoverageEnvelope, CoveragePhase, CoverageReport, CoverageRuleFinding, CoverageSheet } from './coverage-report';
import { ORDERING_RULES } from './ordering-rules';

export interface SweepOptions {
  /** Widest gap between two grid points of each axis (defaults: 250 kg, 1,000 ft, 10 °C). */
  readonly stepWeightKg?: number;
  readonly stepAltitudeFt?: number;
  readonly stepOatC?: number;
}

const DEFAULT_STEPS = { weightKg: 250, altitudeFt: 1000, oatC: 10 } as const;
/** Most points on one axis (weights, altitudes, OATs), whatever the steps or the tables ask. */
export const MAX_POINTS_PER_AXIS = { weightKg: 11, altitudeFt: 13, oatC: 9 } as const;
/** Most grid points of one whole sweep (about 1 s of work on this project's CI machine). */
export const MAX_SWEEP_POINTS = 5200;

/**
 * Sweeps the envelope of `content` (parsed revision content) and reports every point refused
 * and every ordering rule broken. A book without a declared envelope is swept over the one
 * derived from its tables (envelope.ts); the server asks for a declared one at submit.
 *
 * @example sweepEnvelope(demoLightTwinJetContent()).passes // true
 */
export function sweepEnvelope(content: RevisionContent, options: SweepOptions = {}): CoverageReport {
  // A private frozen copy: the card's reader is cached per content object.
  const book = deepFreeze(JSON.parse(JSON.stringify(content)) as RevisionContent);
  const envelope = bookEnvelope(book);
  const steps = {
    weightKg: positiveOr(options.stepWeightKg, DEFAULT_STEPS.weightKg),
    altitudeFt: positiveOr(options.stepAltitudeFt, DEFAULT_STEPS.altitudeFt),
    oatC: positiveOr(options.stepOatC, DEFAULT_STEPS.oatC),
  };
  const labels = new Map(book.configurations.map((configuration) => [configuration.key, configuration.label]));
  const landingKeys = [...new Set(book.speeds.filter((speed) => LANDING_PHASES.has(speed.phase)).map((speed) => speed.configurationKey))];
  const caps = axisCaps(takeoffConfigurationKeys(book).length + landingKeys.length);
  const sheets: CoverageSheet[] = [];
  const findings = new Map<string, { brokenAt: number; firstMessage: string }>();

  for (const key of takeoffConfigurationKeys(book)) {
    const speeds = book.speeds.filter((speed) => speed.phase === 'takeoff' && speed.configurationKey === key);
    const grid = gridFor(envelope.takeoff, speeds, steps, caps);
    sheets.push(sweepSheet(book, 'takeoff', key, labels.get(key)!, grid, findings));
  }
  for (const key of landingKeys) {
    const speeds = book.speeds.filter((speed) => LANDING_PHASES.has(speed.phase) && speed.configurationKey === key);
    const grid = gridFor(envelope.landing, speeds, steps, caps);
    sheets.push(sweepSheet(book, 'landing', key, labels.get(key) ?? key, grid, findings));
  }

  const excepted = new Map((book.ruleExceptions ?? []).map((exception) => [exception.ruleId, exception.reason]));
  const rules: CoverageRuleFinding[] = [];
  for (const rule of ORDERING_RULES) {
    const found = findings.get(rule.id);
    if (!found) continue;
    const exception = excepted.get(rule.id);
    rules.push({ ruleId: rule.id, title: rule.title, source: rule.source, brokenAt: found.brokenAt, firstMessage: found.firstMessage, ...(exception ? { exception } : {}) });
  }
  const counts = { points: 0, issued: 0, refused: 0, ruleBroken: 0 };
  for (const sheet of sheets) {
    for (const cell of sheet.cells) {
      counts.points++;
      if (cell.outcome === 'issued') counts.issued++;
      else if (cell.outcome === 'refused') counts.refused++;
      else counts.ruleBroken++;
    }
  }
  const exceptedIds = exceptedRuleIds(book);
  return {
    envelope: coverageEnvelope(envelope),
    sheets,
    rules,
    counts,
    passes: counts.refused === 0 && rules.every((rule) => exceptedIds.has(rule.ruleId)),
  };
}

function sweepSheet(
  book: RevisionContent,
  phase: CoveragePhase,
  configurationKey: string,
  configurationLabel: string,
  grid: CoverageSheet['grid'],
  findings: Map<string, { brokenAt: number; firstMessage: string }>,
): CoverageSheet {
  const cells: CoverageCell[] = [];
  for (const oatC of grid.oatsC) {
    for (const pressureAltitudeFt of grid.pressureAltitudesFt) {
      for (const weightKg of grid.weightsKg) {
        const point = { weightKg, pressureAltitudeFt, oatC };
        const conditions = { elevationFt: pressureAltitudeFt, qnhHpa: 1013.25, oatC };
        const inputs: CardInputs = {
          airframeId: 1,
          weightKg,
          ...(phase === 'landing' ? { landingWeightKg: weightKg, arrival: conditions } : {}),
          configuration: phase === 'takeoff' ? configurationKey : takeoffConfigurationKeys(book)[0],
          departure: conditions,
          isaDeviationC: 0,
          cruise: { mach: 0.3 },
          altitudeStepFt: 10_000,
        };
        try {
          const { violations } = cardFigures(book, inputs, { phase, landingConfigurationKey: configurationKey });
          if (!violations.length) {
            cells.push({ ...point, outcome: 'issued' });
            continue;
          }
          const where = `At ${formatWhole(weightKg)} kg, ${formatWhole(pressureAltitudeFt)} ft, ${formatWhole(oatC)} °C (${phase}, ${configurationLabel}): `;
          for (const violation of violations) {
            const found = findings.get(violation.ruleId);
            if (found) found.brokenAt++;
            else findings.set(violation.ruleId, { brokenAt: 1, firstMessage: where + violation.message });
          }
          cells.push({
            ...point,
            outcome: 'rule-broken',
            reason: violations.map((violation) => violation.message).join(' '),
            ruleIds: [...new Set(violations.map((violation) => violation.ruleId))],
          });
        } catch (error) {
          if (!(error instanceof CardRefusedError)) throw error;
          cells.push({ ...point, outcome: 'refused', reason: error.message });
        }
      }
    }
  }
  return { phase, configurationKey, configurationLabel, grid, cells };
}

type SweptSpeed = RevisionContent['speeds'][number];

/** The grid of one sheet: the envelope's ranges with the breakpoints of the sheet's tables. */
function gridFor(
  envelope: { pressureAltitudeFt: EnvelopeRange; oatC: EnvelopeRange; weightKg: EnvelopeRange },
  speeds: readonly SweptSpeed[],
  steps: { weightKg: number; altitudeFt: number; oatC: number },
  caps: { weightKg: number; altitudeFt: number; oatC: number },
): CoverageSheet['grid'] {
  const breakpoints = (axis: 'byWeightKg' | 'byPressureAltitudeFt' | 'byOatC') =>
    speeds.flatMap((speed) => (speed.kind === 'tabulated' ? (speed[axis] ?? []) : []));
  return {
    weightsKg: axisPoints(envelope.weightKg, breakpoints('byWeightKg'), steps.weightKg, caps.weightKg),
    pressureAltitudesFt: axisPoints(envelope.pressureAltitudeFt, breakpoints('byPressureAltitudeFt'), steps.altitudeFt, caps.altitudeFt),
    oatsC: axisPoints(envelope.oatC, breakpoints('byOatC'), steps.oatC, caps.oatC),
  };
}

/**
 * The ends of `range`, the breakpoints inside it, and evenly spaced points at most `step` apart,
 * rising, at most `maxPoints` (the ends and breakpoints first; the even fill thinned to fit).
 */
export function axisPoints(range: EnvelopeRange, breakpoints: readonly number[], step: number, maxPoints: number): number[] {
  const [low, high] = range;
  if (!(high > low)) return [low];
  const inside = [...new Set(breakpoints.filter((value) => value > low && value < high))].sort((a, b) => a - b);
  // Many tables with many breakpoints: keep an even choice of them, so the axis stays bounded.
  const keep = Math.max(0, maxPoints - 2);
  const chosen = inside.length <= keep ? inside : Array.from({ length: keep }, (_, i) => inside[Math.round((i * (inside.length - 1)) / Math.max(1, keep - 1))]);
  const must = new Set<number>([low, high, ...chosen]);
  const budget = Math.max(0, maxPoints - must.size);
  const gaps = Math.min(Math.ceil((high - low) / step), budget + 1);
  const points = new Set(must);
  for (let i = 1; i < gaps; i++) points.add(Math.round((low + ((high - low) * i) / gaps) * 100) / 100);
  return [...points].sort((a, b) => a - b);
}

/**
 * Points per axis for `sheets` sheets: the full `MAX_POINTS_PER_AXIS` up to four sheets (every
 * demo book), then shrunk evenly so the whole sweep stays within `MAX_SWEEP_POINTS`.
 */
function axisCaps(sheets: number): { weightKg: number; altitudeFt: number; oatC: number } {
  const full = MAX_POINTS_PER_AXIS.weightKg * MAX_POINTS_PER_AXIS.altitudeFt * MAX_POINTS_PER_AXIS.oatC;
  const factor = Math.min(1, Math.cbrt(MAX_SWEEP_POINTS / (Math.max(1, sheets) * full)));
  const cap = (points: number) => Math.max(3, Math.floor(points * factor));
  return { weightKg: cap(MAX_POINTS_PER_AXIS.weightKg), altitudeFt: cap(MAX_POINTS_PER_AXIS.altitudeFt), oatC: cap(MAX_POINTS_PER_AXIS.oatC) };
}

function coverageEnvelope(envelope: ReturnType<typeof bookEnvelope>): CoverageEnvelope {
  const phase = (p: typeof envelope.takeoff) => ({ pressureAltitudeFt: p.pressureAltitudeFt, oatC: p.oatC, weightKg: p.weightKg });
  return { takeoff: phase(envelope.takeoff), landing: phase(envelope.landing) };
}

function positiveOr(value: number | undefined, fallback: number): number {
  return value !== undefined && Number.isFinite(value) && value > 0 ? value : fallback;
}

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const item of Object.values(value)) deepFreeze(item);
  }
  return value;
}
