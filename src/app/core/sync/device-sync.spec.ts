import 'fake-indexeddb/auto';
import Dexie from 'dexie';
import { TestScheduler } from 'rxjs/testing';
import { Subject, of, throwError } from 'rxjs';
import type { SessionUser } from '@shared/api/auth';
import type { SyncResponse, SyncRevision } from '@shared/api/sync';
import type { CardIssueEntry, CardIssueResult } from '@shared/card/card-api';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoPistonTrainerContent, demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { SpeedwrightDeviceDatabase, type CardLogRecord } from '../storage/device-database';
import {
  DAY_MS,
  SyncFailure,
  applySync,
  cachedSessionForOffline,
  dataCurrency,
  flushOutbox,
  nextRetryDelayMs,
  offlineSessionEnded,
  rememberSession,
  removeOperatorData,
  revisionNotices,
  runSync,
  waitingEntries,
  type SyncTransport,
} from './device-sync';
import { importOperatorKey, importOperatorKeys, verifyRevision } from './revision-verification';
import { syncLoop, type SyncLoopEvent } from './sync-loop';

/**
 * The device's sync core against fake-indexeddb and a fake server. Signatures are real
 * Ed25519 (RFC 8032) made with WebCrypto, over the statement of shared/speed-book/signature.ts.
 */
const subtle = globalThis.crypto.subtle;
const OPERATOR_ID = 1;
const PILOT: SessionUser = { id: 3, email: 'pilot@demo.example', displayName: 'Ines Marlow', role: 'pilot', operatorId: OPERATOR_ID, operatorName: 'Kestrel Fen Aviation (demo)', operatorIsDemo: true };
const stamp = '2026-11-01T00:00:00.000Z';

function base64(bytes: ArrayBuffer | Uint8Array): string {
  return btoa(String.fromCharCode(...new Uint8Array(bytes)));
}

interface Signer {
  publicKey: string;
  keyId: number;
  sign(revision: Omit<SyncRevision, 'signature' | 'contentSha256' | 'signingKeyId'>): Promise<SyncRevision>;
}

async function newSigner(signingKeyId = 9): Promise<Signer> {
  const pair = (await subtle.generateKey({ name: 'Ed25519' }, true, ['sign', 'verify'])) as CryptoKeyPair;
  const publicKey = base64(await subtle.exportKey('raw', pair.publicKey));
  return {
    publicKey,
    keyId: signingKeyId,
    async sign(revision) {
      const hash = contentSha256(revision.content);
      const statement = signedRevisionStatement({ operatorId: OPERATOR_ID, speedBookId: revision.speedBookId, revisionId: revision.id, number: revision.number, contentSha256: hash, publishedAt: revision.publishedAt });
      const signature = base64(await subtle.sign({ name: 'Ed25519' }, pair.privateKey, new TextEncoder().encode(statement)));
      return { ...revision, contentSha256: hash, signature, signingKeyId };
    },
  };
}

const revisionFields = (id: number, number: number, status: SyncRevision['status'], content: object) => ({
  id,
  speedBookId: 4,
  speedBookTitle: 'Sedgeling 4 speed book',
  aircraftTypeId: 1,
  number,
  status,
  publishedAt: `2026-11-${String(number).padStart(2, '0')}T08:00:00.000Z`,
  supersededAt: status === 'superseded' ? '2026-12-01T09:00:00.000Z' : null,
  withdrawnAt: status === 'withdrawn' ? '2026-12-01T09:00:00.000Z' : null,
  content: content as Record<string, unknown>,
});

/** The server's answer with `signer` as the active key and `retired` as keys a rotation retired. */
function response(signer: Signer, cursor: string, revisions: SyncRevision[], extra: Partial<SyncResponse> = {}, retired: Signer[] = []): SyncResponse {
  const signingKeys = [
    { id: signer.keyId, publicKey: signer.publicKey, createdAt: stamp, retiredAt: null },
    ...retired.map((old) => ({ id: old.keyId, publicKey: old.publicKey, createdAt: stamp, retiredAt: '2026-11-20T10:00:00.000Z' })),
  ];
  return {
    cursor,
    operator: { id: OPERATOR_ID, name: 'Kestrel Fen Aviation (demo)', isDemo: true, publicKey: signer.publicKey, signingKeyId: signer.keyId, signingKeys, currencyLimitDays: 30, approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 } },
    aircraftTypes: [{ id: 1, designator: 'ZZP1', name: 'Sedgeling 4', category: 'piston-single', engines: 1, ceilingFt: 14000, createdAt: stamp, updatedAt: stamp }],
    airframes: [{ id: 7, registration: 'ZZ-KFA', serial: 'SG4-0012', aircraftTypeId: 1, active: true, createdAt: stamp, updatedAt: stamp }],
    revisions,
    ...extra,
  };
}

