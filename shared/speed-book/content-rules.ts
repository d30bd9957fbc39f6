/**
 * The rules that tie the fields of revision content together. Each refuses something the card
 * computation cannot use, and reports it at a field path with a sentence. Numeric work (IAS ↔
 * CAS through a position-error table) is done by the flight-physics library.
 */
import type * as z from 'zod';
import { AeroInputError, casToIasKt, iasToCasKt } from '../aero';
import type { revisionContentShape } from './content-shape';
import { speedRole } from './speed-class';
import { ORDERING_RULE_IDS } from './ordering-rule-table';

const KNOWN_RULE_IDS: ReadonlySet<string> = new Set(ORDERING_RULE_IDS);

type Content = z.infer<typeof revisionContentShape>;
type Speed = Content['speeds'][number];
type Configuration = Content['configurations'][number];
type Basis = Content['indicatorMarkingBasis'];
type Path = (string | number)[];

export interface RuleIssue {
  path: Path;
  message: string;
}

const fmt = (value: number) => value.toLocaleString('en-GB', { maximumFractionDigits: 2 });

/** Every cross-field problem of `content`, in field order; an empty list when there is none. */
export function contentRuleIssues(content: Content): RuleIssue[] {
  const issues: RuleIssue[] = [];
  const add = (path: Path, message: string) => issues.push({ path, message });
  checkAircraft(content, add);
  checkWeights(content, add);
  const configurations = checkConfigurations(content, add);
  checkSpeeds(content, configurations, add);
  checkLimits(content, configurations, add);
  checkEnvelope(content, add);
  return issues;
}

type Add = (path: Path, message: string) => void;

function checkAircraft({ aircraft }: Content, add: Add): void {
  if (aircraft.category === 'piston-single' && aircraft.engines !== 1) add(['aircraft', 'engines'], 'A single-engine piston type has exactly one engine.');
  if (aircraft.category === 'piston-twin' && aircraft.engines < 2) add(['aircraft', 'engines'], 'A piston twin has at least two engines.');
}

function checkWeights({ weights, speeds }: Content, add: Add): void {
  const { minimumKg, maximumTakeoffKg, maximumLandingKg, referenceKg } = weights;
  if (maximumLandingKg > maximumTakeoffKg) add(['weights', 'maximumLandingKg'], 'The maximum landing weight cannot exceed the maximum takeoff weight.');
  if (minimumKg >= maximumLandingKg) add(['weights', 'minimumKg'], 'The minimum weight must be below the maximum landing weight.');
  if (referenceKg !== undefined && (referenceKg <= minimumKg || referenceKg > maximumTakeoffKg)) {
    add(['weights', 'referenceKg'], `The reference weight must be above the minimum weight (${fmt(minimumKg)} kg) and at most the maximum takeoff weight (${fmt(maximumTakeoffKg)} kg).`);
  }
  if (referenceKg === undefined && speeds.some((speed) => speed.kind === 'scaled')) {
    add(['weights', 'referenceKg'], 'Give the reference weight: weight-scaled speeds are published at it.');
  }
}

function checkConfigurations({ configurations }: Content, add: Add): Map<string, Configuration> {
  const byKey = new Map<string, Configuration>();
  configurations.forEach((configuration, i) => {
    if (byKey.has(configuration.key)) add(['configurations', i, 'key'], `The configuration key ${configuration.key} is used twice; each configuration needs its own.`);
    else byKey.set(configuration.key, configuration);
    const points = configuration.positionError;
    for (let j = 1; j < points.length; j++) {
      if (points[j].iasKt <= points[j - 1].iasKt) {
        add(['configurations', i, 'positionError', j, 'iasKt'], `The IAS column must increase strictly: ${fmt(points[j].iasKt)} kt does not exceed ${fmt(points[j - 1].iasKt)} kt above it.`);
      }
      if (points[j].casKt <= points[j - 1].casKt) {
        add(['configurations', i, 'positionError', j, 'casKt'], `The CAS column must increase strictly: ${fmt(points[j].casKt)} kt does not exceed ${fmt(points[j - 1].casKt)} kt above it.`);
      }
    }
  });
  return byKey;
}

/**
 * The first and last speed of a position-error table's column for `basis`; undefined for a
 * table too short to have a range (the shape rule already reports it), so that range rules
 * skip it instead of failing.
 */
