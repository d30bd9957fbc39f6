import { AbstractControl, FormArray, FormControl, FormGroup } from '@angular/forms';
import type { SpeedTableUploadResponse } from '@shared/api/uploads';
import { AIRCRAFT_CATEGORIES, REVISION_SCHEMA_VERSION, SPEED_BASES } from '@shared/speed-book/revision-content';
import { CANONICAL_UNITS, statedUnitsOf, type StatedSpeedUnit, type StatedUnits, type StatedWeightUnit } from '@shared/speed-book/stated-units';
import { blankConfigurationGroup, configurationFieldControls, configurationGroupsOf, configurationsContent, type ConfigurationGroup } from './configuration-form';
import {
  envelopeContent,
  envelopeFieldControls,
  envelopeGroup,
  loadEnvelope,
  loadRuleExceptions,
  ruleExceptionGroup,
  ruleExceptionsContent,
  type RuleExceptionGroup,
} from './envelope-form';
import { list, num, numberControl, oneOf, out, record, str, text, withoutUndefined, type Json, type NumberControl } from './form-content';
import { speedContent, speedFieldControls, speedGroup, type SpeedBasis, type SpeedGroup } from './speed-form';
import { acceptUploadInto } from './upload-into-form';

// The form's parts live beside it: configuration-form.ts (configurations and position error),
// speed-form.ts (speeds and their tables), table-shape.ts (grid editing), upload-into-form.ts.
export type { NumberControl } from './form-content';
export { pointGroup, type ConfigurationGroup, type PointGroup } from './configuration-form';
export { valuePath, type SpeedBasis, type SpeedGroup, type SpeedKind, type SpeedPhase, type TableGroup } from './speed-form';
export { TableShape } from './table-shape';

export type AircraftCategory = (typeof AIRCRAFT_CATEGORIES)[number];

const LIMIT_KEYS = ['vnoKt', 'vneKt', 'vmoKt', 'mmo', 'vleKt', 'vloKt', 'vmcKt', 'vyseKt', 'demonstratedCrosswindKt', 'maximumTailwindKt'] as const;
export type LimitKey = (typeof LIMIT_KEYS)[number];

/**
 * The revision editor's reactive form: the content's fields as controls, read from a draft
 * (which may be incomplete) and written back as content for the shared schema. Control names
 * follow the content's field names, so a schema path such as
 * `configurations.1.positionError.2.casKt` finds its control (see `fieldControls`).
 */

export class RevisionForm {
  readonly group = new FormGroup({
    aircraft: new FormGroup({
      category: new FormControl<AircraftCategory | null>(null),
      engines: numberControl(),
      ceilingFt: numberControl(),
    }),
    weights: new FormGroup({
      minimumKg: numberControl(),
      maximumTakeoffKg: numberControl(),
      maximumLandingKg: numberControl(),
      referenceKg: numberControl(),
    }),
    configurations: new FormArray<ConfigurationGroup>([]),
    speeds: new FormArray<SpeedGroup>([]),
    limits: new FormGroup(Object.fromEntries(LIMIT_KEYS.map((key) => [key, numberControl()])) as Record<LimitKey, NumberControl>),
    indicatorMarkingBasis: new FormControl<SpeedBasis | null>('ias'),
    notes: text(),
    /** The flight manual's units: every weight and speed control still holds kg and kt (see StatedUnitInput). */
    statedUnits: new FormGroup({
      weight: new FormControl<StatedWeightUnit>(CANONICAL_UNITS.weight, { nonNullable: true }),
      speed: new FormControl<StatedSpeedUnit>(CANONICAL_UNITS.speed, { nonNullable: true }),
    }),
    // The envelope proof's fields (envelope-form.ts).
    envelope: envelopeGroup(),
    statesReferenceStallSpeeds: new FormControl(false, { nonNullable: true }),
    ruleExceptions: new FormArray<RuleExceptionGroup>([]),
  });

  /** True when the loaded content named its units: then they are written back even when kg and kt. */
  private namedUnits = false;

  /** The units the flight manual states, as chosen in the form. */
  statedUnits(): StatedUnits {
    return this.group.controls.statedUnits.getRawValue();
  }

  get configurations(): FormArray<ConfigurationGroup> {
    return this.group.controls.configurations;
  }

  get speeds(): FormArray<SpeedGroup> {
    return this.group.controls.speeds;
  }

  get ruleExceptions(): FormArray<RuleExceptionGroup> {
    return this.group.controls.ruleExceptions;
  }

  addRuleException(ruleId = ''): void {
    this.ruleExceptions.push(ruleExceptionGroup(ruleId));
  }

  /**
   * The TAT probe's recovery factor has no control in this form yet: kept as loaded and written
   * back unchanged, so that saving a draft never drops it.
   */
  private carriedTatRecoveryFactor: unknown = undefined;

