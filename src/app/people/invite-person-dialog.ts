import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { invitePersonRequestSchema } from '@shared/api/auth';
import { InvitationSent } from '@shared/api/people';
import type { Role } from '@shared/auth/roles';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
import { zodValidator } from '../core/forms/zod-validator';
import { OperatorPeople } from './operator-people';
import { RoleField } from './role-field';

const fields = invitePersonRequestSchema.shape;

/** Adds a person by e-mail; the server mails them a link to choose a password. */
@Component({
  selector: 'sw-invite-person-dialog',
  imports: [ReactiveFormsModule, DialogFooter, RoleField, MatDialogModule, MatFormFieldModule, MatInputModule],
  templateUrl: './invite-person-dialog.html',
  styleUrl: './people-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitePersonDialog {
  private readonly people = inject(OperatorPeople);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', zodValidator(fields.email)],
    displayName: ['', zodValidator(fields.displayName)],
    role: [null as Role | null, (control: AbstractControl<Role | null>) => (control.value ? null : { schema: 'Choose the role this person will have.' })],
  });
  protected readonly submission = dialogSubmit(this.form, inject<MatDialogRef<InvitePersonDialog, InvitationSent>>(MatDialogRef));

  protected sendInvitation(): void {
    if (!this.submission.formReady()) return;
    const parsed = invitePersonRequestSchema.safeParse(this.form.getRawValue());
    if (!parsed.success) return;
    this.submission.submit(this.people.invite(parsed.data));
  }
}