function tableRange(configuration: Configuration, basis: Basis): [number, number] | undefined {
  const column = basis === 'ias' ? 'iasKt' : 'casKt';
  const points = configuration.positionError;
  if (points.length < 2) return undefined;
  return [points[0]![column], points[points.length - 1]![column]];
}

function flatValues(values: unknown): number[] {
  return Array.isArray(values) ? values.flatMap(flatValues) : typeof values === 'number' ? [values] : [];
}

/**
 * The lowest and highest value a speed takes between the minimum and maximum takeoff weight,
 * and the column of the position-error table it must lie in. A weight-scaled speed is scaled
 * as the card scales it (build-card.ts): its CAS by √(W/Wref), so an IAS reference is read to
 * CAS through the table first and the span is checked in the CAS column.
 */
function speedSpan(speed: Speed, weights: Content['weights'], configuration: Configuration | undefined): { span: [number, number]; basis: Basis } | undefined {
  switch (speed.kind) {
    case 'fixed':
      return { span: [speed.valueKt, speed.valueKt], basis: speed.basis };
    case 'scaled': {
      if (weights.referenceKg === undefined) return undefined;
      const scale = (weightKg: number) => Math.sqrt(weightKg / weights.referenceKg!);
      let referenceKt = speed.referenceKt;
      if (speed.basis === 'ias') {
        if (!configuration || configuration.positionError.length < 2) return undefined;
        try {
          referenceKt = iasToCasKt(configuration.positionError, speed.referenceKt);
        } catch (error) {
          if (error instanceof AeroInputError) return { span: [speed.referenceKt, speed.referenceKt], basis: 'ias' };
          throw error;
        }
      }
      return { span: [referenceKt * scale(weights.minimumKg), referenceKt * scale(weights.maximumTakeoffKg)], basis: 'cas' };
    }
    case 'tabulated': {
      const values = flatValues(speed.valuesKt);
      return values.length ? { span: [Math.min(...values), Math.max(...values)], basis: speed.basis } : undefined;
    }
  }
}

function checkSpeeds({ speeds, weights, aircraft }: Content, configurations: Map<string, Configuration>, add: Add): void {
  const seen = new Set<string>();
  speeds.forEach((speed, i) => {
    const configuration = configurations.get(speed.configurationKey);
    if (!configuration) {
      add(['speeds', i, 'configurationKey'], `There is no configuration ${speed.configurationKey}; use one of ${[...configurations.keys()].join(', ')}.`);
    }
    const id = `${speed.code}@${speed.configurationKey}`;
    if (seen.has(id)) add(['speeds', i, 'code'], `${speed.code} appears twice in configuration ${speed.configurationKey}; each code once per configuration.`);
    seen.add(id);
    if (speed.kind === 'tabulated') checkTable(speed, i, weights, aircraft, add);
    const found = speedSpan(speed, weights, configuration);
    const range = found && configuration && tableRange(configuration, found.basis);
    if (range && found && !tabulatedShapeBroken(speed)) {
      const [low, high] = range;
      const { span, basis } = found;
      if (span[0] < low - 1e-9 || span[1] > high + 1e-9) {
        const field = speed.kind === 'fixed' ? 'valueKt' : speed.kind === 'scaled' ? 'referenceKt' : 'valuesKt';
        add(
          ['speeds', i, field],
          `${speed.code} runs from ${fmt(span[0])} to ${fmt(span[1])} kt ${basis.toUpperCase()} over the weight range, outside the ${speed.configurationKey} position-error table (${fmt(low)} to ${fmt(high)} kt ${basis.toUpperCase()}).`,
        );
      }
    }
  });
}

function tabulatedShapeBroken(speed: Speed): boolean {
  if (speed.kind !== 'tabulated') return false;
  const axes = tableAxes(speed);
  return shapeProblem(speed.valuesKt, axes, 0, []) !== undefined;
}

type TabulatedSpeed = Extract<Speed, { kind: 'tabulated' }>;

function tableAxes(speed: TabulatedSpeed): { key: string; label: string; values: number[] }[] {
  const axes = [{ key: 'byWeightKg', label: 'weight', values: speed.byWeightKg }];
  if (speed.byPressureAltitudeFt) axes.push({ key: 'byPressureAltitudeFt', label: 'pressure altitude', values: speed.byPressureAltitudeFt });
  if (speed.byOatC) axes.push({ key: 'byOatC', label: 'temperature', values: speed.byOatC });
  return axes;
}

