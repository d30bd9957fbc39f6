import { FormArray } from '@angular/forms';
import type { SpeedTableUploadResponse } from '@shared/api/uploads';
import { UNIT_SYMBOLS, type StatedUnits } from '@shared/speed-book/stated-units';
import { configurationGroup, pointGroup, type ConfigurationGroup } from './configuration-form';
import { speedGroup, tableGroup, type SpeedGroup } from './speed-form';

/**
 * Takes an accepted CSV preview into the form's rows: a configuration's position-error table, or
 * a speed's table, replaced whole; unknown keys and codes are added. Answers what changed.
 */
export function acceptUploadInto(
  form: { configurations: FormArray<ConfigurationGroup>; speeds: FormArray<SpeedGroup>; statedUnits(): StatedUnits },
  upload: SpeedTableUploadResponse,
): string[] {
  const changes: string[] = [];
  const stated = form.statedUnits();
  const differs = (['speed', 'weight'] as const).filter((quantity) => upload.statedUnits[quantity] !== undefined && upload.statedUnits[quantity] !== stated[quantity]);
  if (differs.length) {
    const fileUnits = differs.map((quantity) => `${quantity === 'speed' ? 'speeds' : 'weights'} in ${UNIT_SYMBOLS[upload.statedUnits[quantity]!]}`).join(' and ');
    const formUnits = differs.map((quantity) => UNIT_SYMBOLS[stated[quantity]]).join(' and ');
    changes.push(`The file gives ${fileUnits}; this revision states ${formUnits}, so its figures are shown converted. Choose the flight manual's units above if it prints them as the file does.`);
  }
  if (upload.layout === 'position-error') {
    for (const uploaded of upload.configurations) {
      let configuration = form.configurations.controls.find((c) => c.controls.key.value === uploaded.key);
      if (!configuration) {
        configuration = configurationGroup(uploaded.key, uploaded.key, null, []);
        form.configurations.push(configuration);
        changes.push(`Added the configuration ${uploaded.key}; give it a label.`);
      }
      configuration.setControl('positionError', new FormArray(uploaded.positionError.map((p) => pointGroup(p.iasKt, p.casKt))));
      changes.push(`Position-error table of ${uploaded.key}: ${uploaded.positionError.length} points.`);
    }
    return changes;
  }
  for (const uploaded of upload.speeds) {
    const table = tableGroup(uploaded.table.byWeightKg, uploaded.table.byPressureAltitudeFt ?? [], uploaded.table.byOatC ?? [], uploaded.table.valuesKt);
    const index = form.speeds.controls.findIndex((s) => s.controls.code.value === uploaded.code && s.controls.configurationKey.value === uploaded.configurationKey);
    if (index < 0) {
      const speed = speedGroup({ code: uploaded.code, label: uploaded.code, phase: 'any', basis: 'ias', configurationKey: uploaded.configurationKey, kind: 'tabulated' });
      speed.setControl('table', table);
      form.speeds.push(speed);
      changes.push(`Added ${uploaded.code} (${uploaded.configurationKey}) as a tabulated speed; check its label, phase and basis.`);
      continue;
    }
    const speed = form.speeds.at(index);
    speed.controls.kind.setValue('tabulated');
    speed.setControl('table', table);
    changes.push(`Table of ${uploaded.code} (${uploaded.configurationKey}): ${uploaded.table.byWeightKg.length} weights.`);
  }
  return changes;
}