  /** Fills the form from a draft's content, tolerating whatever is missing or malformed. */
  load(content: Json): void {
    const aircraft = record(content['aircraft']);
    this.carriedTatRecoveryFactor = aircraft['tatRecoveryFactor'];
    const weights = record(content['weights']);
    const limits = record(content['limits']);
    this.group.controls.aircraft.setValue({
      category: oneOf(AIRCRAFT_CATEGORIES, aircraft['category']),
      engines: num(aircraft['engines']),
      ceilingFt: num(aircraft['ceilingFt']),
    });
    this.group.controls.weights.setValue({
      minimumKg: num(weights['minimumKg']),
      maximumTakeoffKg: num(weights['maximumTakeoffKg']),
      maximumLandingKg: num(weights['maximumLandingKg']),
      referenceKg: num(weights['referenceKg']),
    });
    this.configurations.clear();
    for (const configuration of configurationGroupsOf(content)) this.configurations.push(configuration);
    this.speeds.clear();
    for (const item of list(content['speeds'])) {
      this.speeds.push(speedGroup(record(item)));
    }
    for (const key of LIMIT_KEYS) this.group.controls.limits.controls[key].setValue(num(limits[key]));
    this.group.controls.indicatorMarkingBasis.setValue(oneOf(SPEED_BASES, content['indicatorMarkingBasis']));
    this.group.controls.notes.setValue(str(content['notes']));
    this.namedUnits = record(content['statedUnits'])['weight'] !== undefined || record(content['statedUnits'])['speed'] !== undefined;
    this.group.controls.statedUnits.setValue(statedUnitsOf(content));
    loadEnvelope(this.group.controls.envelope, content);
    this.group.controls.statesReferenceStallSpeeds.setValue(content['statesReferenceStallSpeeds'] === true);
    loadRuleExceptions(this.ruleExceptions, content);
  }

  /** The form as revision content, for the schema and for PATCH. */
  content(): Json {
    const v = this.group.getRawValue();
    const { configurations, vfeKt } = configurationsContent(v.configurations);
    return {
      schemaVersion: REVISION_SCHEMA_VERSION,
      aircraft: withoutUndefined({ category: v.aircraft.category ?? undefined, engines: out(v.aircraft.engines), ceilingFt: out(v.aircraft.ceilingFt), tatRecoveryFactor: this.carriedTatRecoveryFactor }),
      weights: withoutUndefined({
        minimumKg: out(v.weights.minimumKg),
        maximumTakeoffKg: out(v.weights.maximumTakeoffKg),
        maximumLandingKg: out(v.weights.maximumLandingKg),
        referenceKg: out(v.weights.referenceKg),
      }),
      configurations,
      speeds: this.speeds.controls.map((group) => speedContent(group.getRawValue())),
      limits: { ...withoutUndefined(Object.fromEntries(LIMIT_KEYS.map((key) => [key, out(v.limits[key])]))), vfeKt },
      indicatorMarkingBasis: v.indicatorMarkingBasis ?? undefined,
      notes: v.notes,
      ...(this.namedUnits || v.statedUnits.weight !== CANONICAL_UNITS.weight || v.statedUnits.speed !== CANONICAL_UNITS.speed
        ? { statedUnits: { weight: v.statedUnits.weight, speed: v.statedUnits.speed } }
        : {}),
      ...withoutUndefined({
        envelope: envelopeContent(this.group.controls.envelope),
        statesReferenceStallSpeeds: v.statesReferenceStallSpeeds || undefined,
        ruleExceptions: ruleExceptionsContent(this.ruleExceptions),
      }),
    };
  }

  /** Every field control with the content path the schema reports its problems at. */
  fieldControls(): Map<string, AbstractControl> {
    const fields = new Map<string, AbstractControl>();
    const add = (path: string, control: AbstractControl) => fields.set(path, control);
    const g = this.group.controls;
    for (const [name, control] of Object.entries(g.aircraft.controls)) add(`aircraft.${name}`, control);
    for (const [name, control] of Object.entries(g.weights.controls)) add(`weights.${name}`, control);
    for (const [name, control] of Object.entries(g.limits.controls)) add(`limits.${name}`, control);
    add('indicatorMarkingBasis', g.indicatorMarkingBasis);
    add('notes', g.notes);
    add('statedUnits.weight', g.statedUnits.controls.weight);
    add('statedUnits.speed', g.statedUnits.controls.speed);
    add('statesReferenceStallSpeeds', g.statesReferenceStallSpeeds);
    envelopeFieldControls(g.envelope, g.ruleExceptions, add);
    configurationFieldControls(this.configurations, add);
    speedFieldControls(this.speeds, add);
    return fields;
  }

  addConfiguration(): void {
    this.configurations.push(blankConfigurationGroup());
  }

  addSpeed(): void {
    this.speeds.push(speedGroup({ kind: 'scaled', basis: 'ias', phase: 'any', configurationKey: this.configurations.at(0)?.controls.key.value ?? '' }));
  }

  /**
   * Takes an accepted CSV preview into the form: a configuration's position-error table, or a
   * speed's table, replaced whole; unknown keys and codes are added. Answers what changed.
   */
  acceptUpload(upload: SpeedTableUploadResponse): string[] {
    return acceptUploadInto(this, upload);
  }
}
