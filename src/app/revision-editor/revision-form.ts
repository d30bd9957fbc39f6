import { AbstractControl, FormArray, FormControl, FormGroup } from '@angular/forms';
import type { SpeedTableUploadResponse } from '../../../shared/api/uploads';
import { AIRCRAFT_CATEGORIES, REVISION_SCHEMA_VERSION, SPEED_BASES, SPEED_PHASES } from '../../../shared/speed-book/revision-content';
import { CANONICAL_UNITS, UNIT_SYMBOLS, statedUnitsOf, type StatedSpeedUnit, type StatedUnits, type StatedWeightUnit } from '../../../shared/speed-book/stated-units';
import {
  envelopeContent,
  envelopeFieldControls,
  envelopeGroup,
  loadEnvelope,
  loadRuleExceptions,
  ruleExceptionGroup,
  ruleExceptionsContent,
  speedClassOf,
  type RuleExceptionGroup,
  type SpeedClass,
} from './envelope-form';

export type AircraftCategory = (typeof AIRCRAFT_CATEGORIES)[number];
export type SpeedPhase = (typeof SPEED_PHASES)[number];
export type SpeedBasis = (typeof SPEED_BASES)[number];
export type SpeedKind = 'scaled' | 'tabulated' | 'fixed';
export type NumberControl = FormControl<number | null>;

export type PointGroup = FormGroup<{ iasKt: NumberControl; casKt: NumberControl }>;
export type ConfigurationGroup = FormGroup<{
  key: FormControl<string>;
  label: FormControl<string>;
  /** Kept with its configuration in the form; in the content it is `limits.vfeKt[key]`. */
  vfeKt: NumberControl;
  positionError: FormArray<PointGroup>;
}>;
/** Values are always [weight][altitude][oat]; an absent axis keeps one slot. */
export type TableGroup = FormGroup<{
  weights: FormArray<NumberControl>;
  altitudes: FormArray<NumberControl>;
  oats: FormArray<NumberControl>;
  values: FormArray<FormArray<FormArray<NumberControl>>>;
}>;
export type SpeedGroup = FormGroup<{
  code: FormControl<string>;
  label: FormControl<string>;
  phase: FormControl<SpeedPhase | null>;
  configurationKey: FormControl<string>;
  basis: FormControl<SpeedBasis | null>;
  /** Null: the class is read from the code (content written before speeds declared it). */
  speedClass: FormControl<SpeedClass | null>;
  kind: FormControl<SpeedKind>;
  referenceKt: NumberControl;
  valueKt: NumberControl;
  table: TableGroup;
}>;

const LIMIT_KEYS = ['vnoKt', 'vneKt', 'vmoKt', 'mmo', 'vleKt', 'vloKt', 'vmcKt', 'vyseKt'] as const;
export type LimitKey = (typeof LIMIT_KEYS)[number];

type Json = Record<string, unknown>;
const record = (value: unknown): Json => (typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {});
const list = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);
const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const str = (value: unknown): string => (typeof value === 'string' ? value : '');
const oneOf = <T extends string>(options: readonly T[], value: unknown): T | null => (options.includes(value as T) ? (value as T) : null);

const numberControl = (value: number | null = null): NumberControl => new FormControl<number | null>(value);
const text = (value = '') => new FormControl(value, { nonNullable: true });

export function pointGroup(iasKt: number | null = null, casKt: number | null = null): PointGroup {
  return new FormGroup({ iasKt: numberControl(iasKt), casKt: numberControl(casKt) });
}

function configurationGroup(key: string, label: string, vfeKt: number | null, points: { iasKt: number | null; casKt: number | null }[]): ConfigurationGroup {
  return new FormGroup({
    key: text(key),
    label: text(label),
    vfeKt: numberControl(vfeKt),
    positionError: new FormArray(points.map((p) => pointGroup(p.iasKt, p.casKt))),
  });
}

function valueAt(values: unknown, indexes: number[]): number | null {
  let value = values;
  for (const index of indexes) value = list(value)[index];
  return num(value);
}

