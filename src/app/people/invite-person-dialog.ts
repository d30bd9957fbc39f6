import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { map } from 'rxjs';
import { invitePersonRequestSchema } from '../../../shared/api/auth';
import { InvitationSent } from '../../../shared/api/people';
import { ROLES, ROLE_LABELS, ROLE_SUMMARIES, Role } from '../../../shared/auth/roles';
import { DialogFooter } from '../core/forms/dialog-footer';
import { dialogSubmit } from '../core/forms/dialog-submit';
import { zodValidator } from '../core/forms/zod-validator';
import { OperatorPeople } from './operator-people';

const fields = invitePersonRequestSchema.shape;

/** Adds a person by e-mail; the server mails them a link to choose a password. */
@Component({
  selector: 'sw-invite-person-dialog',
  imports: [ReactiveFormsModule, DialogFooter, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  templateUrl: './invite-person-dialog.html',
  styleUrl: './people-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitePersonDialog {
  private readonly people = inject(OperatorPeople);

  protected readonly roles = ROLES.map((role) => ({ role, label: ROLE_LABELS[role] }));
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', zodValidator(fields.email)],
    displayName: ['', zodValidator(fields.displayName)],
    role: [null as Role | null, (control: AbstractControl<Role | null>) => (control.value ? null : { schema: 'Choose the role this person will have.' })],
  });
  protected readonly roleSummary = toSignal(
    this.form.controls.role.valueChanges.pipe(map((role) => (role ? ROLE_SUMMARIES[role] : null))),
    { initialValue: null },
  );
  protected readonly submission = dialogSubmit(this.form, inject<MatDialogRef<InvitePersonDialog, InvitationSent>>(MatDialogRef));

  protected sendInvitation(): void {
    if (!this.submission.formReady()) return;
    const parsed = invitePersonRequestSchema.safeParse(this.form.getRawValue());
    if (!parsed.success) return;
    this.submission.submit(this.people.invite(parsed.data));
  }
}
