import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { Observable, finalize } from 'rxjs';
import { AircraftTypeView, AirframeView, UpdateAirframe, createAirframeSchema } from '../../../shared/api/fleet';
import { ApiRequestError } from '../core/api/api-request-error';
import { zodValidator } from '../core/forms/zod-validator';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
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
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule, MatButtonModule, MatIconModule],
  templateUrl: './airframe-dialog.html',
  styleUrl: './fleet-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AirframeDialog {
  private readonly fleet = inject(FleetRecords);
  private readonly dialogRef = inject<MatDialogRef<AirframeDialog, AirframeView>>(MatDialogRef);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly data = inject<AirframeDialogData>(MAT_DIALOG_DATA);

  protected readonly editing = this.data.airframe;
  protected readonly form = inject(NonNullableFormBuilder).group({
    registration: [this.editing?.registration ?? '', zodValidator(fields.registration)],
    serial: [this.editing?.serial ?? '', zodValidator(fields.serial)],
    aircraftTypeId: [this.editing?.aircraftTypeId ?? (null as number | null), zodValidator(fields.aircraftTypeId)],
    active: [this.editing?.active ?? true],
  });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly message = (path: string) => controlMessage(this.form, path);

  protected saveAirframe(): void {
    if (this.saving()) return;
    this.form.markAllAsTouched();
    const parsed = createAirframeSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !parsed.success) return;
    const change = this.editing ? changedFields(this.editing, parsed.data) : null;
    if (this.editing && change && Object.keys(change).length === 0) {
      this.dialogRef.close();
      return;
    }
    const request: Observable<AirframeView> =
      this.editing && change ? this.fleet.changeAirframe(this.editing.id, change) : this.fleet.addAirframe(parsed.data);
    this.saving.set(true);
    this.problem.set(null);
    request
      .pipe(
        finalize(() => this.saving.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (saved) => this.dialogRef.close(saved),
        error: (error: ApiRequestError) => {
          if (showServerFieldErrors(this.form, error)) this.problem.set(error.message);
        },
      });
  }
}

function changedFields(before: AirframeView, after: Required<UpdateAirframe>): UpdateAirframe {
  const change: UpdateAirframe = {};
  if (after.registration !== before.registration) change.registration = after.registration;
  if (after.serial !== before.serial) change.serial = after.serial;
  if (after.aircraftTypeId !== before.aircraftTypeId) change.aircraftTypeId = after.aircraftTypeId;
  if (after.active !== before.active) change.active = after.active;
  return change;
}
