import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { finalize } from 'rxjs';
import { passwordResetRequestSchema } from '../../../shared/api/auth';
import { ApiRequestError } from '../core/api/api-request-error';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { AccountLinks } from './account-links';

/** "Forgot your password?": asks the server to mail a link to choose a new one. */
@Component({
  selector: 'sw-forgot-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './forgot-password-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly links = inject(AccountLinks);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', zodValidator(passwordResetRequestSchema.shape.email)],
  });
  protected readonly pending = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** The server's answer once the request is taken. */
  protected readonly answer = signal<string | null>(null);
  protected readonly message = (path: string) => controlMessage(this.form, path);

  protected requestLink(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    const parsed = passwordResetRequestSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !parsed.success) return;
    this.pending.set(true);
    this.problem.set(null);
    this.links
      .requestPasswordReset(parsed.data)
      .pipe(
        finalize(() => this.pending.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (sentence) => this.answer.set(sentence),
        error: (error: ApiRequestError) => {
          if (showServerFieldErrors(this.form, error)) this.problem.set(error.message);
        },
      });
  }
}