function entry(id: string, overrides: Partial<CardLogRecord> = {}): CardLogRecord {
  return {
    id,
    airframeId: 7,
    revisionId: 21,
    inputs: { weightKg: 1000 },
    digest: 'a'.repeat(64),
    issuedAt: `2026-12-01T10:00:0${id.slice(-1)}.000Z`,
    sentAt: null,
    issuedById: PILOT.id,
    operatorId: OPERATOR_ID,
    registration: 'ZZ-KFA',
    revisionNumber: 1,
    refusal: null,
    ...overrides,
  };
}

const uuid = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;

/**
 * A fake server: answers sync calls from a queue, and keeps a card log idempotent by entry id
 * the way POST /api/card-issues is specified (a replay answers as the first report did).
 */
class FakeServer implements SyncTransport {
  readonly cursorsAsked: (string | null)[] = [];
  readonly recorded = new Map<string, CardIssueEntry>();
  readonly posts: CardIssueEntry[][] = [];
  answers: SyncResponse[] = [];
  /** Fail the next n card posts before recording anything. */
  failPosts = 0;
  /** Record the next n posts, then lose the answer (as a connection dropping after the commit). */
  loseAnswers = 0;
  failSync = 0;
  refuse = new Map<string, string>();

  async fetchChanges(cursor: string | null): Promise<SyncResponse> {
    this.cursorsAsked.push(cursor);
    if (this.failSync > 0) {
      this.failSync -= 1;
      throw Object.assign(new Error("Speedwright cannot reach the server. Check the device's connection and try again."), { status: 0 });
    }
    const next = this.answers.shift();
    if (!next) throw new Error('The fake server has no answer queued.');
    return next;
  }

  async sendCardIssues(entries: CardIssueEntry[]): Promise<CardIssueResult[]> {
    this.posts.push(entries);
    if (this.failPosts > 0) {
      this.failPosts -= 1;
      throw Object.assign(new Error('The server had a problem answering.'), { status: 500 });
    }
    const results: CardIssueResult[] = entries.map((e) => {
      const refusal = this.refuse.get(e.id);
      if (refusal) return { id: e.id, outcome: 'refused', status: 422, error: { code: 'digest_mismatch', message: refusal } };
      if (!this.recorded.has(e.id)) this.recorded.set(e.id, e);
      return { id: e.id, outcome: 'recorded', status: 201, code: `K7M4RTX9${e.id.slice(-1)}`, digest: e.digest, receivedAt: '2026-12-01T12:00:00.000Z' };
    });
    if (this.loseAnswers > 0) {
      this.loseAnswers -= 1;
      throw Object.assign(new Error('The server did not answer in time.'), { status: 0 });
    }
    return results;
  }
}

let db: SpeedwrightDeviceDatabase;
beforeEach(() => {
  db = new SpeedwrightDeviceDatabase(`speedwright-sync-test-${Math.random()}`);
});
afterEach(async () => {
  db.close();
  await db.delete();
});

