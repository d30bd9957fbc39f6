import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { STATED_SPEED_UNITS, STATED_WEIGHT_UNITS } from '@shared/speed-book/content-shape';
import { UNIT_SYMBOLS, type StatedSpeedUnit, type StatedWeightUnit } from '@shared/speed-book/stated-units';

export type StatedUnitsGroup = FormGroup<{ weight: FormControl<StatedWeightUnit>; speed: FormControl<StatedSpeedUnit> }>;

const WEIGHT_WORDS: Record<StatedWeightUnit, string> = { kg: 'kilograms (kg)', lb: 'pounds (lb)' };
const SPEED_WORDS: Record<StatedSpeedUnit, string> = { kt: 'knots (kt)', mph: 'miles per hour (mph)', kmh: 'kilometres per hour (km/h)' };

/** The two unit choices, weight then speed, each with its units in the words the select shows. */
const UNIT_KINDS = [
  { name: 'weight', label: 'Weights in', units: STATED_WEIGHT_UNITS.map((value) => ({ value, words: WEIGHT_WORDS[value] })) },
  { name: 'speed', label: 'Speeds in', units: STATED_SPEED_UNITS.map((value) => ({ value, words: SPEED_WORDS[value] })) },
] as const;

/**
 * The units the flight manual prints, chosen per revision. Every weight and speed of the form is
 * typed and shown in them; the content stores kg and kt whatever is chosen, so switching shows
 * the same stored figures converted.
 */
@Component({
  selector: 'sw-stated-units-panel',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatSelectModule],
  template: `
    <div class="fields" [formGroup]="units()" data-testid="stated-units">
      @for (kind of kinds; track kind.name) {
        <mat-form-field appearance="outline">
          <mat-label>{{ kind.label }}</mat-label>
          <mat-select [formControlName]="kind.name" [attr.data-path]="'statedUnits.' + kind.name">
            @for (unit of kind.units; track unit.value) {
              <mat-option [value]="unit.value">{{ unit.words }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      }
    </div>
    <p class="muted">
      Type every weight and speed below as the flight manual prints it, in {{ symbols[units().controls.weight.value] }} and
      {{ symbols[units().controls.speed.value] }}. The book stores kilograms and knots; changing the units here shows the same
      stored figures converted and changes none of them. The review shows the approver these units beside the stored ones.
    </p>
  `,
  styles: `
    .fields {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
    }
    mat-form-field {
      width: 18rem;
      max-width: 100%;
    }
    .muted {
      margin: 4px 0 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatedUnitsPanel {
  readonly units = input.required<StatedUnitsGroup>();

  protected readonly kinds = UNIT_KINDS;
  protected readonly symbols = UNIT_SYMBOLS;
}