function tableGroup(weights: (number | null)[], altitudes: (number | null)[], oats: (number | null)[], valuesKt: unknown): TableGroup {
  const values = weights.map((_, w) =>
    new FormArray(
      (altitudes.length ? altitudes : [null]).map((__, a) =>
        new FormArray(
          (oats.length ? oats : [null]).map((___, t) => {
            const indexes = [w, ...(altitudes.length ? [a] : []), ...(oats.length ? [t] : [])];
            return numberControl(valueAt(valuesKt, indexes));
          }),
        ),
      ),
    ),
  );
  return new FormGroup({
    weights: new FormArray(weights.map((v) => numberControl(v))),
    altitudes: new FormArray(altitudes.map((v) => numberControl(v))),
    oats: new FormArray(oats.map((v) => numberControl(v))),
    values: new FormArray(values),
  });
}

function speedGroup(speed: Json): SpeedGroup {
  const kind = oneOf(['scaled', 'tabulated', 'fixed'] as const, speed['kind']) ?? 'scaled';
  const weights = list(speed['byWeightKg']).map(num);
  return new FormGroup({
    code: text(str(speed['code'])),
    label: text(str(speed['label'])),
    phase: new FormControl(oneOf(SPEED_PHASES, speed['phase'])),
    configurationKey: text(str(speed['configurationKey'])),
    basis: new FormControl(oneOf(SPEED_BASES, speed['basis'])),
    speedClass: new FormControl(speedClassOf(speed['speedClass'])),
    kind: new FormControl(kind, { nonNullable: true }),
    referenceKt: numberControl(num(speed['referenceKt'])),
    valueKt: numberControl(num(speed['valueKt'])),
    table: tableGroup(
      weights.length ? weights : [null, null],
      list(speed['byPressureAltitudeFt']).map(num),
      list(speed['byOatC']).map(num),
      speed['valuesKt'],
    ),
  });
}

/** Null and NaN leave the field out of the content, so the schema says "Give …". */
const out = (value: number | null): number | undefined => (value === null || Number.isNaN(value) ? undefined : value);

