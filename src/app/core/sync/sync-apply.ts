/**
 * Applying a sync: `applySync` verifies each revision (revision-verification.ts), stores the
 * operator, types, airframes and verified revisions in one transaction and moves the cursor; a
 * refused revision is not stored, is reported in `refused`, and holds the cursor so the next
 * sync asks for it again. `runSync` is one whole sync: the outbox, then the changes.
 */
import type { SyncResponse } from '@shared/api/sync';
import type { RefusedRevision, RevisionRecord, SigningKeyRecord, SpeedwrightDeviceDatabase, SyncStateRecord } from '../storage/device-database';
import { importOperatorKeys, verifyRevision } from './revision-verification';
import { flushOutbox, type OutboxOutcome } from './sync-outbox';
import { SyncFailure, describeFailure, type SyncPerson, type SyncTransport } from './sync-transport';

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
  const signingKeys = await operatorKeysAfter(db, operatorId, response);
  const keys = await importOperatorKeys(signingKeys, subtle);
  const verified: RevisionRecord[] = [];
  const refused: RefusedRevision[] = [];
  for (const revision of response.revisions) {
    const check = await verifyRevision(revision, response.operator, keys, subtle);
    if (check.ok) verified.push({ ...revision, operatorId, verifiedAt: now });
    else refused.push({ revisionId: revision.id, speedBookTitle: revision.speedBookTitle, number: revision.number, sentence: check.sentence });
  }
  let cursor: string | null = null;
  await db.transaction('rw', [db.operators, db.signingKeys, db.aircraftTypes, db.airframes, db.revisions, db.syncState], async () => {
    const previous = await db.syncState.get(operatorId);
    cursor = refused.length ? (previous?.cursor ?? null) : response.cursor;
    const { id, name, isDemo, publicKey, signingKeyId, currencyLimitDays, approachAdditivePolicy } = response.operator;
    await db.operators.put({ id, name, isDemo, publicKey, signingKeyId, currencyLimitDays, approachAdditivePolicy });
    await db.signingKeys.bulkPut(signingKeys);
    if (response.aircraftTypes.length) await db.aircraftTypes.bulkPut(response.aircraftTypes.map((type) => ({ ...type, operatorId })));
    if (response.airframes.length) await db.airframes.bulkPut(response.airframes.map((airframe) => ({ ...airframe, operatorId })));
    if (verified.length) await db.revisions.bulkPut(verified);
    const state: SyncStateRecord = { operatorId, cursor, lastSyncedAt: now, lastAttemptAt: previous?.lastAttemptAt ?? now, lastProblem: null, refused };
    await db.syncState.put(state);
  });
  return { typesStored: response.aircraftTypes.length, airframesStored: response.airframes.length, revisionsStored: verified.length, refused, cursor };
}

/**
 * The operator's public keys once this answer is applied: every key the answer lists (the
 * active one included), and the keys this device learned at earlier syncs that the answer
 * does not name — a device never forgets a key, so what it verified stays explained. A key
 * never changes on a device either: for a key id it already holds, only the retirement is
 * taken from the answer, never another public key, so revisions signed by a substituted key
 * under an old id are refused.
 */
async function operatorKeysAfter(db: SpeedwrightDeviceDatabase, operatorId: number, response: SyncResponse): Promise<SigningKeyRecord[]> {
  const byId = new Map<number, SigningKeyRecord>();
  for (const stored of await db.signingKeys.where('operatorId').equals(operatorId).toArray()) byId.set(stored.id, stored);
  const { signingKeyId, publicKey } = response.operator;
  const listed = response.operator.signingKeys.some((key) => key.id === signingKeyId) ? response.operator.signingKeys : [...response.operator.signingKeys, { id: signingKeyId, publicKey, retiredAt: null }];
  for (const key of listed) {
    const stored = byId.get(key.id);
    byId.set(key.id, stored ? { ...stored, retiredAt: key.retiredAt } : { ...key, operatorId });
  }
  return [...byId.values()];
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
