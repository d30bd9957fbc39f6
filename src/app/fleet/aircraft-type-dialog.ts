import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Observable } from 'rxjs';
import { AircraftTypeView, UpdateAircraftType, createAircraftTypeSchema } from '../../../shared/api/fleet';
import type { AircraftCategory } from '../../../shared/speed-book/revision-content';
import { zodValidator } from '../core/forms/zod-validator';
import { changedFields } from '../core/forms/changed-fields';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
import { controlMessage } from '../core/forms/server-field-errors';
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
  private readonly dialogRef = inject<MatDialogRef<AircraftTypeDialog, AircraftTypeView>>(MatDialogRef);
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
  private readonly submission = dialogSubmit(this.form, this.dialogRef);
  protected readonly saving = this.submission.busy;
  protected readonly problem = this.submission.problem;
  protected readonly message = (path: string) => controlMessage(this.form, path);

  protected saveAircraftType(): void {
    if (this.saving()) return;
    this.form.markAllAsTouched();
    const parsed = createAircraftTypeSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !parsed.success) return;
    const change = this.editing ? changedFields<UpdateAircraftType>(this.editing, parsed.data) : null;
    if (this.editing && change && Object.keys(change).length === 0) {
      this.submission.closeUnchanged();
      return;
    }
    const request: Observable<AircraftTypeView> =
      this.editing && change ? this.fleet.changeAircraftType(this.editing.id, change) : this.fleet.addAircraftType(parsed.data);
    this.submission.submit(request);
  }
}
