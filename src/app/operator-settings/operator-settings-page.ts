import { utcDay } from '../core/format/display-format';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { filter, forkJoin } from 'rxjs';
import { signingKeyResponseSchema, type SigningKeyResponse } from '@shared/api/revisions';
import { CURRENCY_LIMIT_DAYS, operatorSettingsResponseSchema, operatorSettingsSchema } from '@shared/api/sync';
import { ApiClient } from '../core/api/api-client';
import { requestState } from '../core/api/request-state';
import { AuthService } from '../core/auth/auth-service';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { ProblemRetry } from '../core/feedback/problem-retry';
import { RotateKeyDialog, type RotateKeyData } from './rotate-key-dialog';
import type { ApproachAdditivePolicy } from '@shared/card/approach-policy';
import { ApproachPolicyPanel } from './approach-policy-panel';

export const OPERATOR_PATHS = {
  settings: '/api/operator/settings',
  signingKey: '/api/operator/signing-key',
  rotateSigningKey: '/api/operator/signing-key/rotate',
} as const;

interface KeyShown {
  readonly id: number;
  readonly publicKey: string;
  readonly created: string;
  /** The day a rotation retired it; null for the active key. */
  readonly retired: string | null;
}

function keysShown(answer: SigningKeyResponse): { active: KeyShown; all: KeyShown[] } {
  const shown = (key: SigningKeyResponse['signingKey']): KeyShown => ({
    id: key.id,
    publicKey: key.publicKey,
    created: utcDay(key.createdAt),
    retired: key.retiredAt === null ? null : utcDay(key.retiredAt),
  });
  return { active: shown(answer.signingKey), all: answer.signingKeys.map(shown) };
}

/**
 * The operator's own policies, for its administrators: how old a device's synced data may be
 * before it refuses cards, the approach additive for wind (approach-policy-panel.ts), and the
 * keys revisions are signed with — the active one, those a rotation retired (still verifying
 * what they signed), and the rotation itself.
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
              Every published revision is signed with the operator's active key; a device checks each revision against the key it names
              before it keeps it. Keys a rotation retired still verify the revisions they signed. The private halves never leave the server.
            </p>
            <dl>
              <dt>Active key</dt>
              <dd>No. {{ key.id }}, Ed25519, made {{ key.created }}: signs new publications</dd>
              <dt>Public key</dt>
              <dd class="sw-mono key" data-testid="public-key">{{ key.publicKey }}</dd>
            </dl>
            <div class="actions">
              <button mat-stroked-button type="button" (click)="rotateKey()" [disabled]="rotating()" data-testid="rotate-key">
                <mat-icon>refresh</mat-icon>{{ rotating() ? 'Rotating…' : 'Rotate the signing key…' }}
              </button>
              <p role="status" data-testid="key-status">{{ keyStatus() }}</p>
            </div>
            @if (rotateProblem(); as problem) {
              <p class="sw-problem" role="alert" data-testid="key-error"><mat-icon aria-hidden="true">error</mat-icon>{{ problem }}</p>
            }
            @if (retiredKeys().length) {
              <h3 id="retired-heading">Retired keys</h3>
              <p>They sign nothing new; devices and the card check keep them to verify what they signed.</p>
              <ul class="retired-keys" aria-labelledby="retired-heading" data-testid="retired-keys">
                @for (old of retiredKeys(); track old.id) {
                  <li>
                    <span class="retired-name"><mat-icon aria-hidden="true">history</mat-icon>No. {{ old.id }}, made {{ old.created }}, retired {{ old.retired }}</span>
                    <span class="sw-mono key">{{ old.publicKey }}</span>
                  </li>
                }
              </ul>
            }
          </section>
        }
      }
    </div>
  `,
  styleUrl: './settings-panel.scss',
  styles: `
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
    h3 {
      margin: 16px 0 4px;
      font: var(--mat-sys-title-medium);
    }
    .retired-keys {
      margin: 0;
      padding: 0;
      list-style: none;
    }
    .retired-keys li {
      display: flex;
      flex-direction: column;
      gap: 2px;
      padding: 6px 0;
      border-top: 1px solid var(--mat-sys-outline-variant);
    }
    .retired-name {
      display: flex;
      gap: 6px;
      align-items: center;
    }
    .sw-problem {
      display: flex;
      gap: 8px;
      align-items: center;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OperatorSettingsPage {
  private readonly api = inject(ApiClient);
  private readonly auth = inject(AuthService);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
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
  private readonly allKeys = signal<readonly KeyShown[]>([]);
  protected readonly retiredKeys = computed(() => this.allKeys().filter((one) => one.retired !== null));
  private readonly rotateRequest = requestState();
  protected readonly rotating = this.rotateRequest.busy;
  protected readonly rotateProblem = this.rotateRequest.problem;
  protected readonly keyStatus = signal('');
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
      this.showKeys(key);
    });
  }

  /** Asks first (what changes, what does not), then rotates; the page shows the new key and the retired one. */
  protected rotateKey(): void {
    const active = this.key();
    if (!active || this.rotating()) return;
    const data: RotateKeyData = { activeKeyId: active.id, operatorName: this.operatorName() };
    this.dialog
      .open<RotateKeyDialog, RotateKeyData, boolean>(RotateKeyDialog, { data, autoFocus: 'dialog', maxWidth: '600px' })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe(() => {
        this.keyStatus.set('');
        this.rotateRequest.run(this.api.post(OPERATOR_PATHS.rotateSigningKey, {}, signingKeyResponseSchema), (answer) => {
          this.showKeys(answer);
          this.keyStatus.set(
            `Key No. ${answer.signingKey.id} now signs new publications; key No. ${active.id} is retired and still verifies what it signed. Devices learn the new key at their next sync.`,
          );
        });
      });
  }

  private showKeys(answer: SigningKeyResponse): void {
    const { active, all } = keysShown(answer);
    this.key.set(active);
    this.allKeys.set(all);
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
