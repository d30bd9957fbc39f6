import { AbstractControl, FormArray, FormControl, FormGroup } from '@angular/forms';
import { SPEED_CLASSES } from '@shared/speed-book/content-shape';

/**
 * The editor's fields of the envelope proof: the envelope the book declares (pressure altitude
 * and OAT ranges for takeoff and for landing), whether its stall speeds are reference stall
 * speeds, and the flight manual's reasons for departing from an ordering rule. Kept apart from
 * `RevisionForm` so the content's older fields and these read separately; the form joins them.
 */

export type SpeedClass = (typeof SPEED_CLASSES)[number];
export { SPEED_CLASSES };

type NumberControl = FormControl<number | null>;
type RangeGroup = FormGroup<{ min: NumberControl; max: NumberControl }>;
export type PhaseEnvelopeGroup = FormGroup<{ pressureAltitudeFt: RangeGroup; oatC: RangeGroup }>;
export type EnvelopeGroup = FormGroup<{ takeoff: PhaseEnvelopeGroup; landing: PhaseEnvelopeGroup }>;
export type RuleExceptionGroup = FormGroup<{ ruleId: FormControl<string>; reason: FormControl<string> }>;

export const ENVELOPE_PHASES = ['takeoff', 'landing'] as const;
export const ENVELOPE_AXES = [
  { axis: 'pressureAltitudeFt', words: 'pressure altitude', unit: 'ft' },
  { axis: 'oatC', words: 'OAT', unit: '°C' },
] as const;

type Json = Record<string, unknown>;
const record = (value: unknown): Json => (typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {});
const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const out = (value: number | null): number | undefined => (value === null || Number.isNaN(value) ? undefined : value);

const rangeGroup = (): RangeGroup => new FormGroup({ min: new FormControl<number | null>(null), max: new FormControl<number | null>(null) });
const phaseGroup = (): PhaseEnvelopeGroup => new FormGroup({ pressureAltitudeFt: rangeGroup(), oatC: rangeGroup() });

export function envelopeGroup(): EnvelopeGroup {
  return new FormGroup({ takeoff: phaseGroup(), landing: phaseGroup() });
}

export function ruleExceptionGroup(ruleId = '', reason = ''): RuleExceptionGroup {
  return new FormGroup({ ruleId: new FormControl(ruleId, { nonNullable: true }), reason: new FormControl(reason, { nonNullable: true }) });
}

export function speedClassOf(value: unknown): SpeedClass | null {
  return SPEED_CLASSES.includes(value as SpeedClass) ? (value as SpeedClass) : null;
}

/** Fills the envelope from content, tolerating whatever is missing. */
export function loadEnvelope(group: EnvelopeGroup, content: Json): void {
  const envelope = record(content['envelope']);
  for (const phase of ENVELOPE_PHASES) {
    const p = record(envelope[phase]);
    for (const { axis } of ENVELOPE_AXES) {
      const range = record(p[axis]);
      group.controls[phase].controls[axis].setValue({ min: num(range['min']), max: num(range['max']) });
    }
  }
}

export function loadRuleExceptions(array: FormArray<RuleExceptionGroup>, content: Json): void {
  array.clear();
  const exceptions = Array.isArray(content['ruleExceptions']) ? (content['ruleExceptions'] as unknown[]) : [];
  for (const item of exceptions) {
    const e = record(item);
    array.push(ruleExceptionGroup(typeof e['ruleId'] === 'string' ? e['ruleId'] : '', typeof e['reason'] === 'string' ? e['reason'] : ''));
  }
}

/**
 * The envelope as content: absent when no bound is given (content written before envelopes),
 * otherwise whole, with the missing bounds left out so the schema says "Give …".
 */
export function envelopeContent(group: EnvelopeGroup): Json | undefined {
  const value = group.getRawValue();
  const given = ENVELOPE_PHASES.some((phase) => ENVELOPE_AXES.some(({ axis }) => value[phase][axis].min !== null || value[phase][axis].max !== null));
  if (!given) return undefined;
  const phase = (p: (typeof ENVELOPE_PHASES)[number]) =>
    Object.fromEntries(ENVELOPE_AXES.map(({ axis }) => [axis, withoutUndefined({ min: out(value[p][axis].min), max: out(value[p][axis].max) })]));
  return { takeoff: phase('takeoff'), landing: phase('landing') };
}

export function ruleExceptionsContent(array: FormArray<RuleExceptionGroup>): Json[] | undefined {
  const exceptions = array.getRawValue();
  return exceptions.length ? exceptions.map((e) => ({ ruleId: e.ruleId, reason: e.reason.trim() })) : undefined;
}

/** Every control of these fields with the content path the schema reports its problems at. */
export function envelopeFieldControls(group: EnvelopeGroup, exceptions: FormArray<RuleExceptionGroup>, add: (path: string, control: AbstractControl) => void): void {
  for (const phase of ENVELOPE_PHASES)
    for (const { axis } of ENVELOPE_AXES)
      for (const bound of ['min', 'max'] as const) add(`envelope.${phase}.${axis}.${bound}`, group.controls[phase].controls[axis].controls[bound]);
  exceptions.controls.forEach((e, i) => {
    add(`ruleExceptions.${i}.ruleId`, e.controls.ruleId);
    add(`ruleExceptions.${i}.reason`, e.controls.reason);
  });
}

function withoutUndefined(value: Json): Json {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined));
}