/** The first place where `values` does not nest as the axes say, with the reason. */
function shapeProblem(values: unknown, axes: { label: string; values: number[] }[], depth: number, path: Path): RuleIssue | undefined {
  const axis = axes[depth];
  if (!Array.isArray(values) || values.length !== axis.values.length) {
    return { path, message: `This must list ${axis.values.length} entries, one per ${axis.label} of the table.` };
  }
  for (let i = 0; i < values.length; i++) {
    const entry: unknown = values[i];
    if (depth < axes.length - 1) {
      const problem = shapeProblem(entry, axes, depth + 1, [...path, i]);
      if (problem) return problem;
    } else if (typeof entry !== 'number') {
      return { path: [...path, i], message: `This must be one speed in kt, since the table has ${axes.length} ${axes.length === 1 ? 'axis' : 'axes'}.` };
    }
  }
  return undefined;
}

function checkTable(speed: TabulatedSpeed, i: number, weights: Content['weights'], aircraft: Content['aircraft'], add: Add): void {
  for (const axis of tableAxes(speed)) {
    axis.values.forEach((value, j) => {
      if (j > 0 && value <= axis.values[j - 1]) {
        add(['speeds', i, axis.key, j], `The ${axis.label} axis must increase strictly: ${fmt(value)} does not exceed ${fmt(axis.values[j - 1])} before it.`);
      }
    });
  }
  speed.byWeightKg.forEach((weightKg, j) => {
    if (weightKg < weights.minimumKg || weightKg > weights.maximumTakeoffKg) {
      add(['speeds', i, 'byWeightKg', j], `${fmt(weightKg)} kg is outside the weight range (${fmt(weights.minimumKg)} to ${fmt(weights.maximumTakeoffKg)} kg).`);
    }
  });
  speed.byPressureAltitudeFt?.forEach((altitudeFt, j) => {
    if (altitudeFt > aircraft.ceilingFt) add(['speeds', i, 'byPressureAltitudeFt', j], `${fmt(altitudeFt)} ft is above the type’s ceiling (${fmt(aircraft.ceilingFt)} ft).`);
  });
  const problem = shapeProblem(speed.valuesKt, tableAxes(speed), 0, []);
  if (problem) add(['speeds', i, 'valuesKt', ...problem.path], problem.message);
}

/** A speed's value, in `basis`, at the maximum takeoff weight; undefined when it cannot be told. */
function atMaximumWeight(speed: Speed, content: Content, configuration: Configuration, basis: Basis): number | undefined {
  const { weights } = content;
  let valueKt: number;
  switch (speed.kind) {
    case 'fixed':
      valueKt = speed.valueKt;
      break;
    case 'scaled':
      if (weights.referenceKg === undefined) return undefined;
      valueKt = speed.referenceKt * Math.sqrt(weights.maximumTakeoffKg / weights.referenceKg);
      break;
    case 'tabulated': {
      // Stall speeds grow with weight: the table's highest figure, scaled by √(W/W) up to the
      // maximum takeoff weight when the table stops short of it (the same square-root law).
      const values = flatValues(speed.valuesKt);
      if (!values.length) return undefined;
      const topWeightKg = speed.byWeightKg[speed.byWeightKg.length - 1];
      valueKt = Math.max(...values) * Math.sqrt(Math.max(1, weights.maximumTakeoffKg / topWeightKg));
      break;
    }
  }
  if (speed.basis === basis) return valueKt;
  try {
    return speed.basis === 'ias' ? iasToCasKt(configuration.positionError, valueKt) : casToIasKt(configuration.positionError, valueKt);
  } catch (error) {
    if (error instanceof AeroInputError) return undefined; // reported by the table-range rule
    throw error;
  }
}

const STALL_ROLES = new Set(['VS0', 'VS1', 'VS']);

