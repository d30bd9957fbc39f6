import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { statedSymbol } from '@shared/speed-book/stated-units';
import { ConfigurationGroup, pointGroup } from './revision-form';
import { StatedUnitInput } from './stated-unit-input';
import { StatedUnitsContext } from './stated-units-context';

/** The editable IAS → CAS table of one configuration, with the schema's sentences at its cells. */
@Component({
  selector: 'sw-position-error-editor',
  imports: [ReactiveFormsModule, MatButtonModule, MatIconModule, StatedUnitInput],
  template: `
    <table class="cells" [attr.aria-label]="'Position-error table of ' + (configuration().controls.label.value || 'configuration ' + (index() + 1))">
      <thead>
        <tr>
          <th scope="col">Row</th>
          <th scope="col">IAS ({{ speedUnit() }})</th>
          <th scope="col">CAS ({{ speedUnit() }})</th>
          <th scope="col"><span class="sw-visually-hidden">Remove</span></th>
        </tr>
      </thead>
      <tbody>
        @for (point of configuration().controls.positionError.controls; track point; let j = $index) {
          <tr [formGroup]="point">
            <th scope="row">{{ j + 1 }}</th>
            @for (column of columns; track column.name) {
              <td [class.bad]="problems()[path(j, column.name)]">
                <input
                  type="number"
                  inputmode="decimal"
                  [formControlName]="column.name"
                  swStatedUnit="speed"
                  [attr.aria-label]="column.label + ' (' + speedUnit() + '), row ' + (j + 1)"
                  [attr.data-path]="path(j, column.name)"
                  [attr.aria-invalid]="!!problems()[path(j, column.name)]"
                  [attr.title]="problems()[path(j, column.name)]"
                />
              </td>
            }
            <td>
              <button mat-icon-button type="button" (click)="removePoint(j)" [attr.aria-label]="'Remove row ' + (j + 1)">
                <mat-icon>delete</mat-icon>
              </button>
            </td>
          </tr>
        }
      </tbody>
    </table>
    <button mat-button type="button" (click)="addPoint()"><mat-icon>add</mat-icon>Add IAS/CAS row</button>
    @if (tableProblems().length) {
      <ul class="cell-problems" data-testid="position-error-problems">
        @for (problem of tableProblems(); track problem) {
          <li>{{ problem }}</li>
        }
      </ul>
    }
  `,
  styleUrl: './editor-tables.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PositionErrorEditor {
  readonly configuration = input.required<ConfigurationGroup>();
  readonly index = input.required<number>();
  readonly problems = input.required<Readonly<Record<string, string>>>();

  private readonly statedUnits = inject(StatedUnitsContext, { optional: true })?.units;
  protected readonly speedUnit = computed(() => (this.statedUnits ? statedSymbol('speed', this.statedUnits()) : 'kt'));

  protected readonly columns = [
    { name: 'iasKt', label: 'IAS' },
    { name: 'casKt', label: 'CAS' },
  ] as const;

  /** The table's sentences, row by row, beneath it (cells are too narrow to hold them). */
  protected readonly tableProblems = computed(() => {
    const prefix = `configurations.${this.index()}.positionError`;
    return Object.entries(this.problems())
      .filter(([path]) => path === prefix || path.startsWith(`${prefix}.`))
      .map(([path, sentence]) => {
        const row = /\.positionError\.(\d+)/.exec(path)?.[1];
        return row === undefined ? sentence : `Row ${Number(row) + 1}: ${sentence}`;
      });
  });

  protected path(j: number, column: string): string {
    return `configurations.${this.index()}.positionError.${j}.${column}`;
  }

  protected addPoint(): void {
    this.configuration().controls.positionError.push(pointGroup());
  }

  protected removePoint(j: number): void {
    this.configuration().controls.positionError.removeAt(j);
  }
}
