import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { AircraftTypeView, createAircraftTypeSchema } from '@shared/api/fleet';
import type { AircraftCategory } from '@shared/speed-book/revision-content';
import { zodValidator } from '../core/forms/zod-validator';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
import { AIRCRAFT_CATEGORY_LABELS } from './aircraft-category-labels';
import { FleetRecords } from './fleet-records';

export interface AircraftTypeDialogData {
  /** The type to edit; absent when adding one. */
  readonly aircraftType?: AircraftTypeView;
}

const fields = createAircraftTypeSchema.shape;

/** Adds an aircraft type or edits one; closes with the record the server saved. */
@Component({
  selector: 'sw-aircraft-type-dialog',
  imports: [ReactiveFormsModule, DialogFooter, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  templateUrl: './aircraft-type-dialog.html',
  styleUrl: './fleet-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AircraftTypeDialog {
  private readonly fleet = inject(FleetRecords);
  private readonly data = inject<AircraftTypeDialogData | null>(MAT_DIALOG_DATA, { optional: true });

  protected readonly editing = this.data?.aircraftType;
  protected readonly categories = Object.entries(AIRCRAFT_CATEGORY_LABELS) as [AircraftCategory, string][];
  protected readonly form = inject(NonNullableFormBuilder).group({
    designator: [this.editing?.designator ?? '', zodValidator(fields.designator)],
    name: [this.editing?.name ?? '', zodValidator(fields.name)],
    category: [this.editing?.category ?? (null as AircraftCategory | null), zodValidator(fields.category)],
    engines: [this.editing?.engines ?? (1 as number | null), zodValidator(fields.engines)],
    ceilingFt: [this.editing?.ceilingFt ?? (null as number | null), zodValidator(fields.ceilingFt)],
  });
  protected readonly submission = dialogSubmit(this.form, inject<MatDialogRef<AircraftTypeDialog, AircraftTypeView>>(MatDialogRef));

  protected saveAircraftType(): void {
    if (!this.submission.formReady()) return;
    const parsed = createAircraftTypeSchema.safeParse(this.form.getRawValue());
    if (!parsed.success) return;
    this.submission.saveRecord(
      this.editing,
      parsed.data,
      (aircraftType) => this.fleet.addAircraftType(aircraftType),
      (id, change) => this.fleet.changeAircraftType(id, change),
    );
  }
}
