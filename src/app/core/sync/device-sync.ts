/**
 * The device's side of sync, free of Angular so a Node test drives it with fake-indexeddb
 * against the real server. The Angular `SyncService` (sync-service.ts) only schedules these.
 *
 * Entry points:
 * - `runSync(db, transport, who, options)`: one whole sync — send the person's waiting card-log
 *   entries (`flushOutbox`), then fetch what changed since the stored cursor and apply it
 *   (`applySync`). Throws `SyncFailure` when the server cannot be reached or refuses; the
 *   outbox and the stored data are then as they were (entries the server answered for are
 *   marked, the rest wait).
 * - `flushOutbox(db, transport, who)`: sends `who`'s waiting entries in batches of
 *   `MAX_CARD_ISSUES_PER_BATCH`; marks each from the server's answer (recorded → `sentAt`,
 *   refused or conflict → `refusal` with the server's sentence) and keeps every entry the
 *   server did not answer for. A failed request leaves the outbox as it was. Idempotent by
 *   entry id on the server, so sending again after a lost answer doubles nothing.
 * - `applySync(db, operatorId, response, options)`: verifies each revision
 *   (revision-verification.ts), stores the operator, types, airframes and verified revisions
 *   in one transaction and moves the cursor; a refused revision is not stored, is reported in
 *   `refused`, and holds the cursor so the next sync asks for it again.
 * - `removeOperatorData(db, operatorId, issuerIds)`: what signing out does to the device.
 * - `dataCurrency`, `revisionNotices`, `waitingEntries`, `rememberSession`,
 *   `cachedSessionForOffline`, `nextRetryDelayMs`: the reads and small rules around them.
 *
 * A `SyncTransport` is the two HTTP calls; the app's uses ApiClient (sync-service.ts), Node
 * tests use test/api/device-sync-transport.ts (a supertest agent). A transport throws an error
 * with a numeric `status` (0: no answer) and a `message` sentence when a call fails.
 */
import type { SessionUser } from '../../../../shared/api/auth';
import type { SyncResponse } from '../../../../shared/api/sync';
import { MAX_CARD_ISSUES_PER_BATCH, type CardIssueEntry, type CardIssueResult } from '../../../../shared/card/card-api';
import type { CachedSessionRecord, CardLogRecord, RefusedRevision, RevisionRecord, SpeedwrightDeviceDatabase, SyncStateRecord } from '../storage/device-database';
import { importOperatorKey, verifyRevision } from './revision-verification';

export interface SyncTransport {
  /** `GET /api/sync?cursor=` (no cursor: everything). */
  fetchChanges(cursor: string | null): Promise<SyncResponse>;
  /** `POST /api/card-issues` with at most `MAX_CARD_ISSUES_PER_BATCH` entries; the server's results. */
  sendCardIssues(entries: CardIssueEntry[]): Promise<CardIssueResult[]>;
}

/** Whose sync it is: the signed-in person and their operator. */
export interface SyncPerson {
  readonly userId: number;
  readonly operatorId: number;
}

/** A sync that did not complete, with the sentence to show and the HTTP status (0: no answer). */
export class SyncFailure extends Error {
  constructor(
    message: string,
    readonly status: number,
    /** What the outbox step did before the failure (nothing when it failed itself). */
    readonly outbox: OutboxOutcome | null,
  ) {
    super(message);
    this.name = 'SyncFailure';
  }
}

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

export interface ApplyOutcome {
  readonly typesStored: number;
  readonly airframesStored: number;
  readonly revisionsStored: number;
  readonly refused: readonly RefusedRevision[];
  readonly cursor: string | null;
}

export interface SyncResult {
  readonly outbox: OutboxOutcome;
  readonly applied: ApplyOutcome;
  /** ISO 8601 UTC: the new "data as of". */
  readonly syncedAt: string;
}

export interface SyncOptions {
  /** The clock (tests pass their own). */
  readonly now?: () => Date;
  readonly subtle?: SubtleCrypto;
}

