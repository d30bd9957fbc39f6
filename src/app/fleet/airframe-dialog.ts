import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { AircraftTypeView, AirframeView, createAirframeSchema } from '@shared/api/fleet';
import { zodValidator } from '../core/forms/zod-validator';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
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
  protected readonly data = inject<AirframeDialogData>(MAT_DIALOG_DATA);

  protected readonly editing = this.data.airframe;
  protected readonly form = inject(NonNullableFormBuilder).group({
    registration: [this.editing?.registration ?? '', zodValidator(fields.registration)],
    serial: [this.editing?.serial ?? '', zodValidator(fields.serial)],
    aircraftTypeId: [this.editing?.aircraftTypeId ?? (null as number | null), zodValidator(fields.aircraftTypeId)],
    active: [this.editing?.active ?? true],
  });
  protected readonly submission = dialogSubmit(this.form, inject<MatDialogRef<AirframeDialog, AirframeView>>(MatDialogRef));

  protected saveAirframe(): void {
    if (!this.submission.formReady()) return;
    const parsed = createAirframeSchema.safeParse(this.form.getRawValue());
    if (!parsed.success) return;
    this.submission.saveRecord(
      this.editing,
      parsed.data,
      (airframe) => this.fleet.addAirframe(airframe),
      (id, change) => this.fleet.changeAirframe(id, change),
    );
  }
}
