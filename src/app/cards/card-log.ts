import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { SpeedCard } from '../../../shared/card';
import {
  MAX_CARD_ISSUES_PER_BATCH,
  cardIssueBatchResponseSchema,
  cardIssuePageSchema,
  cardIssueResponseSchema,
  type CardIssueEntry,
  type CardIssueView,
} from '../../../shared/card/card-api';
import { ApiClient } from '../core/api/api-client';
import { ApiRequestError } from '../core/api/api-request-error';
import { DeviceStore, type CardLogRecord } from '../core/storage/device-store';
import { CARD_PATHS } from './card-sources';

/** What became of a send: how many the server recorded, and a sentence when not all. */
export interface SendOutcome {
  readonly recorded: number;
  readonly waiting: number;
  readonly refused: number;
  /** Null when every entry sent was recorded. */
  readonly problem: string | null;
}

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
  private readonly deviceEntries = signal<readonly CardLogRecord[]>([]);

  /** This device's entries, newest first (after `refresh`). */
  readonly entries = this.deviceEntries.asReadonly();

  async refresh(): Promise<void> {
    const all = await this.store.db.cardLog.toArray();
    this.deviceEntries.set(all.sort(newestFirst));
  }

  /** Records `card` as issued by `issuedById` on this device, then reports what waits. */
  async issue(card: SpeedCard, issuedById: number): Promise<{ entry: CardLogRecord; outcome: SendOutcome }> {
    const entry: CardLogRecord = {
      id: crypto.randomUUID(),
      airframeId: card.airframe.id,
      revisionId: card.revision.id,
      inputs: { ...card.inputs },
      digest: card.digest,
      issuedAt: new Date().toISOString(),
      sentAt: null,
      issuedById,
      registration: card.airframe.registration,
      revisionNumber: card.revision.number,
      refusal: null,
    };
    await this.store.db.cardLog.add(entry);
    await this.refresh();
    const outcome = await this.sendWaiting(issuedById);
    const stored = (await this.store.db.cardLog.get(entry.id)) ?? entry;
    return { entry: stored, outcome };
  }

  /**
   * Reports `issuedById`'s unsent entries (the server records the sender as the issuer, so
   * another person's waiting cards stay until they sign in here). Refused entries are not
   * sent again as they are.
   */
  async sendWaiting(issuedById: number): Promise<SendOutcome> {
    const waiting = (await this.store.db.cardLog.toArray())
      .filter((entry) => entry.sentAt === null && entry.refusal === null && entry.issuedById === issuedById)
      .sort((a, b) => a.issuedAt.localeCompare(b.issuedAt))
      .slice(0, MAX_CARD_ISSUES_PER_BATCH);
    if (waiting.length === 0) return { recorded: 0, waiting: 0, refused: 0, problem: null };

    let answer;
    try {
      answer = await firstValueFrom(this.api.post(CARD_PATHS.cardIssues, { entries: waiting.map(reportOf) }, cardIssueBatchResponseSchema));
    } catch (error) {
      const reason = ApiRequestError.from(error).message;
      const cards = waiting.length === 1 ? 'The card is' : `${waiting.length} cards are`;
      return { recorded: 0, waiting: waiting.length, refused: 0, problem: `Not sent yet: ${reason} ${cards} kept on this device and will be sent with the next card you issue, or with “Send waiting cards”.` };
    }

    let recorded = 0;
    const refusals: string[] = [];
    for (const result of answer.results) {
      if (result.outcome === 'recorded') {
        await this.store.db.cardLog.update(result.id, { sentAt: result.receivedAt, code: result.code });
        recorded += 1;
      } else {
        await this.store.db.cardLog.update(result.id, { refusal: result.error.message });
        refusals.push(result.error.message);
      }
    }
    await this.refresh();
    const stillWaiting = waiting.length - recorded - refusals.length;
    const problem = refusals.length
      ? `The server did not record ${refusals.length === 1 ? 'a card' : `${refusals.length} cards`}: ${refusals[0]}`
      : stillWaiting > 0
        ? `${stillWaiting} cards are still waiting on this device.`
        : null;
    return { recorded, waiting: stillWaiting, refused: refusals.length, problem };
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

/** Exactly the fields the server takes (its schema is strict). */
function reportOf(entry: CardLogRecord): CardIssueEntry {
  return {
    id: entry.id,
    airframeId: entry.airframeId,
    revisionId: entry.revisionId,
    inputs: entry.inputs,
    digest: entry.digest,
    issuedAt: entry.issuedAt,
  };
}
