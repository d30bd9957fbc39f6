import { FormArray, FormControl, FormGroup } from '@angular/forms';
import { SPEED_BASES, SPEED_PHASES } from '@shared/speed-book/revision-content';
import { speedClassOf, type SpeedClass } from './envelope-form';
import { list, num, numberControl, oneOf, out, str, text, withoutUndefined, type AddField, type Json, type NumberControl } from './form-content';

export type SpeedPhase = (typeof SPEED_PHASES)[number];
export type SpeedBasis = (typeof SPEED_BASES)[number];
export type SpeedKind = 'scaled' | 'tabulated' | 'fixed';

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

function valueAt(values: unknown, indexes: number[]): number | null {
  let value = values;
  for (const index of indexes) value = list(value)[index];
  return num(value);
}

/** A tabulated speed's grid from its axes and the content's nested `valuesKt`. */
export function tableGroup(weights: (number | null)[], altitudes: (number | null)[], oats: (number | null)[], valuesKt: unknown): TableGroup {
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

/** One speed of the content as form controls, whatever its kind; missing fields stay empty. */
export function speedGroup(speed: Json): SpeedGroup {
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

/** One speed as content: only the fields of its kind, the table nested by the axes it has. */
export function speedContent(s: ReturnType<SpeedGroup['getRawValue']>): Json {
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

/** The speeds' controls under their schema paths; only the fields of each speed's kind. */
export function speedFieldControls(speeds: FormArray<SpeedGroup>, add: AddField): void {
  speeds.controls.forEach((s, i) => {
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
}
