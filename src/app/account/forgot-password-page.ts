import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { passwordResetRequestSchema } from '@shared/api/auth';
import { requestState } from '../core/api/request-state';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { AccountFrame } from './account-frame';
import { AccountLinks } from './account-links';
import { AccountSubmit } from './account-submit';

/** "Forgot your password?": asks the server to mail a link to choose a new one. */
@Component({
  selector: 'sw-forgot-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, AccountFrame, AccountSubmit],
  templateUrl: './forgot-password-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly links = inject(AccountLinks);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', zodValidator(passwordResetRequestSchema.shape.email)],
  });
  private readonly request = requestState();
  protected readonly pending = this.request.busy;
  protected readonly problem = this.request.problem;
  /** The server's answer once the request is taken. */
  protected readonly answer = signal<string | null>(null);
  protected readonly message = (path: string) => controlMessage(this.form, path);

  protected requestLink(): void {
    if (this.pending()) return;
    this.form.markAllAsTouched();
    const parsed = passwordResetRequestSchema.safeParse(this.form.getRawValue());
    if (this.form.invalid || !parsed.success) return;
    this.request.run(
      this.links.requestPasswordReset(parsed.data),
      (sentence) => this.answer.set(sentence),
      (error) => (showServerFieldErrors(this.form, error) ? error.message : null),
    );
  }
}