describe('device store', () => {
  it('upgrades a version-1 store in place, keeping every card-log entry', async () => {
    const name = `speedwright-upgrade-${Math.random()}`;
    const old = new Dexie(name);
    old.version(1).stores({ cardLog: 'id, issuedAt' });
    const legacy = entry(uuid(1)) as Partial<CardLogRecord>;
    delete legacy.operatorId;
    await old.table('cardLog').add(legacy);
    old.close();

    const upgraded = new SpeedwrightDeviceDatabase(name);
    expect(await upgraded.cardLog.toArray()).toEqual([legacy]);
    expect(upgraded.verno).toBe(4);
    // The new indexes and tables work on the upgraded store.
    expect(await upgraded.cardLog.where('issuedById').equals(PILOT.id).count()).toBe(1);
    await upgraded.syncState.put({ operatorId: 1, cursor: 'c', lastSyncedAt: null, lastAttemptAt: null, lastProblem: null, refused: [] });
    expect(await upgraded.syncState.get(1)).toMatchObject({ cursor: 'c' });
    upgraded.close();
    await upgraded.delete();
  });

  it('upgrades a version-2 store to 4: an operator stored before has no approach policy until the next sync', async () => {
    const name = `speedwright-upgrade-${Math.random()}`;
    const old = new Dexie(name);
    old.version(1).stores({ cardLog: 'id, issuedAt' });
    old.version(2).stores({ cardLog: 'id, issuedAt, issuedById, operatorId', operators: 'id', aircraftTypes: 'id, operatorId', airframes: 'id, operatorId', revisions: 'id, operatorId, speedBookId, aircraftTypeId', syncState: 'operatorId', sessions: 'userId, operatorId', preferences: 'key' });
    const stored = { id: 1, name: 'Kestrel Fen Aviation (demo)', isDemo: true, publicKey: 'a2V5', signingKeyId: 9, currencyLimitDays: 30 };
    await old.table('operators').add(stored);
    old.close();

    const upgraded = new SpeedwrightDeviceDatabase(name);
    expect(await upgraded.operators.get(1)).toEqual({ ...stored, approachAdditivePolicy: null });
    expect(upgraded.verno).toBe(4);
    upgraded.close();
    await upgraded.delete();
  });
});

describe('device store version 3 (signing keys)', () => {
  it('upgrades a version-2 store in place: synced data and card log kept, the operator’s one key carried into the key table', async () => {
    const name = `speedwright-upgrade-v2-${Math.random()}`;
    const signer = await newSigner(9);
    const revision = { ...(await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()))), operatorId: OPERATOR_ID, verifiedAt: stamp };
    const old = new Dexie(name);
    old.version(1).stores({ cardLog: 'id, issuedAt' });
    old.version(2).stores({
      cardLog: 'id, issuedAt, issuedById, operatorId',
      operators: 'id',
      aircraftTypes: 'id, operatorId',
      airframes: 'id, operatorId',
      revisions: 'id, operatorId, speedBookId, aircraftTypeId',
      syncState: 'operatorId',
      sessions: 'userId, operatorId',
      preferences: 'key',
    });
    await old.table('operators').put({ id: OPERATOR_ID, name: 'Kestrel Fen Aviation (demo)', isDemo: true, publicKey: signer.publicKey, signingKeyId: 9, currencyLimitDays: 30 });
    await old.table('revisions').put(revision);
    await old.table('cardLog').put(entry(uuid(1)));
    await old.table('syncState').put({ operatorId: OPERATOR_ID, cursor: 'c7', lastSyncedAt: stamp, lastAttemptAt: stamp, lastProblem: null, refused: [] });
    old.close();

    const upgraded = new SpeedwrightDeviceDatabase(name);
    // Through version 3 (the key table) to the current 4 (the approach policy).
    expect(upgraded.verno).toBe(4);
    expect(await upgraded.revisions.get(21)).toEqual(revision);
    expect(await upgraded.cardLog.get(uuid(1))).toEqual(entry(uuid(1)));
    expect(await upgraded.syncState.get(OPERATOR_ID)).toMatchObject({ cursor: 'c7' });
    expect(await upgraded.signingKeys.toArray()).toEqual([{ id: 9, operatorId: OPERATOR_ID, publicKey: signer.publicKey, retiredAt: null }]);

    // The next sync after a rotation names only the new key list; the carried key still verifies revision 1.
    const active = await newSigner(12);
    const answer = response(active, 'c8', [await signer.sign(revisionFields(21, 1, 'superseded', demoPistonTrainerContent()))]);
    expect(await applySync(upgraded, OPERATOR_ID, answer)).toMatchObject({ revisionsStored: 1, refused: [] });
    upgraded.close();
    await upgraded.delete();
  });
});

