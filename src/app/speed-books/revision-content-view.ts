import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { revisionContentShape } from '@shared/speed-book/content-shape';
import type { RevisionContent, Speed } from '@shared/speed-book/revision-content';
import { UNIT_SYMBOLS, fromCanonical, isCanonical, statedSymbol, statedUnitsOf } from '@shared/speed-book/stated-units';
import { gridPages } from './tabulated-grid';

const CATEGORY_LABELS: Record<RevisionContent['aircraft']['category'], string> = {
  'piston-single': 'Single-engine piston',
  'piston-twin': 'Piston twin',
  turboprop: 'Turboprop',
  jet: 'Jet',
};

/** `kt` rows are shown in the stated speed unit. */
const LIMIT_ROWS: readonly { key: keyof Omit<RevisionContent['limits'], 'vfeKt'>; label: string; unit: 'kt' | 'Mach' }[] = [
  { key: 'vnoKt', label: 'VNO', unit: 'kt' },
  { key: 'vneKt', label: 'VNE', unit: 'kt' },
  { key: 'vmoKt', label: 'VMO', unit: 'kt' },
  { key: 'mmo', label: 'MMO', unit: 'Mach' },
  { key: 'vleKt', label: 'VLE', unit: 'kt' },
  { key: 'vloKt', label: 'VLO', unit: 'kt' },
  { key: 'vmcKt', label: 'VMC', unit: 'kt' },
  { key: 'vyseKt', label: 'VYSE', unit: 'kt' },
  { key: 'demonstratedCrosswindKt', label: 'Demonstrated crosswind', unit: 'kt' },
  { key: 'maximumTailwindKt', label: 'Tailwind limit', unit: 'kt' },
];

/**
 * A revision's content, read-only: aircraft, weights, configurations with their position-error
 * tables, speeds, limits and notes. The speed book page and the review page show it.
 */
@Component({
  selector: 'sw-revision-content-view',
  imports: [DecimalPipe, MatIconModule],
  templateUrl: './revision-content-view.html',
  styleUrl: './revision-content-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionContentView {
  readonly content = input.required<Record<string, unknown>>();

  private readonly parsed = computed(() => revisionContentShape.safeParse(this.content()));
  protected readonly view = computed(() => {
    const result = this.parsed();
    return result.success ? result.data : null;
  });
  /** The units the flight manual prints: every weight and speed below is shown in them. */
  private readonly units = computed(() => statedUnitsOf(this.content()));
  protected readonly weightUnit = computed(() => statedSymbol('weight', this.units()));
  protected readonly speedUnit = computed(() => statedSymbol('speed', this.units()));
  /** When the flight manual prints other units than the stored kg and kt, a sentence saying so. */
  protected readonly storedUnitsNote = computed(() => {
    const units = this.units();
    if (isCanonical('weight', units) && isCanonical('speed', units)) return null;
    return `Weights in ${UNIT_SYMBOLS[units.weight]} and speeds in ${UNIT_SYMBOLS[units.speed]}, as the flight manual prints them; the book stores kg and kt.`;
  });

  /** A stored weight (kg) in the stated unit. */
  protected weight(kg: number): number {
    return fromCanonical(kg, 'weight', this.units());
  }

  /** A stored speed (kt) in the stated unit; null (a gap in a table) stays null. */
  protected speed(kt: number): number;
  protected speed(kt: number | null): number | null;
  protected speed(kt: number | null): number | null {
    return kt === null ? null : fromCanonical(kt, 'speed', this.units());
  }
  protected readonly categoryLabel = computed(() => {
    const view = this.view();
    return view ? CATEGORY_LABELS[view.aircraft.category] : '';
  });
  protected readonly limits = computed(() => {
    const view = this.view();
    if (!view) return [];
    return LIMIT_ROWS.filter((row) => view.limits[row.key] !== undefined).map((row) =>
      row.unit === 'kt' ? { ...row, unit: this.speedUnit(), value: this.speed(view.limits[row.key]!) } : { ...row, value: view.limits[row.key]! },
    );
  });
  protected readonly vfe = computed(() => {
    const view = this.view();
    if (!view) return [];
    return Object.entries(view.limits.vfeKt).map(([key, valueKt]) => ({
      key,
      label: view.configurations.find((c) => c.key === key)?.label ?? key,
      value: this.speed(valueKt),
    }));
  });
  protected readonly tabulated = computed(() =>
    (this.view()?.speeds ?? []).flatMap((speed) => (speed.kind === 'tabulated' ? [{ speed, pages: gridPages(speed) }] : [])),
  );

  protected configurationLabel(key: string): string {
    return this.view()?.configurations.find((c) => c.key === key)?.label ?? key;
  }

  protected speedValue(speed: Speed): string {
    switch (speed.kind) {
      case 'fixed':
        return `${this.speed(speed.valueKt)} ${this.speedUnit()}`;
      case 'scaled': {
        const referenceKg = this.view()?.weights.referenceKg;
        return `${this.speed(speed.referenceKt)} ${this.speedUnit()} at ${referenceKg === undefined ? '?' : this.weight(referenceKg)} ${this.weightUnit()}, scaled by √(W/Wref)`;
      }
      case 'tabulated':
        return `Table against ${['weight', speed.byPressureAltitudeFt ? 'pressure altitude' : '', speed.byOatC ? 'OAT' : ''].filter(Boolean).join(' × ')}`;
    }
  }
}
