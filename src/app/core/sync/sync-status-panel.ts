import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ConnectionStatus } from '../connection/connection-status';
import { utcMinutes } from '../format/display-format';
import { SyncService } from './sync-service';

/**
 * The device's sync in a few lines: "data as of", what the sync is doing, its last problem,
 * revisions the device refused, and a button to sync now.
 */
@Component({
  selector: 'sw-sync-status',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <section class="sync" [class.compact]="compact()" aria-label="Data on this device" data-testid="sync-status" [attr.data-phase]="status().phase">
      <div class="line">
        <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
        <p class="as-of" data-testid="data-as-of">{{ asOfWords() }}</p>
        <button mat-stroked-button type="button" data-testid="sync-now" [disabled]="status().phase === 'syncing'" (click)="syncNow()">
          <mat-icon>sync</mat-icon>
          Sync now
        </button>
      </div>
      @if (status().phase === 'syncing') {
        <mat-progress-bar mode="indeterminate" aria-label="Syncing" />
        <p class="fine" role="status" data-testid="sync-phase">Syncing with the server…</p>
      } @else if (status().phase === 'failed' && !online()) {
        <p class="fine problem" role="status" data-testid="sync-phase">
          This device is offline, so it cannot sync now; cards use the data already on it. It syncs again when the connection returns.
        </p>
      } @else if (status().phase === 'failed') {
        <p class="fine problem" role="status" data-testid="sync-phase">
          Last sync did not complete: {{ status().problem }} {{ retryWords() }}
        </p>
      } @else if (status().summary) {
        <p class="fine" role="status" data-testid="sync-phase">{{ status().summary }}</p>
      }
      @if (currency(); as currency) {
        @if (currency.asOf && currency.limitDays) {
          <p class="fine">Your operator allows cards from data at most {{ currency.limitDays === 1 ? '1 day' : currency.limitDays + ' days' }} old.</p>
        }
      }
      @for (refused of refusedRevisions(); track refused.revisionId) {
        <p class="refused" role="alert" data-testid="refused-revision"><mat-icon aria-hidden="true">gpp_bad</mat-icon>{{ refused.sentence }}</p>
      }
    </section>
  `,
  styles: `
    .sync {
      display: grid;
      gap: 6px;
      padding: 12px 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    .line {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 12px;
    }
    .as-of {
      flex: 1 1 240px;
      margin: 0;
      font: var(--mat-sys-title-small);
    }
    p {
      margin: 0;
    }
    .fine {
      font: var(--mat-sys-body-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .problem,
    .refused {
      color: var(--sw-on-caution-container);
    }
    .refused {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      padding: 8px;
      border-radius: 8px;
      background: var(--sw-caution-container);
    }
    .compact {
      padding: 8px 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SyncStatusPanel {
  private readonly sync = inject(SyncService);
  protected readonly online = inject(ConnectionStatus).online;

  readonly compact = input(false);

  protected readonly status = this.sync.status;
  protected readonly currency = this.sync.currency;
  protected readonly refusedRevisions = computed(() => this.sync.snapshot()?.state?.refused ?? []);

  protected readonly asOfWords = computed(() => {
    const asOf = this.currency()?.asOf;
    if (!asOf) return this.status().phase === 'syncing' ? 'No data on this device yet: the first sync is running.' : 'No data on this device yet.';
    const age = this.currency()?.ageDays ?? 0;
    return `Data as of ${utcMinutes(asOf)}${age >= 1 ? ` (${age === 1 ? '1 day' : `${age} days`} ago)` : ''}`;
  });

  protected readonly icon = computed(() => {
    const phase = this.status().phase;
    if (phase === 'syncing') return 'sync';
    if (phase === 'failed' || !this.currency()?.current) return 'sync_problem';
    return 'cloud_done';
  });

  protected readonly retryWords = computed(() => {
    const retryAt = this.status().retryAt;
    return retryAt ? `It tries again at ${utcMinutes(retryAt).slice(11)}, or sync now.` : '';
  });

  protected syncNow(): void {
    this.sync.syncNow();
  }
}
