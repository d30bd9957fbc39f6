import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { operatorSettingsResponseSchema } from '@shared/api/sync';
import {
  APPROACH_ADDITIVE_BOUNDS_KT,
  approachAdditivePolicySchema,
  approachPolicyStatement,
  roundAdditiveUpKt,
  unroundedAdditiveKt,
  windComponents,
  type ApproachAdditivePolicy,
} from '@shared/card';
import { ApiClient } from '../core/api/api-client';
import { ApiRequestError } from '../core/api/api-request-error';
import { requestState } from '../core/api/request-state';
import { controlMessage, showServerFieldErrors } from '../core/forms/server-field-errors';

const SETTINGS_PATH = '/api/operator/settings';
type PolicyField = keyof ApproachAdditivePolicy;
const FIELDS: readonly PolicyField[] = ['headwindFraction', 'gustFraction', 'minimumKt', 'maximumKt'];

/** The worked example the panel shows under the policy (runway 270°, wind 300° 20 kt gusting 30 kt). */
const EXAMPLE = { runwayHeadingDeg: 270, directionDeg: 300, speedKt: 20, gustKt: 30 } as const;

/**
 * The operator's approach additive policy, for its administrators (operator settings): what a
 * card adds to VREF for the day's wind. Saved with `PATCH /api/operator/settings`; devices use
 * it for cards made after their next sync, and a card keeps the policy it was made with.
 */
