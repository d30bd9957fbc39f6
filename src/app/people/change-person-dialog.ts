import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { OperatorPerson, UpdatePersonRequest, invitePersonRequestSchema } from '@shared/api/auth';
import type { Role } from '@shared/auth/roles';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
import { zodValidator } from '../core/forms/zod-validator';
import { OperatorPeople } from './operator-people';
import { RoleField } from './role-field';

const fields = invitePersonRequestSchema.shape;

/** Changes a person's role or name; closes with the person as the server saved them. */
@Component({
  selector: 'sw-change-person-dialog',
  imports: [ReactiveFormsModule, DialogFooter, RoleField, MatDialogModule, MatFormFieldModule, MatInputModule],
  templateUrl: './change-person-dialog.html',
  styleUrl: './people-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePersonDialog {
  private readonly people = inject(OperatorPeople);
  protected readonly person = inject<OperatorPerson>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    displayName: [this.person.displayName, zodValidator(fields.displayName)],
    role: [this.person.role as Role, zodValidator(fields.role)],
  });
  protected readonly submission = dialogSubmit(this.form, inject<MatDialogRef<ChangePersonDialog, OperatorPerson>>(MatDialogRef));

  protected saveChange(): void {
    if (!this.submission.formReady()) return;
    const { displayName, role } = this.form.getRawValue();
    const change: UpdatePersonRequest = {};
    if (role !== this.person.role) change.role = role;
    if (displayName.trim() !== this.person.displayName) change.displayName = displayName.trim();
    if (Object.keys(change).length === 0) {
      this.submission.closeUnchanged();
      return;
    }
    this.submission.submit(this.people.change(this.person.id, change));
  }
}
