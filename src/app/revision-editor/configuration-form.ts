import { FormArray, FormGroup, type FormControl } from '@angular/forms';
import { list, num, numberControl, out, record, str, text, withoutUndefined, type AddField, type Json, type NumberControl } from './form-content';

/** One row of a configuration's position-error table (flight manual's IAS → CAS correction). */
export type PointGroup = FormGroup<{ iasKt: NumberControl; casKt: NumberControl }>;
export type ConfigurationGroup = FormGroup<{
  key: FormControl<string>;
  label: FormControl<string>;
  /** Kept with its configuration in the form; in the content it is `limits.vfeKt[key]`. */
  vfeKt: NumberControl;
  /** The flight manual's ice increment for this configuration, whole kt; empty when none is stated. */
  iceIncrementKt: NumberControl;
  positionError: FormArray<PointGroup>;
}>;
type Point = { iasKt: number | null; casKt: number | null };

export function pointGroup(iasKt: number | null = null, casKt: number | null = null): PointGroup {
  return new FormGroup({ iasKt: numberControl(iasKt), casKt: numberControl(casKt) });
}

export function configurationGroup(key: string, label: string, vfeKt: number | null, points: Point[], iceIncrementKt: number | null = null): ConfigurationGroup {
  return new FormGroup({
    key: text(key),
    label: text(label),
    vfeKt: numberControl(vfeKt),
    iceIncrementKt: numberControl(iceIncrementKt),
    positionError: new FormArray(points.map((p) => pointGroup(p.iasKt, p.casKt))),
  });
}

/** A new configuration as the editor adds it: empty, with the two points a table needs at least. */
export function blankConfigurationGroup(): ConfigurationGroup {
  return configurationGroup('', '', null, [{ iasKt: null, casKt: null }, { iasKt: null, casKt: null }]);
}

/** The content's configurations, each with its flap limit speed read from `limits.vfeKt`. */
export function configurationGroupsOf(content: Json): ConfigurationGroup[] {
  const vfe = record(record(content['limits'])['vfeKt']);
  return list(content['configurations']).map((item) => {
    const c = record(item);
    const points = list(c['positionError']).map((p) => ({ iasKt: num(record(p)['iasKt']), casKt: num(record(p)['casKt']) }));
    return configurationGroup(str(c['key']), str(c['label']), num(vfe[str(c['key'])]), points, num(c['iceIncrementKt']));
  });
}

/** The configurations as content, and their flap limit speeds as `limits.vfeKt`. */
export function configurationsContent(configurations: ReturnType<ConfigurationGroup['getRawValue']>[]): { configurations: Json[]; vfeKt: Record<string, number> } {
  const vfeKt: Record<string, number> = {};
  for (const c of configurations) {
    const value = out(c.vfeKt);
    if (value !== undefined) vfeKt[c.key] = value;
  }
  return {
    configurations: configurations.map((c) =>
      withoutUndefined({
        key: c.key,
        label: c.label,
        iceIncrementKt: out(c.iceIncrementKt),
        positionError: c.positionError.map((p) => withoutUndefined({ iasKt: out(p.iasKt), casKt: out(p.casKt) })),
      }),
    ),
    vfeKt,
  };
}

export function configurationFieldControls(configurations: FormArray<ConfigurationGroup>, add: AddField): void {
  configurations.controls.forEach((c, i) => {
    add(`configurations.${i}.key`, c.controls.key);
    add(`configurations.${i}.label`, c.controls.label);
    add(`limits.vfeKt.${c.controls.key.value}`, c.controls.vfeKt);
    add(`configurations.${i}.iceIncrementKt`, c.controls.iceIncrementKt);
    c.controls.positionError.controls.forEach((p, j) => {
      add(`configurations.${i}.positionError.${j}.iasKt`, p.controls.iasKt);
      add(`configurations.${i}.positionError.${j}.casKt`, p.controls.casKt);
    });
  });
}