describe('revision verification (Ed25519 over signedRevisionStatement, WebCrypto)', () => {
  const operator = { id: OPERATOR_ID };
  const keysOf = (...signers: Signer[]) => importOperatorKeys(signers.map((signer) => ({ id: signer.keyId, publicKey: signer.publicKey })));

  it('accepts a revision signed by the operator’s key', async () => {
    const signer = await newSigner();
    const revision = await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()));
    expect(await verifyRevision(revision, operator, await keysOf(signer))).toEqual({ ok: true });
  });

  it('refuses tampered content, a changed signed field, and a signature by another key, each with a sentence', async () => {
    const signer = await newSigner();
    const keys = await keysOf(signer);
    const good = await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()));

    // Content changed after signing, hash left as published.
    const tampered = { ...good, content: { ...good.content, notes: 'changed' } };
    const contentCheck = await verifyRevision(tampered, operator, keys);
    expect(contentCheck).toEqual({ ok: false, sentence: expect.stringContaining('does not match the hash') });
    expect(contentCheck.ok === false && contentCheck.sentence).toMatch(/^Revision 1 of Sedgeling 4 speed book was not stored on this device/);

    // Content and hash changed together: the signature no longer covers them.
    const rehashed = { ...tampered, contentSha256: contentSha256(tampered.content) };
    expect(await verifyRevision(rehashed, operator, keys)).toEqual({ ok: false, sentence: expect.stringContaining('signature does not verify') });

    // A signed field changed (the revision number).
    expect((await verifyRevision({ ...good, number: 2 }, operator, keys)).ok).toBe(false);

    // Signed by a different key than the operator's, under the operator's key id.
    const stranger = await newSigner();
    const foreign = await stranger.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()));
    expect(await verifyRevision(foreign, operator, keys)).toEqual({ ok: false, sentence: expect.stringContaining('signature does not verify') });

    // A key that is not Ed25519 raw bytes.
    expect(await importOperatorKey(btoa('short'))).toBeNull();
    const broken = await importOperatorKeys([{ id: 9, publicKey: btoa('short') }]);
    expect(await verifyRevision(good, operator, broken)).toEqual({ ok: false, sentence: expect.stringContaining('not a valid Ed25519 key') });
  });

  it('verifies each revision with the key its signingKeyId names, retired or active, and refuses a key id the operator never published', async () => {
    const retired = await newSigner(9);
    const active = await newSigner(12);
    const keys = await keysOf(active, retired);
    const before = await retired.sign(revisionFields(21, 1, 'superseded', demoPistonTrainerContent()));
    const after = await active.sign(revisionFields(22, 2, 'published', demoPistonTrainerContentRevised()));
    expect(await verifyRevision(before, operator, keys)).toEqual({ ok: true });
    expect(await verifyRevision(after, operator, keys)).toEqual({ ok: true });

    // The old revision claimed for the new key (or the reverse) does not verify.
    expect(await verifyRevision({ ...before, signingKeyId: 12 }, operator, keys)).toEqual({ ok: false, sentence: expect.stringContaining('public key No. 12') });

    // Signed by a key the operator never published: refused before any signature work.
    const unknown = await (await newSigner(77)).sign(revisionFields(23, 3, 'published', demoPistonTrainerContent()));
    expect(await verifyRevision(unknown, operator, keys)).toEqual({ ok: false, sentence: expect.stringContaining('signing key No. 77, which your operator never published') });
  });
});

