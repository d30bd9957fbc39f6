import { Injectable, effect, inject, signal, untracked } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { SpeedCard } from '@shared/card';
import type { SessionUser } from '@shared/api/auth';
import { cardIssuePageSchema, cardIssueResponseSchema, type CardIssueView } from '@shared/card/card-api';
import { ApiClient } from '../core/api/api-client';
import { AuthService } from '../core/auth/auth-service';
import { DeviceStore, type CardLogRecord } from '../core/storage/device-store';
import { flushOutbox, type OutboxOutcome } from '../core/sync/device-sync';
import { SyncService, apiSyncTransport } from '../core/sync/sync-service';
import { CARD_PATHS } from './card-sources';

/** What became of a send: how many the server recorded, and a sentence when not all. */
export type SendOutcome = OutboxOutcome;

export interface CardLogFilter {
  readonly airframeId?: number;
  /** ISO 8601. */
  readonly from?: string;
  readonly to?: string;
}

export interface CardLogPage {
  readonly entries: CardIssueView[];
  readonly nextCursor: string | null;
}

const newestFirst = (a: CardLogRecord, b: CardLogRecord) => b.issuedAt.localeCompare(a.issuedAt);

/**
 * The card log: every card issued on this device is written to the device store first and then
 * reported with `POST /api/card-issues`; an entry the server has not recorded waits on the
 * device and goes with the next report.
 */
@Injectable({ providedIn: 'root' })
export class CardLog {
  private readonly api = inject(ApiClient);
  private readonly store = inject(DeviceStore);
  private readonly auth = inject(AuthService);
  private readonly transport = apiSyncTransport(this.api);
  private readonly deviceEntries = signal<readonly CardLogRecord[]>([]);

  /** This device's entries, newest first (after `refresh`). */
  readonly entries = this.deviceEntries.asReadonly();

  constructor() {
    // A sync sends waiting entries too: the list follows every sync.
    const sync = inject(SyncService);
    effect(() => {
      sync.dataVersion();
      untracked(() => void this.refresh());
    });
  }

  /** Re-reads the signed-in person's operator's entries on this device. */
  async refresh(): Promise<void> {
    const user = this.auth.user();
    const all = user ? await this.store.db.cardLog.toArray() : [];
    this.deviceEntries.set(all.filter((entry) => entry.operatorId === user?.operatorId || (entry.operatorId === undefined && entry.issuedById === user?.id)).sort(newestFirst));
  }

  /** Records `card` as issued by `user` on this device, then reports what waits (with the rest of a sync's outbox). */
  async issue(card: SpeedCard, user: SessionUser): Promise<{ entry: CardLogRecord; outcome: SendOutcome }> {
    const entry: CardLogRecord = {
      id: crypto.randomUUID(),
      airframeId: card.airframe.id,
      revisionId: card.revision.id,
      inputs: { ...card.inputs },
      digest: card.digest,
      issuedAt: new Date().toISOString(),
      sentAt: null,
      issuedById: user.id,
      operatorId: user.operatorId,
      registration: card.airframe.registration,
      revisionNumber: card.revision.number,
      refusal: null,
    };
    await this.store.db.cardLog.add(entry);
    await this.refresh();
    const outcome = await this.sendWaiting(user);
    const stored = (await this.store.db.cardLog.get(entry.id)) ?? entry;
    return { entry: stored, outcome };
  }

  /**
   * Reports `user`'s unsent entries (the server records the sender as the issuer, so another
   * person's waiting cards stay until they sign in here). Refused entries are not sent again
   * as they are. The work is `flushOutbox` (core/sync/device-sync.ts).
   */
  async sendWaiting(user: SessionUser): Promise<SendOutcome> {
    const outcome = await flushOutbox(this.store.db, this.transport, { userId: user.id, operatorId: user.operatorId });
    await this.refresh();
    return outcome;
  }

  /**
   * The card code of a device entry: as stored when this device's report was recorded, else
   * asked of the server (an entry another part of the app sent); null while the server has
   * not recorded the entry, or cannot be reached.
   */
  async codeOf(entryId: string): Promise<string | null> {
    const entry = await this.store.db.cardLog.get(entryId);
    if (!entry || entry.sentAt === null) return entry?.code ?? null;
    if (entry.code) return entry.code;
    try {
      const { entry: recorded } = await firstValueFrom(this.api.get(`${CARD_PATHS.cardIssues}/${entryId}`, cardIssueResponseSchema));
      await this.store.db.cardLog.update(entryId, { code: recorded.code });
      return recorded.code;
    } catch {
      return null;
    }
  }

  /** A page of the operator's card log (`GET /api/card-issues`), newest first. */
  operatorPage(filter: CardLogFilter, limit: number, cursor: string | null): Promise<CardLogPage> {
    const query = new URLSearchParams();
    if (filter.airframeId) query.set('airframeId', String(filter.airframeId));
    if (filter.from) query.set('from', filter.from);
    if (filter.to) query.set('to', filter.to);
    query.set('limit', String(limit));
    if (cursor) query.set('cursor', cursor);
    return firstValueFrom(this.api.get(`${CARD_PATHS.cardIssues}?${query}`, cardIssuePageSchema));
  }
}