function checkLimits(content: Content, configurations: Map<string, Configuration>, add: Add): void {
  const { limits, aircraft, indicatorMarkingBasis: basis } = content;
  const piston = aircraft.category === 'piston-single' || aircraft.category === 'piston-twin';
  if (piston) {
    if (limits.vneKt === undefined) add(['limits', 'vneKt'], 'A piston type needs VNE.');
    if (limits.vnoKt === undefined) add(['limits', 'vnoKt'], 'A piston type needs VNO.');
    if (limits.vneKt !== undefined && limits.vnoKt !== undefined && limits.vnoKt >= limits.vneKt) add(['limits', 'vnoKt'], 'VNO must be below VNE.');
  }
  if (aircraft.category === 'jet' && limits.vmoKt === undefined) add(['limits', 'vmoKt'], 'A jet needs VMO.');
  if (aircraft.category === 'turboprop' && limits.vmoKt === undefined && limits.vneKt === undefined) add(['limits', 'vmoKt'], 'A turboprop needs VMO (or VNE).');
  if ((aircraft.category === 'jet' || aircraft.category === 'turboprop') && limits.vmoKt !== undefined && limits.mmo === undefined) {
    add(['limits', 'mmo'], 'With VMO, give MMO too: above the crossover altitude the Mach limit governs.');
  }
  if (aircraft.engines > 1) {
    if (limits.vmcKt === undefined) add(['limits', 'vmcKt'], 'A multi-engine type needs VMC.');
    if (limits.vyseKt === undefined) add(['limits', 'vyseKt'], 'A multi-engine type needs VYSE.');
  }

  const cruise = content.configurations[0];
  for (const key of ['vnoKt', 'vneKt', 'vmoKt'] as const) {
    const valueKt = limits[key];
    const range = cruise && tableRange(cruise, basis);
    if (valueKt === undefined || !cruise || !range) continue;
    const [low, high] = range;
    if (valueKt < low || valueKt > high) {
      add(['limits', key], `${fmt(valueKt)} kt is outside the ${cruise.key} position-error table (${fmt(low)} to ${fmt(high)} kt ${basis.toUpperCase()}); the first configuration is the cruise configuration.`);
    }
  }

  for (const [key, vfeKt] of Object.entries(limits.vfeKt)) {
    const configuration = configurations.get(key);
    if (!configuration) {
      add(['limits', 'vfeKt', key], `There is no configuration ${key} for this VFE.`);
      continue;
    }
    const range = tableRange(configuration, basis);
    if (range && (vfeKt < range[0] || vfeKt > range[1])) {
      const [low, high] = range;
      add(['limits', 'vfeKt', key], `${fmt(vfeKt)} kt is outside the ${key} position-error table (${fmt(low)} to ${fmt(high)} kt ${basis.toUpperCase()}).`);
    }
    for (const speed of content.speeds) {
      if (speed.configurationKey !== key || !STALL_ROLES.has(speedRole(speed.code) ?? '')) continue;
      const stallKt = atMaximumWeight(speed, content, configuration, basis);
      if (stallKt !== undefined && vfeKt <= stallKt) {
        add(['limits', 'vfeKt', key], `VFE ${fmt(vfeKt)} kt is not above ${speed.code} at the maximum takeoff weight (${fmt(stallKt)} kt ${basis.toUpperCase()}); the flaps could not be used.`);
      }
    }
  }
}

/**
 * The declared envelope must lie below the ceiling, and rule exceptions must name a rule. Whether
 * the tables cover the envelope is not a field rule: the envelope sweep (shared/card/coverage.ts)
 * reads every point through the card's own computation and reports each hole with the table's
 * reason, and the server refuses submit and publish until it passes (one rule set).
 */
function checkEnvelope(content: Content, add: Add): void {
  const { envelope, aircraft } = content;
  if (envelope) {
    for (const phase of ['takeoff', 'landing'] as const) {
      const declared = envelope[phase];
      if (declared.pressureAltitudeFt.max > aircraft.ceilingFt) {
        add(['envelope', phase, 'pressureAltitudeFt', 'max'], `The ${phase} envelope reaches ${fmt(declared.pressureAltitudeFt.max)} ft, above the type’s ceiling (${fmt(aircraft.ceilingFt)} ft).`);
      }
    }
  }
  const seen = new Set<string>();
  (content.ruleExceptions ?? []).forEach((exception, i) => {
    if (!KNOWN_RULE_IDS.has(exception.ruleId)) add(['ruleExceptions', i, 'ruleId'], `There is no ordering rule ${exception.ruleId}; use one of ${[...KNOWN_RULE_IDS].join(', ')}.`);
    else if (seen.has(exception.ruleId)) add(['ruleExceptions', i, 'ruleId'], `The rule ${exception.ruleId} has an exception already; give its reason once.`);
    seen.add(exception.ruleId);
  });
}