describe('applySync', () => {
  it('stores what verifies, refuses what does not and holds the cursor for it', async () => {
    const signer = await newSigner();
    const good = await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()));
    const bad = { ...(await signer.sign(revisionFields(22, 2, 'published', demoPistonTrainerContentRevised()))), signature: good.signature };

    const first = await applySync(db, OPERATOR_ID, response(signer, 'c1', [good]), { now: () => new Date('2026-12-01T11:00:00.000Z') });
    expect(first).toMatchObject({ revisionsStored: 1, refused: [], cursor: 'c1' });
    expect(await db.revisions.get(21)).toMatchObject({ operatorId: OPERATOR_ID, contentSha256: good.contentSha256, signature: good.signature });
    expect(await db.operators.get(OPERATOR_ID)).toMatchObject({
      publicKey: signer.publicKey,
      currencyLimitDays: 30,
      approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 },
    });
    expect(await db.syncState.get(OPERATOR_ID)).toMatchObject({ cursor: 'c1', lastSyncedAt: '2026-12-01T11:00:00.000Z', refused: [] });

    const second = await applySync(db, OPERATOR_ID, response(signer, 'c2', [bad]));
    expect(second.revisionsStored).toBe(0);
    expect(second.refused).toEqual([{ revisionId: 22, speedBookTitle: 'Sedgeling 4 speed book', number: 2, sentence: expect.stringContaining('Revision 2 of Sedgeling 4 speed book was not stored') }]);
    expect(await db.revisions.get(22)).toBeUndefined();
    // The cursor stays, so the next sync asks for the refused revision again.
    expect(await db.syncState.get(OPERATOR_ID)).toMatchObject({ cursor: 'c1', refused: second.refused });
  });

  it('after a rotation stores both keys, keeps the revision of the retired key and takes the new key’s revision', async () => {
    const retired = await newSigner(9);
    const first = await retired.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()));
    await applySync(db, OPERATOR_ID, response(retired, 'c1', [first]));

    // The operator rotated: key 12 is active, key 9 retired; revision 2 is signed with key 12.
    const active = await newSigner(12);
    const second = await active.sign(revisionFields(22, 2, 'published', demoPistonTrainerContentRevised()));
    const supersededFirst = await retired.sign(revisionFields(21, 1, 'superseded', demoPistonTrainerContent()));
    const outcome = await applySync(db, OPERATOR_ID, response(active, 'c2', [supersededFirst, second], {}, [retired]));
    expect(outcome).toMatchObject({ revisionsStored: 2, refused: [], cursor: 'c2' });
    expect((await db.signingKeys.where('operatorId').equals(OPERATOR_ID).sortBy('id')).map((key) => [key.id, key.retiredAt])).toEqual([
      [9, '2026-11-20T10:00:00.000Z'],
      [12, null],
    ]);
    expect(await db.operators.get(OPERATOR_ID)).toMatchObject({ signingKeyId: 12, publicKey: active.publicKey });
    expect((await db.revisions.get(21))!.signingKeyId).toBe(9);
    expect((await db.revisions.get(22))!.signingKeyId).toBe(12);
  });

  it('refuses a revision whose signingKeyId the operator never published, holding the cursor', async () => {
    const signer = await newSigner(9);
    const outsider = await newSigner(40);
    const unknown = await outsider.sign(revisionFields(23, 3, 'published', demoPistonTrainerContent()));
    await applySync(db, OPERATOR_ID, response(signer, 'c1', []));
    const outcome = await applySync(db, OPERATOR_ID, response(signer, 'c2', [unknown]));
    expect(outcome.refused).toEqual([{ revisionId: 23, speedBookTitle: 'Sedgeling 4 speed book', number: 3, sentence: expect.stringContaining('signing key No. 40, which your operator never published') }]);
    expect(await db.revisions.get(23)).toBeUndefined();
    expect(await db.syncState.get(OPERATOR_ID)).toMatchObject({ cursor: 'c1' });
  });

  it('never lets a later answer change the public key of a key id it holds: a revision signed by a substitute is refused', async () => {
    const genuine = await newSigner(9);
    await applySync(db, OPERATOR_ID, response(genuine, 'c1', [await genuine.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()))]));
    // An answer claiming another public key for key No. 9, with a revision signed by it.
    const substitute = await newSigner(9);
    const forged = await substitute.sign(revisionFields(22, 2, 'published', demoPistonTrainerContentRevised()));
    const outcome = await applySync(db, OPERATOR_ID, response(substitute, 'c2', [forged]));
    expect(outcome.refused).toEqual([expect.objectContaining({ revisionId: 22, sentence: expect.stringContaining('signature does not verify with the operator’s public key No. 9') })]);
    expect((await db.signingKeys.get(9))!.publicKey).toBe(genuine.publicKey);
    expect(await db.revisions.get(22)).toBeUndefined();
  });

  it('refuses an answer about another operator and stores nothing', async () => {
    const signer = await newSigner();
    const other = response(signer, 'c1', []);
    await expect(applySync(db, 2, other)).rejects.toBeInstanceOf(SyncFailure);
    expect(await db.operators.count()).toBe(0);
  });
});

