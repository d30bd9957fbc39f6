/**
 * The outbox: the person's card-log entries issued on this device and not yet recorded by the
 * server. `flushOutbox` sends them in batches of `MAX_CARD_ISSUES_PER_BATCH`, marks each from the
 * server's answer (recorded → `sentAt`, refused or conflict → `refusal` with the server's
 * sentence) and keeps every entry the server did not answer for. A failed request leaves the
 * outbox as it was. Idempotent by entry id on the server, so sending again after a lost answer
 * doubles nothing.
 */
import { MAX_CARD_ISSUES_PER_BATCH, type CardIssueEntry, type CardIssueResult } from '@shared/card/card-api';
import type { CardLogRecord, SpeedwrightDeviceDatabase } from '../storage/device-database';
import { describeFailure, type SyncPerson, type SyncTransport } from './sync-transport';

/** What became of a send: how many the server recorded, and a sentence when not all. */
export interface OutboxOutcome {
  readonly recorded: number;
  readonly waiting: number;
  readonly refused: number;
  /** Null when every waiting entry was recorded (or none waited). */
  readonly problem: string | null;
  /** True when a request failed (no answer, or an error answer): entries not answered wait. */
  readonly failed: boolean;
  /** Status of the failed request (0: no answer); null when none failed. */
  readonly failureStatus: number | null;
  /** The failed request's own sentence (why it failed); null when none failed. */
  readonly failureMessage: string | null;
}

const oldestFirst = (a: CardLogRecord, b: CardLogRecord) => a.issuedAt.localeCompare(b.issuedAt);

/** `issuedById`'s entries that wait to be sent (not sent, not refused), oldest first. */
export async function waitingEntries(db: SpeedwrightDeviceDatabase, issuedById: number): Promise<CardLogRecord[]> {
  const mine = await db.cardLog.where('issuedById').equals(issuedById).toArray();
  return mine.filter((entry) => entry.sentAt === null && entry.refusal === null).sort(oldestFirst);
}

/** Exactly the fields the server takes (its schema is strict). */
export function reportOf(entry: CardLogRecord): CardIssueEntry {
  return { id: entry.id, airframeId: entry.airframeId, revisionId: entry.revisionId, inputs: entry.inputs, digest: entry.digest, issuedAt: entry.issuedAt };
}

const cardsWord = (n: number) => (n === 1 ? 'card' : 'cards');

/**
 * Sends `who`'s waiting entries (the server records the sender as the issuer, so another
 * person's entries wait until they sign in here). Never throws for a failed request: the
 * outcome says so, and the entries wait.
 */
export async function flushOutbox(db: SpeedwrightDeviceDatabase, transport: SyncTransport, who: SyncPerson): Promise<OutboxOutcome> {
  const waiting = await waitingEntries(db, who.userId);
  let recorded = 0;
  const refusals: string[] = [];
  let failure: { status: number; message: string } | null = null;
  for (let start = 0; start < waiting.length; start += MAX_CARD_ISSUES_PER_BATCH) {
    const batch = waiting.slice(start, start + MAX_CARD_ISSUES_PER_BATCH);
    let results: CardIssueResult[];
    try {
      results = await transport.sendCardIssues(batch.map(reportOf));
    } catch (error) {
      failure = describeFailure(error);
      break;
    }
    const inBatch = new Set(batch.map((entry) => entry.id));
    await db.transaction('rw', db.cardLog, async () => {
      for (const result of results) {
        if (!inBatch.has(result.id)) continue;
        if (result.outcome === 'recorded') {
          await db.cardLog.update(result.id, { sentAt: result.receivedAt, code: result.code, operatorId: who.operatorId });
          recorded += 1;
        } else {
          await db.cardLog.update(result.id, { refusal: result.error.message, operatorId: who.operatorId });
          refusals.push(result.error.message);
        }
      }
    });
  }
  const stillWaiting = waiting.length - recorded - refusals.length;
  let problem: string | null = null;
  if (failure) {
    problem = `Not sent yet: ${failure.message} ${stillWaiting === 1 ? 'The card is' : `${stillWaiting} cards are`} kept on this device and will be sent with the next sync.`;
  } else if (refusals.length) {
    problem = `The server did not record ${refusals.length === 1 ? 'a card' : `${refusals.length} cards`}: ${refusals[0]}`;
  } else if (stillWaiting > 0) {
    problem = `${stillWaiting} ${cardsWord(stillWaiting)} are still waiting on this device.`;
  }
  return { recorded, waiting: stillWaiting, refused: refusals.length, problem, failed: failure !== null, failureStatus: failure?.status ?? null, failureMessage: failure?.message ?? null };
}
