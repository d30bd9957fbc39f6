import { utcDay } from '../core/format/display-format';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { forkJoin } from 'rxjs';
import { signingKeyResponseSchema } from '../../../shared/api/revisions';
import { CURRENCY_LIMIT_DAYS, operatorSettingsResponseSchema, operatorSettingsSchema } from '../../../shared/api/sync';
import { ApiClient } from '../core/api/api-client';
import { requestState } from '../core/api/request-state';
import { AuthService } from '../core/auth/auth-service';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { ProblemRetry } from '../core/feedback/problem-retry';
import type { ApproachAdditivePolicy } from '../../../shared/card/approach-policy';
import { ApproachPolicyPanel } from './approach-policy-panel';

export const OPERATOR_PATHS = { settings: '/api/operator/settings', signingKey: '/api/operator/signing-key' } as const;

interface KeyShown {
  readonly id: number;
  readonly publicKey: string;
  readonly created: string;
}

/**
 * The operator's own policies, for its administrators: how old a device's synced data may be
 * before it refuses cards, the approach additive for wind (approach-policy-panel.ts), and the
 * public half of the key revisions are signed with.
 */
@Component({
  selector: 'sw-operator-settings-page',
  imports: [ProblemRetry, ApproachPolicyPanel, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  template: `
    <div class="sw-page">
      <h1 class="sw-page-title">Operator settings</h1>
      <p class="lead">Policies of {{ operatorName() }} that every device of the operator follows.</p>

      @if (problem(); as problem) {
        <sw-problem-retry [problem]="problem" testId="settings-error" (retry)="load()" />
      } @else if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the settings" />
      } @else {
        <section class="panel" aria-labelledby="currency-heading">
          <h2 id="currency-heading"><mat-icon aria-hidden="true">update</mat-icon>Data currency on devices</h2>
          <p>
            A device refuses to build a speed card when its last successful sync is older than this limit, and says why, until it syncs
            again. Devices learn a new limit at their next sync.
          </p>
          <form [formGroup]="form" (submit)="$event.preventDefault(); save()" novalidate>
            <mat-form-field appearance="outline">
              <mat-label>Days a device may go without a sync</mat-label>
              <input matInput type="number" inputmode="numeric" formControlName="currencyLimitDays" data-testid="currency-limit" [min]="limits.min" [max]="limits.max" />
              <span matTextSuffix>days</span>
              <mat-hint>From {{ limits.min }} to {{ limits.max }}</mat-hint>
              @if (message('currencyLimitDays'); as sentence) {
                <mat-error>{{ sentence }}</mat-error>
              }
            </mat-form-field>
            <div class="actions">
              <button mat-flat-button type="submit" [disabled]="saving()" data-testid="save-settings"><mat-icon>save</mat-icon>Save</button>
              <p role="status" data-testid="settings-status">{{ status() }}</p>
            </div>
          </form>
        </section>

        @if (approachPolicy(); as policy) {
          <sw-approach-policy-panel [policy]="policy" />
        }

        @if (key(); as key) {
          <section class="panel" aria-labelledby="key-heading">
            <h2 id="key-heading"><mat-icon aria-hidden="true">key</mat-icon>Signing key</h2>
            <p>
              Every published revision is signed with the operator's key; a device checks each revision against this public key before it
              keeps it. The private half never leaves the server.
            </p>
            <dl>
              <dt>Key</dt>
              <dd>No. {{ key.id }}, Ed25519, made {{ key.created }}</dd>
              <dt>Public key</dt>
              <dd class="sw-mono key" data-testid="public-key">{{ key.publicKey }}</dd>
            </dl>
          </section>
        }
      }
    </div>
  `,
  styles: `
    .panel {
      max-width: 720px;
      margin: 16px 0 24px;
      padding: 16px 20px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    h2 {
      display: flex;
      gap: 8px;
      align-items: center;
      margin: 0 0 8px;
      font: var(--mat-sys-title-large);
    }
    mat-form-field {
      width: min(100%, 340px);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      align-items: center;
      margin-top: 8px;
    }
    .actions p {
      margin: 0;
    }
    dl {
      display: grid;
      grid-template-columns: max-content 1fr;
      gap: 4px 16px;
      margin: 0;
    }
    dt {
      font-weight: 500;
    }
    dd {
      margin: 0;
    }
    .key {
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OperatorSettingsPage {
  private readonly api = inject(ApiClient);
  private readonly auth = inject(AuthService);
  protected readonly operatorName = computed(() => this.auth.user()?.operatorName ?? 'your operator');

  protected readonly limits = CURRENCY_LIMIT_DAYS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    currencyLimitDays: [30, zodValidator(operatorSettingsSchema.shape.currencyLimitDays)],
  });
  protected readonly message = (path: string) => controlMessage(this.form, path);
  private readonly loadRequest = requestState();
  private readonly saveRequest = requestState();
  protected readonly loading = this.loadRequest.busy;
  protected readonly saving = this.saveRequest.busy;
  protected readonly problem = this.loadRequest.problem;
  protected readonly status = signal('');
  protected readonly key = signal<KeyShown | null>(null);
  protected readonly approachPolicy = signal<ApproachAdditivePolicy | null>(null);

  constructor() {
    this.load();
  }

  protected load(): void {
    const settingsAndKey = forkJoin({
      settings: this.api.get(OPERATOR_PATHS.settings, operatorSettingsResponseSchema),
      key: this.api.get(OPERATOR_PATHS.signingKey, signingKeyResponseSchema),
    });
    this.loadRequest.run(settingsAndKey, ({ settings, key }) => {
      this.form.setValue({ currencyLimitDays: settings.settings.currencyLimitDays });
      this.approachPolicy.set(settings.settings.approachAdditivePolicy);
      this.key.set({ id: key.signingKey.id, publicKey: key.signingKey.publicKey, created: utcDay(key.signingKey.createdAt) });
    });
  }

  protected save(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.saving()) return;
    const currencyLimitDays = Number(this.form.getRawValue().currencyLimitDays);
    this.status.set('');
    this.saveRequest.run(
      this.api.patch(OPERATOR_PATHS.settings, { currencyLimitDays }, operatorSettingsResponseSchema),
      ({ settings }) => {
        const days = settings.currencyLimitDays;
        this.status.set(`Saved. Devices refuse cards after ${days} ${days === 1 ? 'day' : 'days'} without a sync, from their next sync on.`);
      },
      // The refusal is said in the status line, beside the button.
      (error) => {
        if (showServerFieldErrors(this.form, error)) this.status.set(error.message);
        return null;
      },
    );
  }
}