describe('runSync and flushOutbox', () => {
  const who = { userId: PILOT.id, operatorId: OPERATOR_ID };

  it('carries the cursor from one sync to the next', async () => {
    const signer = await newSigner();
    const server = new FakeServer();
    server.answers = [response(signer, 'c1', [await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()))]), response(signer, 'c1', [], { aircraftTypes: [], airframes: [] })];
    await runSync(db, server, who);
    await runSync(db, server, who);
    expect(server.cursorsAsked).toEqual([null, 'c1']);
  });

  it('keeps the outbox when the server cannot take it, and sends it with the next sync', async () => {
    const signer = await newSigner();
    const server = new FakeServer();
    await db.cardLog.bulkAdd([entry(uuid(1)), entry(uuid(2))]);
    server.failPosts = 1;
    server.answers = [response(signer, 'c1', [])];

    const failed = await runSync(db, server, who).catch((error: unknown) => error);
    expect(failed).toBeInstanceOf(SyncFailure);
    expect((failed as SyncFailure).message).toContain('2 cards are kept on this device');
    expect((await waitingEntries(db, PILOT.id)).map((e) => e.id)).toEqual([uuid(1), uuid(2)]);
    expect(await db.syncState.get(OPERATOR_ID)).toMatchObject({ lastSyncedAt: null, lastProblem: expect.stringContaining('Not sent yet') });
    // The sync stopped before asking for changes.
    expect(server.cursorsAsked).toEqual([]);

    const result = await runSync(db, server, who);
    expect(result.outbox).toMatchObject({ recorded: 2, waiting: 0, failed: false });
    expect(await waitingEntries(db, PILOT.id)).toEqual([]);
    expect((await db.cardLog.get(uuid(1)))!.sentAt).toBe('2026-12-01T12:00:00.000Z');
    // The card code the server drew is kept on the device, for the card list and a reprint.
    expect((await db.cardLog.get(uuid(1)))!.code).toBe(`K7M4RTX9${uuid(1).slice(-1)}`);
  });

  it('resends after a lost answer without doubling, keeps refusals with the server’s sentence, and leaves other people’s entries', async () => {
    const server = new FakeServer();
    await db.cardLog.bulkAdd([entry(uuid(1)), entry(uuid(2)), entry(uuid(3), { issuedById: 99 })]);
    server.loseAnswers = 1;
    server.refuse.set(uuid(2), 'The card re-derived on the server has another digest.');

    const lost = await flushOutbox(db, server, who);
    expect(lost).toMatchObject({ recorded: 0, waiting: 2, failed: true });
    expect(server.recorded.size).toBe(1);

    const again = await flushOutbox(db, server, who);
    expect(again).toMatchObject({ recorded: 1, refused: 1, waiting: 0, failed: false, problem: 'The server did not record a card: The card re-derived on the server has another digest.' });
    expect([...server.recorded.keys()]).toEqual([uuid(1)]);
    expect((await db.cardLog.get(uuid(2)))!.refusal).toBe('The card re-derived on the server has another digest.');
    // Only the pilot's own entries travelled.
    expect(server.posts.flat().map((e) => e.id)).toEqual([uuid(1), uuid(2), uuid(1), uuid(2)]);
    // Exactly the fields the server's strict schema takes.
    expect(Object.keys(server.posts[0][0]).sort()).toEqual(['airframeId', 'digest', 'id', 'inputs', 'issuedAt', 'revisionId']);

    // A refused entry is not sent again as it is; nothing waits, so nothing is posted.
    await flushOutbox(db, server, who);
    expect(server.posts).toHaveLength(2);
    expect((await db.cardLog.get(uuid(3)))!.sentAt).toBeNull();
  });

  it('sends a long outbox in batches of 100', async () => {
    const server = new FakeServer();
    const many = Array.from({ length: 230 }, (_, i) => entry(`00000000-0000-4000-8000-${String(i).padStart(12, '0')}`, { issuedAt: new Date(Date.UTC(2026, 11, 1, 0, 0, i)).toISOString() }));
    await db.cardLog.bulkAdd(many);
    const outcome = await flushOutbox(db, server, who);
    expect(server.posts.map((p) => p.length)).toEqual([100, 100, 30]);
    expect(outcome).toMatchObject({ recorded: 230, waiting: 0 });
  });

  it('records a failed fetch in the sync state and keeps the data already stored', async () => {
    const signer = await newSigner();
    const server = new FakeServer();
    server.answers = [response(signer, 'c1', [await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()))])];
    await runSync(db, server, who, { now: () => new Date('2026-12-01T11:00:00.000Z') });
    server.failSync = 1;
    await expect(runSync(db, server, who)).rejects.toMatchObject({ status: 0, message: expect.stringContaining('cannot reach the server') });
    expect(await db.syncState.get(OPERATOR_ID)).toMatchObject({ cursor: 'c1', lastSyncedAt: '2026-12-01T11:00:00.000Z', lastProblem: expect.stringContaining('cannot reach') });
    expect(await db.revisions.count()).toBe(1);
  });
});