function withoutUndefined(value: Json): Json {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined));
}

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
    const vfe = record(limits['vfeKt']);
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
    for (const item of list(content['configurations'])) {
      const c = record(item);
      const points = list(c['positionError']).map((p) => ({ iasKt: num(record(p)['iasKt']), casKt: num(record(p)['casKt']) }));
      this.configurations.push(configurationGroup(str(c['key']), str(c['label']), num(vfe[str(c['key'])]), points));
    }
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
    const vfeKt: Record<string, number> = {};
    for (const c of v.configurations) {
      const value = out(c.vfeKt);
      if (value !== undefined) vfeKt[c.key] = value;
    }
    return {
      schemaVersion: REVISION_SCHEMA_VERSION,
      aircraft: withoutUndefined({ category: v.aircraft.category ?? undefined, engines: out(v.aircraft.engines), ceilingFt: out(v.aircraft.ceilingFt), tatRecoveryFactor: this.carriedTatRecoveryFactor }),
      weights: withoutUndefined({
        minimumKg: out(v.weights.minimumKg),
        maximumTakeoffKg: out(v.weights.maximumTakeoffKg),
        maximumLandingKg: out(v.weights.maximumLandingKg),
        referenceKg: out(v.weights.referenceKg),
      }),
      configurations: v.configurations.map((c) => ({
        key: c.key,
        label: c.label,
        positionError: c.positionError.map((p) => withoutUndefined({ iasKt: out(p.iasKt), casKt: out(p.casKt) })),
      })),
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
    this.configurations.controls.forEach((c, i) => {
      add(`configurations.${i}.key`, c.controls.key);
      add(`configurations.${i}.label`, c.controls.label);
      add(`limits.vfeKt.${c.controls.key.value}`, c.controls.vfeKt);
      c.controls.positionError.controls.forEach((p, j) => {
        add(`configurations.${i}.positionError.${j}.iasKt`, p.controls.iasKt);
        add(`configurations.${i}.positionError.${j}.casKt`, p.controls.casKt);
      });
    });
    this.speeds.controls.forEach((s, i) => {
      for (const name of ['code', 'label', 'phase', 'configurationKey', 'basis', 'speedClass', 'kind'] as const) add(`speeds.${i}.${name}`, s.controls[name]);
      const kind = s.controls.kind.value;
      if (kind === 'scaled') add(`speeds.${i}.referenceKt`, s.controls.referenceKt);
      if (kind === 'fixed') add(`speeds.${i}.valueKt`, s.controls.valueKt);
      if (kind !== 'tabulated') return;
      const t = s.controls.table.controls;
      t.weights.controls.forEach((c, j) => add(`speeds.${i}.byWeightKg.${j}`, c));
      t.altitudes.controls.forEach((c, j) => add(`speeds.${i}.byPressureAltitudeFt.${j}`, c));
      t.oats.controls.forEach((c, j) => add(`speeds.${i}.byOatC.${j}`, c));
      t.values.controls.forEach((byAltitude, w) =>
        byAltitude.controls.forEach((byOat, a) => byOat.controls.forEach((cell, o) => add(valuePath(s, i, w, a, o), cell))),
      );
    });
    return fields;
  }

  addConfiguration(): void {
    this.configurations.push(configurationGroup('', '', null, [{ iasKt: null, casKt: null }, { iasKt: null, casKt: null }]));
  }

  addSpeed(): void {
    this.speeds.push(speedGroup({ kind: 'scaled', basis: 'ias', phase: 'any', configurationKey: this.configurations.at(0)?.controls.key.value ?? '' }));
  }

  /**
   * Takes an accepted CSV preview into the form: a configuration's position-error table, or a
   * speed's table, replaced whole; unknown keys and codes are added. Answers what changed.
   */
  acceptUpload(upload: SpeedTableUploadResponse): string[] {
    const changes: string[] = [];
    const stated = this.statedUnits();
    const differs = (['speed', 'weight'] as const).filter((quantity) => upload.statedUnits[quantity] !== undefined && upload.statedUnits[quantity] !== stated[quantity]);
    if (differs.length) {
      const fileUnits = differs.map((quantity) => `${quantity === 'speed' ? 'speeds' : 'weights'} in ${UNIT_SYMBOLS[upload.statedUnits[quantity]!]}`).join(' and ');
      const formUnits = differs.map((quantity) => UNIT_SYMBOLS[stated[quantity]]).join(' and ');
      changes.push(`The file gives ${fileUnits}; this revision states ${formUnits}, so its figures are shown converted. Choose the flight manual's units above if it prints them as the file does.`);
    }
    if (upload.layout === 'position-error') {
      for (const uploaded of upload.configurations) {
        let configuration = this.configurations.controls.find((c) => c.controls.key.value === uploaded.key);
        if (!configuration) {
          configuration = configurationGroup(uploaded.key, uploaded.key, null, []);
          this.configurations.push(configuration);
          changes.push(`Added the configuration ${uploaded.key}; give it a label.`);
        }
        configuration.setControl('positionError', new FormArray(uploaded.positionError.map((p) => pointGroup(p.iasKt, p.casKt))));
        changes.push(`Position-error table of ${uploaded.key}: ${uploaded.positionError.length} points.`);
      }
      return changes;
    }
    for (const uploaded of upload.speeds) {
      const table = tableGroup(uploaded.table.byWeightKg, uploaded.table.byPressureAltitudeFt ?? [], uploaded.table.byOatC ?? [], uploaded.table.valuesKt);
      const index = this.speeds.controls.findIndex((s) => s.controls.code.value === uploaded.code && s.controls.configurationKey.value === uploaded.configurationKey);
      if (index < 0) {
        const speed = speedGroup({ code: uploaded.code, label: uploaded.code, phase: 'any', basis: 'ias', configurationKey: uploaded.configurationKey, kind: 'tabulated' });
        speed.setControl('table', table);
        this.speeds.push(speed);
        changes.push(`Added ${uploaded.code} (${uploaded.configurationKey}) as a tabulated speed; check its label, phase and basis.`);
        continue;
      }
      const speed = this.speeds.at(index);
      speed.controls.kind.setValue('tabulated');
      speed.setControl('table', table);
      changes.push(`Table of ${uploaded.code} (${uploaded.configurationKey}): ${uploaded.table.byWeightKg.length} weights.`);
    }
    return changes;
  }
}

