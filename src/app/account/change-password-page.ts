import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { newPasswordProblem } from '@shared/auth/password-strength';
import { requestState } from '../core/api/request-state';
import { AuthService } from '../core/auth/auth-service';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { AccountFrame } from './account-frame';
import { AccountLinks } from './account-links';
import { AccountSubmit } from './account-submit';
import { NewPasswordFields, sameAs } from './new-password-fields';

/**
 * The signed-in person changes their own password: the current one first, then the new one
 * twice. The rule is the server's (`shared/auth/password-strength.ts`), with the person's name,
 * address and operator as the words a password must not be built on.
 */
@Component({
  selector: 'sw-change-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, AccountFrame, NewPasswordFields, AccountSubmit],
  templateUrl: './change-password-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePasswordPage {
  private readonly links = inject(AccountLinks);
  private readonly auth = inject(AuthService);

  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', (control: AbstractControl<string>) => (control.value ? null : { schema: 'Enter your current password.' })],
    newPassword: ['', this.strongPassword()],
    repeat: ['', sameAs('newPassword', 'new password')],
  });
  private readonly request = requestState();
  protected readonly pending = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly done = signal(false);
  protected readonly passwordsVisible = signal(false);
  protected readonly message = (path: string) => controlMessage(this.form, path);

  protected changePassword(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { currentPassword, newPassword } = this.form.getRawValue();
    this.request.run(
      this.links.changePassword({ currentPassword, newPassword }),
      () => {
        this.form.reset();
        this.done.set(true);
      },
      (error) => (showServerFieldErrors(this.form, error) ? error.message : null),
    );
  }

  private strongPassword(): ValidatorFn {
    return (control) => {
      const user = this.auth.user();
      const personal = user ? [user.email, user.displayName, user.operatorName, 'speedwright'] : [];
      const problem = newPasswordProblem(control.value as string, personal);
      return problem ? { schema: problem } : null;
    };
  }
}