describe('sync loop back-off', () => {
  it('retries after 15 s, 30 s, 60 s … and a success resets the count', () => {
    // Exponential back-off doubling from a base (common practice), capped at 15 minutes.
    expect([1, 2, 3, 4, 7, 8, 20].map((n) => nextRetryDelayMs(n))).toEqual([15_000, 30_000, 60_000, 120_000, 900_000, 900_000, 900_000]);

    const scheduler = new TestScheduler((actual, expected) => expect(actual).toEqual(expected));
    scheduler.run(({ cold }) => {
      const outcomes = ['fail', 'fail', 'ok', 'fail', 'fail', 'ok'];
      const runs: number[] = [];
      const run = () => {
        runs.push(scheduler.now());
        return outcomes.shift() === 'ok' ? of('done') : throwError(() => new Error('no network'));
      };
      // One trigger at 0 ms, one at 100 ms; retries every 10·2^(n-1) ms of virtual time.
      const events = syncLoop(cold('a 99ms b'), run, { retryDelayMs: (n) => 10 * 2 ** (n - 1), scheduler });
      const kind = (e: SyncLoopEvent<string>) => (e.kind === 'failed' ? `failed:${e.failures}:${e.retryInMs}` : e.kind);
      const seen: string[] = [];
      events.subscribe((e) => seen.push(`${scheduler.now()}:${kind(e)}`));
      scheduler.flush();
      // After the success no retry is pending; the next failure counts from one again.
      expect(seen).toEqual(['0:started', '0:failed:1:10', '10:started', '10:failed:2:20', '30:started', '30:succeeded', '100:started', '100:failed:1:10', '110:started', '110:failed:2:20', '130:started', '130:succeeded']);
      expect(runs).toEqual([0, 10, 30, 100, 110, 130]);
    });
  });

  it('forgets the failures when the device comes back online', () => {
    const scheduler = new TestScheduler((actual, expected) => expect(actual).toEqual(expected));
    scheduler.run(({ cold }) => {
      const outcomes = ['fail', 'fail', 'fail', 'ok'];
      const run = () => (outcomes.shift() === 'ok' ? of('done') : throwError(() => new Error('no network')));
      const seen: string[] = [];
      // Failures at 0 and 10 ms; "online" at 15 ms resets the count, so the retry after the
      // failure at 30 ms waits the first delay (10 ms) again, not the third (40 ms).
      syncLoop(cold('a'), run, { retryDelayMs: (n) => 10 * 2 ** (n - 1), scheduler, resetBackoff: cold('15ms r') }).subscribe((e) =>
        seen.push(`${scheduler.now()}:${e.kind === 'failed' ? `failed:${e.failures}` : e.kind}`),
      );
      scheduler.flush();
      expect(seen).toEqual(['0:started', '0:failed:1', '10:started', '10:failed:2', '30:started', '30:failed:1', '40:started', '40:succeeded']);
    });
  });

  it('does not start a second sync while one runs', () => {
    const triggers = new Subject<void>();
    const pending = new Subject<string>();
    let runs = 0;
    const seen: string[] = [];
    const subscription = syncLoop(triggers, () => {
      runs += 1;
      return pending;
    }).subscribe((e) => seen.push(e.kind));
    triggers.next();
    triggers.next();
    triggers.next();
    expect(runs).toBe(1);
    pending.next('done');
    pending.complete();
    expect(seen).toEqual(['started', 'succeeded']);
    triggers.next();
    expect(runs).toBe(2);
    subscription.unsubscribe();
  });
});

describe('currency limit', () => {
  const state = (lastSyncedAt: string | null) => ({ operatorId: 1, cursor: null, lastSyncedAt, lastAttemptAt: null, lastProblem: null, refused: [] });

  it('allows cards from data within the limit and refuses older data with the age and the limit', () => {
    const synced = '2026-11-01T08:00:00.000Z';
    const within = dataCurrency(state(synced), 30, new Date(Date.parse(synced) + 30 * DAY_MS));
    expect(within).toMatchObject({ current: true, ageDays: 30, refusal: null });
    const beyond = dataCurrency(state(synced), 30, new Date(Date.parse(synced) + 31 * DAY_MS + 60_000));
    expect(beyond.current).toBe(false);
    expect(beyond.refusal).toBe(
      'No card can be prepared: the data on this device is from 2026-11-01 08:00 UTC, 31 days old, and your operator allows cards from data at most 30 days old. Sync with a network connection to prepare cards again.',
    );
    expect(dataCurrency(state(null), 30, new Date()).refusal).toContain('no synced data');
    expect(dataCurrency(undefined, undefined, new Date()).current).toBe(false);
  });
});

