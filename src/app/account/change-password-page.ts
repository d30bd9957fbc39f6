import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors, ValidatorFn } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { newPasswordProblem } from '../../../shared/auth/password-strength';
import { ApiRequestError } from '../core/api/api-request-error';
import { AuthService } from '../core/auth/auth-service';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { AccountLinks } from './account-links';

/**
 * The signed-in person changes their own password: the current one first, then the new one
 * twice. The rule is the server's (`shared/auth/password-strength.ts`), with the person's name,
 * address and operator as the words a password must not be built on.
 */
@Component({
  selector: 'sw-change-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './change-password-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePasswordPage {
  private readonly links = inject(AccountLinks);
  private readonly auth = inject(AuthService);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', (control: AbstractControl<string>) => (control.value ? null : { schema: 'Enter your current password.' })],
    newPassword: ['', this.strongPassword()],
    repeat: ['', sameAsNewPassword],
  });
  protected readonly pending = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly done = signal(false);
  protected readonly passwordsVisible = signal(false);
  protected readonly message = (path: string) => controlMessage(this.form, path);

  constructor() {
    this.form.controls.newPassword.valueChanges
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.form.controls.repeat.updateValueAndValidity({ emitEvent: false }));
  }

  protected changePassword(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { currentPassword, newPassword } = this.form.getRawValue();
    this.pending.set(true);
    this.problem.set(null);
    this.links
      .changePassword({ currentPassword, newPassword })
      .pipe(
        finalize(() => this.pending.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: () => {
          this.form.reset();
          this.done.set(true);
        },
        error: (error: ApiRequestError) => {
          if (showServerFieldErrors(this.form, error)) this.problem.set(error.message);
        },
      });
  }

  protected togglePasswordVisibility(): void {
    this.passwordsVisible.update((visible) => !visible);
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

function sameAsNewPassword(control: AbstractControl<string>): ValidationErrors | null {
  const password = control.parent?.get('newPassword')?.value as string | undefined;
  if (!control.value) return { schema: 'Type the new password a second time.' };
  return control.value === password ? null : { schema: 'The two new passwords are not the same.' };
}
