import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { statedSymbol } from '@shared/speed-book/stated-units';
import { SpeedGroup, TableShape, valuePath } from './revision-form';
import { StatedUnitInput } from './stated-unit-input';
import { StatedUnitsContext } from './stated-units-context';

/**
 * The editable grid of a tabulated speed: weights down, pressure altitudes across, one page per
 * OAT. Without altitudes the grid is a single speed column; without OATs, a single page.
 */
@Component({
  selector: 'sw-tabulated-speed-grid',
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule, StatedUnitInput],
  templateUrl: './tabulated-speed-grid.html',
  styleUrl: './editor-tables.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TabulatedSpeedGrid {
  readonly speed = input.required<SpeedGroup>();
  readonly index = input.required<number>();
  readonly problems = input.required<Readonly<Record<string, string>>>();

  private readonly statedUnits = inject(StatedUnitsContext, { optional: true })?.units;
  protected readonly speedUnit = computed(() => (this.statedUnits ? statedSymbol('speed', this.statedUnits()) : 'kt'));
  protected readonly weightUnit = computed(() => (this.statedUnits ? statedSymbol('weight', this.statedUnits()) : 'kg'));

  protected readonly table = computed(() => this.speed().controls.table.controls);
  private readonly shape = computed(() => new TableShape(this.speed().controls.table));

  protected readonly gridProblems = computed(() => {
    const prefix = `speeds.${this.index()}.`;
    const names = ['byWeightKg', 'byPressureAltitudeFt', 'byOatC', 'valuesKt'];
    return Object.entries(this.problems())
      .filter(([path]) => names.some((name) => path === prefix + name || path.startsWith(`${prefix}${name}.`)))
      .map(([path, sentence]) => `${where(path.slice(prefix.length))}${sentence}`);
  });

  /** One page per OAT, or a single page when the speed does not vary with temperature. */
  protected pages(): number[] {
    const oats = this.table().oats.length;
    return Array.from({ length: Math.max(1, oats) }, (_, o) => o);
  }

  /** One column per pressure altitude, or the single speed column. */
  protected columns(): number[] {
    return Array.from({ length: Math.max(1, this.table().altitudes.length) }, (_, a) => a);
  }

  protected cellPath(w: number, a: number, o: number): string {
    return valuePath(this.speed(), this.index(), w, a, o);
  }

  protected axisPath(axis: 'byWeightKg' | 'byPressureAltitudeFt' | 'byOatC', j: number): string {
    return `speeds.${this.index()}.${axis}.${j}`;
  }

  protected addWeight(): void {
    this.shape().addWeight();
  }
  protected removeWeight(w: number): void {
    this.shape().removeWeight(w);
  }
  protected addAltitude(): void {
    this.shape().addAltitude();
  }
  protected removeAltitude(a: number): void {
    this.shape().removeAltitude(a);
  }
  protected addOat(): void {
    this.shape().addOat();
  }
  protected removeOat(o: number): void {
    this.shape().removeOat(o);
  }
}

function where(path: string): string {
  const [axis, first, second, third] = path.split('.');
  if (first === undefined) return '';
  const n = (value: string) => Number(value) + 1;
  if (axis === 'byWeightKg') return `Weight ${n(first)}: `;
  if (axis === 'byPressureAltitudeFt') return `Pressure altitude ${n(first)}: `;
  if (axis === 'byOatC') return `OAT ${n(first)}: `;
  return `Cell at weight ${n(first)}${second !== undefined ? `, column ${n(second)}` : ''}${third !== undefined ? `, page ${n(third)}` : ''}: `;
}