describe('notices, cached session and sign-out', () => {
  it('names the person’s cards that rest on a superseded or withdrawn revision', async () => {
    const signer = await newSigner();
    await db.cardLog.bulkAdd([entry(uuid(1), { revisionId: 21 }), entry(uuid(2), { revisionId: 22, revisionNumber: 2 }), entry(uuid(3), { revisionId: 21, issuedById: 99 })]);
    await applySync(db, OPERATOR_ID, response(signer, 'c1', [await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent())), await signer.sign(revisionFields(22, 2, 'published', demoPistonTrainerContentRevised()))]));
    expect(await revisionNotices(db, OPERATOR_ID, PILOT.id)).toEqual([]);

    await applySync(db, OPERATOR_ID, response(signer, 'c2', [await signer.sign(revisionFields(21, 1, 'superseded', demoPistonTrainerContent())), await signer.sign(revisionFields(22, 2, 'withdrawn', demoPistonTrainerContentRevised()))]));
    const notices = await revisionNotices(db, OPERATOR_ID, PILOT.id);
    expect(notices.map((n) => [n.entry.id, n.status])).toEqual([
      [uuid(2), 'withdrawn'],
      [uuid(1), 'superseded'],
    ]);
    expect(notices[1].sentence).toBe(
      'Your card for ZZ-KFA (issued 2026-12-01 10:00 UTC) rests on revision 1 of Sedgeling 4 speed book, superseded on 2026-12-01 09:00 UTC. Prepare a new card before you use its figures.',
    );
    expect(notices[0].sentence).toContain('withdrawn on 2026-12-01 09:00 UTC. Do not use its figures');
  });

  it('opens offline only as a cached person whose operator’s data is on the device', async () => {
    await rememberSession(db, PILOT, new Date('2026-12-01T10:00:00.000Z'));
    expect(await cachedSessionForOffline(db)).toBeNull();
    const signer = await newSigner();
    await applySync(db, OPERATOR_ID, response(signer, 'c1', []));
    expect(await cachedSessionForOffline(db)).toEqual(PILOT);
  });

  it('still opens offline past the 12 hours of the sign-in (cards keep working) and says the sign-in has ended', async () => {
    // ASVS 4.0.3 §3.3.2: the sign-in ends 12 hours after it; offline, the device cannot ask.
    await rememberSession(db, PILOT, new Date('2026-12-01T10:00:00.000Z'), '2026-12-01T22:00:00.000Z');
    const signer = await newSigner();
    await applySync(db, OPERATOR_ID, response(signer, 'c1', []));
    expect(await cachedSessionForOffline(db)).toEqual(PILOT);
    const record = await db.sessions.get(PILOT.id);
    expect(offlineSessionEnded(record, new Date('2026-12-01T21:59:59.000Z'))).toBe(false);
    expect(offlineSessionEnded(record, new Date('2026-12-01T22:00:00.000Z'))).toBe(true);
    // A record from before the end was kept says nothing either way.
    await rememberSession(db, PILOT, new Date('2026-12-01T10:00:00.000Z'));
    expect(offlineSessionEnded(await db.sessions.get(PILOT.id), new Date('2027-01-01T00:00:00.000Z'))).toBe(false);
  });

  it('removes the operator’s data and card log on sign-out, and nothing of another operator', async () => {
    const signer = await newSigner();
    await rememberSession(db, PILOT);
    await applySync(db, OPERATOR_ID, response(signer, 'c1', [await signer.sign(revisionFields(21, 1, 'published', demoPistonTrainerContent()))]));
    const legacy = entry(uuid(2)) as Partial<CardLogRecord>;
    delete legacy.operatorId;
    await db.cardLog.bulkAdd([entry(uuid(1)), legacy as CardLogRecord, entry(uuid(3), { operatorId: 2, issuedById: 50 })]);
    await db.airframes.put({ id: 70, registration: 'ZZ-LAA', serial: 'X', aircraftTypeId: 10, active: true, createdAt: stamp, updatedAt: stamp, operatorId: 2 });
    await db.preferences.put({ key: 'units', value: {} });

    await removeOperatorData(db, OPERATOR_ID, [PILOT.id]);
    expect(await db.revisions.count()).toBe(0);
    expect(await db.aircraftTypes.count()).toBe(0);
    expect(await db.operators.count()).toBe(0);
    expect(await db.syncState.count()).toBe(0);
    expect(await db.sessions.count()).toBe(0);
    expect((await db.cardLog.toArray()).map((e) => e.id)).toEqual([uuid(3)]);
    expect((await db.airframes.toArray()).map((a) => a.id)).toEqual([70]);
    expect(await db.preferences.count()).toBe(1);
  });
});
