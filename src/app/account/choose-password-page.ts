import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { newPasswordSchema } from '@shared/api/new-password';
import { requestState } from '../core/api/request-state';
import { showServerFieldErrors } from '../core/forms/server-field-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { AccountFrame } from './account-frame';
import { AccountLinks } from './account-links';
import { AccountSubmit } from './account-submit';
import { readLinkToken } from './link-token';
import { NewPasswordFields, sameAs } from './new-password-fields';
import { ProblemNote } from '../core/feedback/problem-note';

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
  imports: [ProblemNote, ReactiveFormsModule, RouterLink, MatButtonModule, MatIconModule, AccountFrame, NewPasswordFields, AccountSubmit],
  templateUrl: './choose-password-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChoosePasswordPage {
  private readonly links = inject(AccountLinks);
  private readonly route = inject(ActivatedRoute);

  /** Bound from the route's data. */
  readonly kind = input<PasswordLinkKind>('invitation');

  protected readonly wording = computed(() => WORDING[this.kind()]);
  private readonly link = readLinkToken(this.route.snapshot.fragment, this.route.snapshot.queryParamMap.get('token'));
  /** Why this link cannot set a password: incomplete, unknown, used, replaced or expired. */
  protected readonly linkProblem = signal('problem' in this.link ? this.link.problem : null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', zodValidator(newPasswordSchema)],
    repeat: ['', sameAs('password', 'password')],
  });
  private readonly request = requestState();
  protected readonly pending = this.request.busy;
  protected readonly problem = this.request.problem;
  /** The address to sign in with, once the server has taken the password. */
  protected readonly doneFor = signal<string | null>(null);

  protected savePassword(): void {
    if (this.pending() || !('token' in this.link)) return;
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const { password } = this.form.getRawValue();
    const request =
      this.kind() === 'invitation'
        ? this.links.acceptInvitation({ token: this.link.token, password })
        : this.links.confirmPasswordReset({ token: this.link.token, password });
    this.request.run(
      request,
      ({ email }) => this.doneFor.set(email),
      (error) => {
        if (DEAD_LINK_CODES.has(error.code)) {
          this.linkProblem.set(error.message);
          return null;
        }
        return showServerFieldErrors(this.form, error) ? error.message : null;
      },
    );
  }
}

