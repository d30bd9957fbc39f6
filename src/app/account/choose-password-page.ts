import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, NonNullableFormBuilder, ReactiveFormsModule, ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { newPasswordSchema } from '../../../shared/api/new-password';
import { ApiRequestError } from '../core/api/api-request-error';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { AccountLinks } from './account-links';
import { readLinkToken } from './link-token';

/** Which mail the link came from; the route says it. */
export type PasswordLinkKind = 'invitation' | 'reset';

const WORDING: Readonly<Record<PasswordLinkKind, { title: string; lead: string; submit: string; done: string }>> = {
  invitation: {
    title: 'Welcome to Speedwright',
    lead: 'Your administrator has invited you. Choose the password you will sign in with.',
    submit: 'Set password',
    done: 'Your password is set and the invitation is used.',
  },
  reset: {
    title: 'Choose a new password',
    lead: 'Choose the password you will sign in with from now on. Devices signed in with the old one are signed out.',
    submit: 'Save new password',
    done: 'Your new password is saved.',
  },
};

/** The server's codes for a link that no second try can make work (`server/auth/link-tokens.ts`). */
const DEAD_LINK_CODES = new Set(['invalid_link', 'link_used', 'link_replaced', 'link_expired']);

/** Whoever holds the token from the mail chooses a password here, without signing in first. */
@Component({
  selector: 'sw-choose-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './choose-password-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChoosePasswordPage {
  private readonly links = inject(AccountLinks);
  private readonly destroyRef = inject(DestroyRef);
  private readonly route = inject(ActivatedRoute);

  /** Bound from the route's data. */
  readonly kind = input<PasswordLinkKind>('invitation');

  protected readonly wording = computed(() => WORDING[this.kind()]);
  private readonly link = readLinkToken(this.route.snapshot.fragment, this.route.snapshot.queryParamMap.get('token'));
  /** Why this link cannot set a password: incomplete, unknown, used, replaced or expired. */
  protected readonly linkProblem = signal('problem' in this.link ? this.link.problem : null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', zodValidator(newPasswordSchema)],
    repeat: ['', sameAsPassword],
  });
  protected readonly pending = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** The address to sign in with, once the server has taken the password. */
  protected readonly doneFor = signal<string | null>(null);
  protected readonly passwordVisible = signal(false);
  protected readonly message = (path: string) => controlMessage(this.form, path);

  constructor() {
    this.form.controls.password.valueChanges
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.form.controls.repeat.updateValueAndValidity({ emitEvent: false }));
  }

  protected savePassword(): void {
    if (this.pending() || !('token' in this.link)) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { password } = this.form.getRawValue();
    const request =
      this.kind() === 'invitation'
        ? this.links.acceptInvitation({ token: this.link.token, password })
        : this.links.confirmPasswordReset({ token: this.link.token, password });
    this.pending.set(true);
    this.problem.set(null);
    request
      .pipe(
        finalize(() => this.pending.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: ({ email }) => this.doneFor.set(email),
        error: (error: ApiRequestError) => {
          if (DEAD_LINK_CODES.has(error.code)) {
            this.linkProblem.set(error.message);
          } else if (showServerFieldErrors(this.form, error)) {
            this.problem.set(error.message);
          }
        },
      });
  }

  protected togglePasswordVisibility(): void {
    this.passwordVisible.update((visible) => !visible);
  }
}

function sameAsPassword(control: AbstractControl<string>): ValidationErrors | null {
  const password = control.parent?.get('password')?.value as string | undefined;
  if (!control.value) return { schema: 'Type the password a second time.' };
  return control.value === password ? null : { schema: 'The two passwords are not the same.' };
}
