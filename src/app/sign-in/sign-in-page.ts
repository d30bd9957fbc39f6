import { ChangeDetectionStrategy, ChangeDetectorRef, Component, DestroyRef, PendingTasks, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { ApiRequestError } from '../core/api/api-request-error';
import { AuthService } from '../core/auth/auth-service';
import { ConnectionStatus } from '../core/connection/connection-status';
import { zodValidator } from '../core/forms/zod-validator';
import { AccountFrame } from '../account/account-frame';

type SignInField = 'email' | 'password';
type LoginRequestSchema = typeof import('@shared/api/session').loginRequestSchema;

/** Our own sentences for when the server's answer carried none. */
const FALLBACK_SENTENCES: Readonly<Record<number, string>> = {
  401: 'The e-mail or password is not right.',
  423: "This account is locked after repeated failed sign-ins. Ask your operator's administrator to unlock it.",
  429: 'Too many sign-in attempts. Wait a few minutes, then try again.',
};

@Component({
  selector: 'sw-sign-in-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormField, MatLabel, MatError, MatSuffix, MatInput, MatIcon, MatProgressBar, AccountFrame],
  templateUrl: './sign-in-page.html',
  styleUrl: './sign-in-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly auth = inject(AuthService);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  /** Where to go after signing in; bound from the `returnUrl` query parameter. */
  readonly returnUrl = input<string | undefined>();

  private readonly pendingTasks = inject(PendingTasks);
  private readonly changeDetector = inject(ChangeDetectorRef);
  /**
   * The sign-in rules (shared/api/session.ts, zod's small build) load when the person first
   * focuses the form (or submits it), not with the page; the fields get their validators as
   * soon as they arrive, well before a field is left.
   */
  private rules: Promise<typeof import('@shared/api/session')> | null = null;
  protected readonly form = inject(NonNullableFormBuilder).group({ email: [''], password: [''] });
  protected readonly online = inject(ConnectionStatus).online;
  protected readonly probeProblem = this.auth.probeProblem;
  protected readonly pending = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly passwordVisible = signal(false);

  protected prepareValidation(): Promise<typeof import('@shared/api/session') | null> {
    if (!this.rules) {
      const loading = this.pendingTasks.add();
      this.rules = import('@shared/api/session');
      this.rules.then(({ loginRequestSchema }) => this.applyRules(loginRequestSchema)).catch(() => (this.rules = null)).finally(loading);
    }
    return this.rules.catch(() => null);
  }

  protected async signIn(): Promise<void> {
    if (this.pending()) {
      return;
    }
    this.form.markAllAsTouched();
    const rules = await this.prepareValidation();
    if (!rules) {
      this.problem.set('Speedwright could not load this page completely. Reload it when the connection is steady.');
      return;
    }
    const { loginRequestSchema } = rules;
    if (this.pending()) {
      return;
    }
    const request = loginRequestSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !request.success) {
      return;
    }
    this.pending.set(true);
    this.problem.set(null);
    this.auth
      .signIn(request.data)
      .pipe(
        finalize(() => this.pending.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: () => void this.router.navigateByUrl(this.destination()),
        error: (error: ApiRequestError) => this.showProblem(error),
      });
  }

  private applyRules(schema: LoginRequestSchema): void {
    this.form.controls.email.setValidators(zodValidator(schema.shape.email));
    this.form.controls.password.setValidators(zodValidator(schema.shape.password));
    this.form.controls.email.updateValueAndValidity();
    this.form.controls.password.updateValueAndValidity();
    // The controls' errors are not signals: show the new verdicts (OnPush, zoneless).
    this.changeDetector.markForCheck();
  }

  protected togglePasswordVisibility(): void {
    this.passwordVisible.update((visible) => !visible);
  }

  protected fieldMessage(field: SignInField): string | null {
    const errors = this.form.controls[field].errors;
    return (errors?.['schema'] as string | undefined) ?? (errors?.['server'] as string | undefined) ?? null;
  }

  private showProblem(error: ApiRequestError): void {
    const fallback = FALLBACK_SENTENCES[error.status];
    this.problem.set(error.fromServer || fallback === undefined ? error.message : fallback);
    for (const field of ['email', 'password'] as const) {
      const sentence = error.fields[field];
      if (sentence) {
        this.form.controls[field].setErrors({ server: sentence });
      }
    }
  }

  /** Only a path inside the app: a crafted link must not send someone to another site. */
  private destination(): string {
    const url = this.returnUrl();
    if (url && url.startsWith('/') && !url.startsWith('//') && !url.startsWith('/sign-in')) {
      return url;
    }
    return '/home';
  }
}