@Component({
  selector: 'sw-approach-policy-panel',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <section class="panel" aria-labelledby="approach-heading" data-testid="approach-policy-panel">
      <h2 id="approach-heading"><mat-icon aria-hidden="true">air</mat-icon>Approach additive for wind</h2>
      <p>
        When a pilot enters the wind at the aerodrome of landing, the card gives an approach speed: VREF plus an additive made of a
        share of the steady headwind component and a share of the gust increment (gust minus steady wind), held between a least and a
        most additive. A tailwind adds nothing below the least additive. Cards already made keep the policy they were made with.
      </p>
      <form [formGroup]="form" (submit)="$event.preventDefault(); savePolicy()" novalidate>
        <div class="fields">
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Share of the steady headwind</mat-label>
            <input matInput type="number" inputmode="decimal" step="0.05" min="0" max="1" formControlName="headwindFraction" data-testid="policy-headwindFraction" />
            <mat-hint>0 to 1; 0.5 is half</mat-hint>
            @if (message('headwindFraction'); as sentence) {
              <mat-error>{{ sentence }}</mat-error>
            }
          </mat-form-field>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Share of the gust increment</mat-label>
            <input matInput type="number" inputmode="decimal" step="0.05" min="0" max="1" formControlName="gustFraction" data-testid="policy-gustFraction" />
            <mat-hint>0 to 1; 1 is the whole</mat-hint>
            @if (message('gustFraction'); as sentence) {
              <mat-error>{{ sentence }}</mat-error>
            }
          </mat-form-field>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Least additive</mat-label>
            <input matInput type="number" inputmode="decimal" [min]="bounds.min" [max]="bounds.max" formControlName="minimumKt" data-testid="policy-minimumKt" />
            <span matTextSuffix>kt</span>
            <mat-hint>{{ bounds.min }} to {{ bounds.max }} kt</mat-hint>
            @if (message('minimumKt'); as sentence) {
              <mat-error>{{ sentence }}</mat-error>
            }
          </mat-form-field>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>Most additive</mat-label>
            <input matInput type="number" inputmode="decimal" [min]="bounds.min" [max]="bounds.max" formControlName="maximumKt" data-testid="policy-maximumKt" />
            <span matTextSuffix>kt</span>
            <mat-hint>At least the least additive</mat-hint>
            @if (message('maximumKt'); as sentence) {
              <mat-error>{{ sentence }}</mat-error>
            }
          </mat-form-field>
        </div>
        <p class="preview" data-testid="policy-preview">{{ preview() }}</p>
        <div class="actions">
          <button mat-flat-button type="submit" [disabled]="saving()" data-testid="save-approach-policy"><mat-icon>save</mat-icon>Save the policy</button>
          <p role="status" data-testid="approach-policy-status">{{ status() }}</p>
        </div>
      </form>
    </section>
  `,
  styleUrl: './settings-panel.scss',
  styles: `
    .fields {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(15rem, 1fr));
      gap: 12px 16px;
    }
    .preview {
      margin: 8px 0;
      padding: 8px 12px;
      border-left: 4px solid var(--mat-sys-outline);
      background: var(--mat-sys-surface-container);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      align-items: center;
    }
    .actions p {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApproachPolicyPanel {
  private readonly api = inject(ApiClient);
  /** The policy as the server last gave it. */
  readonly policy = input.required<ApproachAdditivePolicy>();

  protected readonly bounds = APPROACH_ADDITIVE_BOUNDS_KT;
  protected readonly form = inject(NonNullableFormBuilder).group({
    headwindFraction: [0.5 as number | string],
    gustFraction: [1 as number | string],
    minimumKt: [5 as number | string],
    maximumKt: [20 as number | string],
  });
  private readonly saveRequest = requestState();
  protected readonly saving = this.saveRequest.busy;
  protected readonly status = signal('');
  protected readonly message = (path: string) => controlMessage(this.form, path);
  private readonly typed = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });

  /** The typed policy in words, with the worked example; or what is wrong with it. */
  protected readonly preview = computed(() => {
    this.typed();
    const parsed = approachAdditivePolicySchema.safeParse(this.typedPolicy());
    if (!parsed.success) return `The policy cannot be used yet: ${parsed.error.issues[0].message[0].toLowerCase()}${parsed.error.issues[0].message.slice(1)}`;
    const policy = parsed.data;
    const { headwindKt } = windComponents(EXAMPLE.runwayHeadingDeg, EXAMPLE.directionDeg, EXAMPLE.speedKt);
    const additiveKt = roundAdditiveUpKt(unroundedAdditiveKt(policy, headwindKt, EXAMPLE.speedKt, EXAMPLE.gustKt));
    return `Cards will add ${approachPolicyStatement(policy)}. For example, runway 270°, wind 300° 20 kt gusting 30 kt (headwind 17.3 kt, gust increment 10 kt): VREF + ${additiveKt} kt.`;
  });

  constructor() {
    effect(() => this.form.setValue({ ...this.policy() }));
  }

  protected savePolicy(): void {
    this.status.set('');
    const parsed = approachAdditivePolicySchema.safeParse(this.typedPolicy());
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const control = this.form.get(String(issue.path[0] ?? 'maximumKt'));
        control?.setErrors({ schema: issue.message });
        control?.markAsTouched();
      }
      this.status.set('The policy was not saved: correct the marked figures.');
      return;
    }
    if (this.saving()) return;
    this.saveRequest.run(
      this.api.patch(SETTINGS_PATH, { approachAdditivePolicy: parsed.data }, operatorSettingsResponseSchema),
      ({ settings }) => {
        this.form.setValue({ ...settings.approachAdditivePolicy });
        this.status.set(`Saved: ${approachPolicyStatement(settings.approachAdditivePolicy)}. Devices use it for cards made after their next sync.`);
      },
      (error) => {
        const fields = Object.fromEntries(Object.entries(error.fields).map(([path, sentence]) => [path.replace(/^approachAdditivePolicy\./, ''), sentence]));
        if (showServerFieldErrors(this.form, new ApiRequestError(error.status, error.code, error.message, fields))) this.status.set(error.message);
        return null;
      },
    );
  }

  /** The four fields as numbers (an empty or unreadable field stays as typed, for the schema to name). */
  private typedPolicy(): Record<PolicyField, unknown> {
    const raw = this.form.getRawValue();
    const policy = {} as Record<PolicyField, unknown>;
    for (const field of FIELDS) {
      const value = raw[field];
      policy[field] = typeof value === 'number' ? value : value.trim() === '' ? undefined : Number(value);
    }
    return policy;
  }
}