/** The status and sentence of whatever a transport threw. */
export function describeFailure(error: unknown): { status: number; message: string } {
  if (error && typeof error === 'object') {
    const { status, message } = error as { status?: unknown; message?: unknown };
    if (typeof status === 'number' && typeof message === 'string' && message) return { status, message };
    if (typeof message === 'string' && message) return { status: 0, message };
  }
  return { status: 0, message: "Speedwright cannot reach the server. Check the device's connection and try again." };
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

/**
 * Stores one `GET /api/sync` answer for `operatorId`. Every revision is verified first; one
 * that fails is not stored and comes back in `refused` (and in the sync state) with its
 * sentence. With any refusal the stored cursor stays where it was, so the next sync asks for
 * that revision again; everything that verified is stored either way.
 */
export async function applySync(db: SpeedwrightDeviceDatabase, operatorId: number, response: SyncResponse, options: SyncOptions = {}): Promise<ApplyOutcome> {
  if (response.operator.id !== operatorId) {
    throw new SyncFailure('The server answered with the data of another operator; nothing was stored. Sign out and sign in again.', 200, null);
  }
  const now = (options.now ?? (() => new Date()))().toISOString();
  const subtle = options.subtle ?? globalThis.crypto.subtle;
  const key = await importOperatorKey(response.operator.publicKey, subtle);
  const verified: RevisionRecord[] = [];
  const refused: RefusedRevision[] = [];
  for (const revision of response.revisions) {
    const check = await verifyRevision(revision, response.operator, key, subtle);
    if (check.ok) verified.push({ ...revision, operatorId, verifiedAt: now });
    else refused.push({ revisionId: revision.id, speedBookTitle: revision.speedBookTitle, number: revision.number, sentence: check.sentence });
  }
  let cursor: string | null = null;
  await db.transaction('rw', [db.operators, db.aircraftTypes, db.airframes, db.revisions, db.syncState], async () => {
    const previous = await db.syncState.get(operatorId);
    cursor = refused.length ? (previous?.cursor ?? null) : response.cursor;
    const { id, name, isDemo, publicKey, signingKeyId, currencyLimitDays } = response.operator;
    await db.operators.put({ id, name, isDemo, publicKey, signingKeyId, currencyLimitDays });
    if (response.aircraftTypes.length) await db.aircraftTypes.bulkPut(response.aircraftTypes.map((type) => ({ ...type, operatorId })));
    if (response.airframes.length) await db.airframes.bulkPut(response.airframes.map((airframe) => ({ ...airframe, operatorId })));
    if (verified.length) await db.revisions.bulkPut(verified);
    const state: SyncStateRecord = { operatorId, cursor, lastSyncedAt: now, lastAttemptAt: previous?.lastAttemptAt ?? now, lastProblem: null, refused };
    await db.syncState.put(state);
  });
  return { typesStored: response.aircraftTypes.length, airframesStored: response.airframes.length, revisionsStored: verified.length, refused, cursor };
}

/**
 * One whole sync for `who`: the outbox first (so the operator's card log is complete as soon as
 * possible), then the changes since the stored cursor. Throws `SyncFailure` (after noting the
 * sentence in the sync state) when either request fails; what the server answered before
 * that is kept.
 */
export async function runSync(db: SpeedwrightDeviceDatabase, transport: SyncTransport, who: SyncPerson, options: SyncOptions = {}): Promise<SyncResult> {
  const clock = options.now ?? (() => new Date());
  const startedAt = clock().toISOString();
  const before = await db.syncState.get(who.operatorId);
  await db.syncState.put({ operatorId: who.operatorId, cursor: before?.cursor ?? null, lastSyncedAt: before?.lastSyncedAt ?? null, lastAttemptAt: startedAt, lastProblem: before?.lastProblem ?? null, refused: before?.refused ?? [] });

  const fail = async (message: string, status: number, outbox: OutboxOutcome | null): Promise<never> => {
    await db.syncState.update(who.operatorId, { lastProblem: message });
    throw new SyncFailure(message, status, outbox);
  };

  const outbox = await flushOutbox(db, transport, who);
  if (outbox.failed) return fail(outbox.problem ?? 'The waiting cards could not be sent.', outbox.failureStatus ?? 0, outbox);

  let response: SyncResponse;
  try {
    response = await transport.fetchChanges(before?.cursor ?? null);
  } catch (error) {
    const { status, message } = describeFailure(error);
    return fail(message, status, outbox);
  }
  try {
    const applied = await applySync(db, who.operatorId, response, { ...options, now: clock });
    return { outbox, applied, syncedAt: (await db.syncState.get(who.operatorId))?.lastSyncedAt ?? startedAt };
  } catch (error) {
    if (error instanceof SyncFailure) return fail(error.message, error.status, outbox);
    return fail('This device could not store the synced data. Check the browser allows site storage, then sync again.', 0, outbox);
  }
}

// ---------------------------------------------------------------------------------------------
// Reads and rules around the store

export const DAY_MS = 24 * 60 * 60 * 1000;

export interface DataCurrency {
  /** ISO 8601 UTC of the last successful sync; null when the device has none. */
  readonly asOf: string | null;
  /** Whole days since then (rounded down). */
  readonly ageDays: number | null;
  readonly limitDays: number | null;
  /** Whether cards may be built from the device's data. */
  readonly current: boolean;
  /** Why not, in a sentence; null when current. */
  readonly refusal: string | null;
}

/** "2026-12-01 09:30 UTC". */
export function utcMinutes(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : `${date.toISOString().slice(0, 10)} ${date.toISOString().slice(11, 16)} UTC`;
}

/**
 * Whether the device's data is young enough for cards: the last successful sync must be at
 * most the operator's currency limit (days) old.
 */
export function dataCurrency(state: SyncStateRecord | undefined | null, limitDays: number | null | undefined, now: Date): DataCurrency {
  const asOf = state?.lastSyncedAt ?? null;
  if (asOf === null || limitDays === null || limitDays === undefined) {
    return { asOf, ageDays: null, limitDays: limitDays ?? null, current: false, refusal: 'This device holds no synced data of your operator yet. Sync once with a network connection to prepare cards.' };
  }
  const ageMs = now.getTime() - new Date(asOf).getTime();
  const ageDays = Math.max(0, Math.floor(ageMs / DAY_MS));
  if (ageMs > limitDays * DAY_MS) {
    const age = ageDays === 1 ? '1 day' : `${ageDays} days`;
    const limit = limitDays === 1 ? '1 day' : `${limitDays} days`;
    return {
      asOf,
      ageDays,
      limitDays,
      current: false,
      refusal: `No card can be prepared: the data on this device is from ${utcMinutes(asOf)}, ${age} old, and your operator allows cards from data at most ${limit} old. Sync with a network connection to prepare cards again.`,
    };
  }
  return { asOf, ageDays, limitDays, current: true, refusal: null };
}

export interface RevisionNotice {
  readonly entry: CardLogRecord;
  readonly revision: RevisionRecord;
  readonly status: 'superseded' | 'withdrawn';
  /** ISO 8601 UTC when it was superseded or withdrawn. */
  readonly since: string | null;
  /** The book's published revision now on the device, if any. */
  readonly current: RevisionRecord | null;
  readonly sentence: string;
}

/** `issuedById`'s cards on this device that rest on a revision now superseded or withdrawn, newest first. */
export async function revisionNotices(db: SpeedwrightDeviceDatabase, operatorId: number, issuedById: number): Promise<RevisionNotice[]> {
  const entries = await db.cardLog.where('issuedById').equals(issuedById).toArray();
  const revisions = await db.revisions.where('operatorId').equals(operatorId).toArray();
  const byId = new Map(revisions.map((revision) => [revision.id, revision]));
  const notices: RevisionNotice[] = [];
  for (const entry of entries.sort((a, b) => b.issuedAt.localeCompare(a.issuedAt))) {
    const revision = byId.get(entry.revisionId);
    if (!revision || revision.status === 'published') continue;
    const status = revision.status;
    const current = revisions.find((other) => other.speedBookId === revision.speedBookId && other.status === 'published') ?? null;
    const since = status === 'superseded' ? revision.supersededAt : revision.withdrawnAt;
    const when = since ? ` on ${utcMinutes(since)}` : '';
    const sentence =
      status === 'superseded'
        ? `Your card for ${entry.registration} (issued ${utcMinutes(entry.issuedAt)}) rests on revision ${revision.number} of ${revision.speedBookTitle}, superseded${when}${current ? ` by revision ${current.number}` : ''}. Prepare a new card before you use its figures.`
        : `Your card for ${entry.registration} (issued ${utcMinutes(entry.issuedAt)}) rests on revision ${revision.number} of ${revision.speedBookTitle}, withdrawn${when}. Do not use its figures${current ? `; prepare a new card from revision ${current.number}` : ''}.`;
    notices.push({ entry, revision, status, since, current, sentence });
  }
  return notices;
}

/** The delay before the `failures`-th retry: 15 s doubling to at most 15 min. */
export function nextRetryDelayMs(failures: number, baseMs = 15_000, maxMs = 15 * 60_000): number {
  if (failures <= 0) return 0;
  return Math.min(maxMs, baseMs * 2 ** Math.min(failures - 1, 30));
}

// ---------------------------------------------------------------------------------------------
// Cached session and sign-out

/** Keeps the person the server just confirmed, so the app opens offline after a reload. */
export async function rememberSession(db: SpeedwrightDeviceDatabase, user: SessionUser, now = new Date(), sessionExpiresAt?: string): Promise<void> {
  await db.sessions.put({ userId: user.id, operatorId: user.operatorId, user, confirmedAt: now.toISOString(), ...(sessionExpiresAt ? { sessionExpiresAt } : {}) });
}

/** Forgets one person's cached session (the server said they are not signed in). */
export async function forgetSession(db: SpeedwrightDeviceDatabase, userId: number): Promise<void> {
  await db.sessions.delete(userId);
}

/** Forgets every cached session (the server said nobody is signed in on this browser). */
export async function forgetAllSessions(db: SpeedwrightDeviceDatabase): Promise<void> {
  await db.sessions.clear();
}

/**
 * The person to open the app as when the server cannot be reached: the most recently confirmed
 * cached session whose operator's data is on this device (a completed sync). Null otherwise.
 *
 * A session past its absolute end (`sessionExpiresAt`, 12 hours after sign-in) still opens
 * offline, so the cards on the device keep working within the currency limit; the first answer
 * of the server then is a 401, which forgets it and asks for the password (`offlineSessionEnded`
 * lets the app say so meanwhile).
 */
export async function cachedSessionForOffline(db: SpeedwrightDeviceDatabase): Promise<SessionUser | null> {
  const sessions = (await db.sessions.toArray()).sort((a, b) => b.confirmedAt.localeCompare(a.confirmedAt));
  for (const session of sessions) {
    const state = await db.syncState.get(session.operatorId);
    if (state?.lastSyncedAt) return session.user;
  }
  return null;
}

/** Whether the cached sign-in's absolute lifetime has run out (sign in again when next online). */
export function offlineSessionEnded(record: Pick<CachedSessionRecord, 'sessionExpiresAt'> | undefined, now = new Date()): boolean {
  return record?.sessionExpiresAt !== undefined && Date.parse(record.sessionExpiresAt) <= now.getTime();
}

/**
 * Removes `operatorId`'s data from the device: its types, airframes, revisions, operator record,
 * sync state, cached sessions and card log (entries of that operator, and entries from before
 * version 2 of the store issued by one of `issuerIds` or by a person cached for that operator).
 */
export async function removeOperatorData(db: SpeedwrightDeviceDatabase, operatorId: number, issuerIds: readonly number[] = []): Promise<void> {
  await db.transaction('rw', [db.operators, db.aircraftTypes, db.airframes, db.revisions, db.syncState, db.sessions, db.cardLog], async () => {
    const people = new Set([...issuerIds, ...(await db.sessions.where('operatorId').equals(operatorId).primaryKeys())]);
    await db.aircraftTypes.where('operatorId').equals(operatorId).delete();
    await db.airframes.where('operatorId').equals(operatorId).delete();
    await db.revisions.where('operatorId').equals(operatorId).delete();
    await db.operators.delete(operatorId);
    await db.syncState.delete(operatorId);
    await db.sessions.where('operatorId').equals(operatorId).delete();
    await db.cardLog.filter((entry) => entry.operatorId === operatorId || (entry.operatorId === undefined && people.has(entry.issuedById))).delete();
  });
}
