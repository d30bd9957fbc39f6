import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Observable } from 'rxjs';
import { AircraftTypeView, AirframeView, UpdateAirframe, createAirframeSchema } from '../../../shared/api/fleet';
import { zodValidator } from '../core/forms/zod-validator';
import { changedFields } from '../core/forms/changed-fields';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
import { controlMessage } from '../core/forms/server-field-errors';
import { FleetRecords } from './fleet-records';

export interface AirframeDialogData {
  /** The airframe to edit; absent when adding one. */
  readonly airframe?: AirframeView;
  readonly aircraftTypes: readonly AircraftTypeView[];
}

const fields = createAirframeSchema.shape;

/** Adds an airframe or edits one; closes with the record the server saved. */
@Component({
  selector: 'sw-airframe-dialog',
  imports: [ReactiveFormsModule, DialogFooter, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule],
  templateUrl: './airframe-dialog.html',
  styleUrl: './fleet-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AirframeDialog {
  private readonly fleet = inject(FleetRecords);
  private readonly dialogRef = inject<MatDialogRef<AirframeDialog, AirframeView>>(MatDialogRef);
  protected readonly data = inject<AirframeDialogData>(MAT_DIALOG_DATA);

  protected readonly editing = this.data.airframe;
  protected readonly form = inject(NonNullableFormBuilder).group({
    registration: [this.editing?.registration ?? '', zodValidator(fields.registration)],
    serial: [this.editing?.serial ?? '', zodValidator(fields.serial)],
    aircraftTypeId: [this.editing?.aircraftTypeId ?? (null as number | null), zodValidator(fields.aircraftTypeId)],
    active: [this.editing?.active ?? true],
  });
  private readonly submission = dialogSubmit(this.form, this.dialogRef);
  protected readonly saving = this.submission.busy;
  protected readonly problem = this.submission.problem;
  protected readonly message = (path: string) => controlMessage(this.form, path);

  protected saveAirframe(): void {
    if (this.saving()) return;
    this.form.markAllAsTouched();
    const parsed = createAirframeSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !parsed.success) return;
    const change = this.editing ? changedFields<UpdateAirframe>(this.editing, parsed.data) : null;
    if (this.editing && change && Object.keys(change).length === 0) {
      this.submission.closeUnchanged();
      return;
    }
    const request: Observable<AirframeView> =
      this.editing && change ? this.fleet.changeAirframe(this.editing.id, change) : this.fleet.addAirframe(parsed.data);
    this.submission.submit(request);
  }
}
