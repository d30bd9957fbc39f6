import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { formatCardCode } from '@shared/card-check/card-code';
import { encodeCheckPayload } from '@shared/card-check/check-url';
import type { CardInputs } from '@shared/card/card';
import { AuthService } from '../core/auth/auth-service';
import { SyncService } from '../core/sync/sync-service';
import type { CardLogRecord } from '../core/storage/device-store';
import { CardLog } from './card-log';
import { cardNumber } from './card-number-pipe';
import { utcDate } from './speed-card-view';

/** The cards issued on this device, sent or waiting, newest first. */
@Component({
  selector: 'sw-device-card-log',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  template: `
    <section class="device-log" aria-labelledby="device-log-title">
      <div class="heading">
        <h2 id="device-log-title">Card log on this device</h2>
        @if (waitingMine() > 0) {
          <button mat-stroked-button type="button" data-testid="send-waiting" [disabled]="sending()" (click)="sendWaiting()">
            <mat-icon>cloud_upload</mat-icon>
            Send waiting cards ({{ waitingMine() }})
          </button>
        }
      </div>
      @if (sendSentence(); as sentence) {
        <p class="sentence" role="status" data-testid="send-status">{{ sentence }}</p>
      }
      @if (entries().length === 0) {
        <p class="empty">No card has been issued on this device yet.</p>
      } @else {
        <ul data-testid="device-card-log">
          @for (entry of entries(); track entry.id) {
            <li [attr.data-entry-id]="entry.id" [attr.data-state]="stateOf(entry)" [attr.data-revision-status]="revisionStatus().get(entry.id) ?? 'published'">
              <mat-icon aria-hidden="true">{{ iconOf(entry) }}</mat-icon>
              <div>
                <p class="what">
                  <span class="sw-mono">{{ entry.registration }}</span> · revision {{ entry.revisionNumber }}@if (revisionStatus().get(entry.id); as status) {
                    <span class="old-data"> (now {{ status }})</span>
                  } · {{ weightOf(entry) }}
                </p>
                <p class="when">Issued {{ when(entry.issuedAt) }} · {{ stateWords(entry) }}</p>
                @if (entry.code) {
                  <p class="code">
                    Card code
                    <a class="sw-mono" [routerLink]="['/check', entry.code]" [queryParams]="{ c: payloadOf(entry) }" data-testid="device-card-code" title="Check this card and its figures">{{
                      printedCode(entry.code)
                    }}</a>
                  </p>
                }
                <p class="digest sw-mono">{{ entry.digest.slice(0, 16) }}…</p>
              </div>
            </li>
          }
        </ul>
      }
    </section>
  `,
  styles: `
    .device-log {
      margin-top: 24px;
    }
    .heading {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 16px;
      align-items: center;
      justify-content: space-between;
    }
    h2 {
      margin: 0;
      font: var(--mat-sys-title-large);
    }
    ul {
      list-style: none;
      margin: 8px 0 0;
      padding: 0;
      display: grid;
      gap: 8px;
    }
    li {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 8px 12px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
    }
    li[data-state='waiting'],
    li[data-state='refused'] {
      border-color: var(--mat-sys-outline);
      background: var(--sw-caution-container);
      color: var(--sw-on-caution-container);
    }
    p {
      margin: 0;
    }
    .what {
      font: var(--mat-sys-title-small);
    }
    .when,
    .code,
    .digest,
    .empty {
      font: var(--mat-sys-body-medium);
    }
    .sentence {
      margin: 8px 0 0;
    }
    .old-data {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeviceCardLog {
  private readonly cardLog = inject(CardLog);
  protected readonly printedCode = formatCardCode;

  /** The figures part of the card's check URL, as its QR code carries it (none if the entry cannot give one). */
  protected payloadOf(entry: CardLogRecord): string | null {
    try {
      return encodeCheckPayload({ revisionId: entry.revisionId, inputs: entry.inputs as unknown as CardInputs, digest: entry.digest });
    } catch {
      return null;
    }
  }
  private readonly user = inject(AuthService).user;
  private readonly notices = inject(SyncService).notices;
  /** Entry id → "superseded" or "withdrawn", for entries whose revision is no longer current. */
  protected readonly revisionStatus = computed(() => new Map(this.notices().map((notice) => [notice.entry.id, notice.status])));

  protected readonly entries = this.cardLog.entries;
  protected readonly sending = signal(false);
  protected readonly sendSentence = signal<string | null>(null);
  protected readonly waitingMine = computed(() => {
    const user = this.user();
    return this.entries().filter((entry) => entry.sentAt === null && entry.refusal === null && entry.issuedById === user?.id).length;
  });

  constructor() {
    void this.cardLog.refresh();
  }

  protected async sendWaiting(): Promise<void> {
    const user = this.user();
    if (!user) return;
    this.sending.set(true);
    const outcome = await this.cardLog.sendWaiting(user);
    this.sendSentence.set(outcome.problem ?? `${outcome.recorded === 1 ? 'The card was' : `${outcome.recorded} cards were`} recorded in the operator's card log.`);
    this.sending.set(false);
  }

  protected stateOf(entry: CardLogRecord): 'sent' | 'waiting' | 'refused' {
    return entry.sentAt !== null ? 'sent' : entry.refusal !== null ? 'refused' : 'waiting';
  }

  protected iconOf(entry: CardLogRecord): string {
    return { sent: 'cloud_done', waiting: 'schedule_send', refused: 'report' }[this.stateOf(entry)];
  }

  protected stateWords(entry: CardLogRecord): string {
    if (entry.sentAt !== null) return `recorded by the server ${utcDate(entry.sentAt)}`;
    if (entry.refusal !== null) return `not recorded by the server: ${entry.refusal}`;
    return entry.issuedById === this.user()?.id ? 'waiting to be sent' : 'waiting for the person who issued it to sign in here';
  }

  protected weightOf(entry: CardLogRecord): string {
    const weight = entry.inputs['weightKg'];
    return typeof weight === 'number' ? `${cardNumber(weight)} kg` : 'weight not recorded';
  }

  protected when(iso: string): string {
    return utcDate(iso);
  }
}