/** The schema path of one cell of a tabulated speed, leaving out the axes the speed does not have. */
export function valuePath(speed: SpeedGroup, i: number, w: number, a: number, o: number): string {
  const t = speed.controls.table.controls;
  return [`speeds.${i}.valuesKt.${w}`, ...(t.altitudes.length ? [a] : []), ...(t.oats.length ? [o] : [])].join('.');
}

function nest(values: (number | null)[][][], hasAltitude: boolean, hasOat: boolean): unknown[] {
  return values.map((byAltitude) => {
    const cells = byAltitude.map((byOat) => (hasOat ? byOat.map(out) : out(byOat[0] ?? null)));
    return hasAltitude ? cells : cells[0];
  });
}

function speedContent(s: ReturnType<SpeedGroup['getRawValue']>): Json {
  const base = { code: s.code, label: s.label, phase: s.phase ?? undefined, configurationKey: s.configurationKey, basis: s.basis ?? undefined, speedClass: s.speedClass ?? undefined, kind: s.kind };
  if (s.kind === 'scaled') return withoutUndefined({ ...base, referenceKt: out(s.referenceKt) });
  if (s.kind === 'fixed') return withoutUndefined({ ...base, valueKt: out(s.valueKt) });
  const hasAltitude = s.table.altitudes.length > 0;
  const hasOat = s.table.oats.length > 0;
  return withoutUndefined({
    ...base,
    byWeightKg: s.table.weights.map(out),
    byPressureAltitudeFt: hasAltitude ? s.table.altitudes.map(out) : undefined,
    byOatC: hasOat ? s.table.oats.map(out) : undefined,
    valuesKt: nest(s.table.values, hasAltitude, hasOat),
  });
}

/** Grid editing of a tabulated speed: rows are weights, columns pressure altitudes, pages OATs. */
export class TableShape {
  constructor(private readonly table: TableGroup) {}

  private get c() {
    return this.table.controls;
  }

  addWeight(): void {
    const slots = this.c.values.at(0);
    this.c.weights.push(numberControl());
    this.c.values.push(new FormArray((slots?.controls ?? [null]).map((byOat) => new FormArray((byOat?.controls ?? [null]).map(() => numberControl())))));
  }

  removeWeight(w: number): void {
    this.c.weights.removeAt(w);
    this.c.values.removeAt(w);
  }

  addAltitude(): void {
    const first = this.c.altitudes.length === 0;
    this.c.altitudes.push(numberControl());
    if (first) return; // the single speed column becomes the first altitude's
    for (const byAltitude of this.c.values.controls) byAltitude.push(new FormArray(byAltitude.at(0).controls.map(() => numberControl())));
  }

  removeAltitude(a: number): void {
    this.c.altitudes.removeAt(a);
    if (this.c.altitudes.length === 0 && a === 0 && this.c.values.at(0)?.length === 1) return;
    for (const byAltitude of this.c.values.controls) if (byAltitude.length > 1) byAltitude.removeAt(a);
  }

  addOat(): void {
    const first = this.c.oats.length === 0;
    this.c.oats.push(numberControl());
    if (first) return;
    for (const byAltitude of this.c.values.controls) for (const byOat of byAltitude.controls) byOat.push(numberControl());
  }

  removeOat(o: number): void {
    this.c.oats.removeAt(o);
    for (const byAltitude of this.c.values.controls) for (const byOat of byAltitude.controls) if (byOat.length > 1) byOat.removeAt(o);
  }
}
