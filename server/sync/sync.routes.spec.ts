import { webcrypto } from 'node:crypto';
import { syncResponseSchema, type SyncResponse } from '@shared/api/sync';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { startHarness, type Harness } from '../../test/api/harness';
import { AuditEvent, Revision } from '../models';
import { newSpeedBook, publish, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

// Publishing signs and sign-ins hash passwords; on a busy machine 5 s is short.
jest.setTimeout(30_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

async function sync(who: Session, cursor?: string): Promise<SyncResponse> {
  const res = await who.agent.get('/api/sync').query(cursor === undefined ? {} : { cursor }).expect(200);
  return syncResponseSchema.parse(res.body);
}

/** Ed25519 verification as a device does it (WebCrypto), of the statement shared/speed-book/signature.ts defines. */
async function verifies(publicKey: string, operatorId: number, revision: SyncResponse['revisions'][number]): Promise<boolean> {
  const key = await webcrypto.subtle.importKey('raw', Buffer.from(publicKey, 'base64'), { name: 'Ed25519' }, false, ['verify']);
  const statement = signedRevisionStatement({ operatorId, speedBookId: revision.speedBookId, revisionId: revision.id, number: revision.number, contentSha256: revision.contentSha256, publishedAt: revision.publishedAt });
  return webcrypto.subtle.verify({ name: 'Ed25519' }, key, Buffer.from(revision.signature, 'base64'), new TextEncoder().encode(statement));
}

describe('GET /api/sync', () => {
  it('gives everything published with valid signatures, then only changes, never drafts or another operator’s data', async () => {
    const { speedBookId, aircraftTypeId } = await newSpeedBook(as.admin, as.engineer);
    const firstId = await publish(as.engineer, as.approver, speedBookId);
    const draft = await as.engineer.agent.post(`/api/speed-books/${speedBookId}/revisions`).set('x-csrf-token', as.engineer.token).send({ changeSummary: 'Not yet' }).expect(201);
    const draftId = draft.body.revision.id as number;

    const full = await sync(as.pilot);
    const served = (await as.pilot.agent.get('/api/operator/signing-key').expect(200)).body.signingKey;
    expect(full.operator).toMatchObject({ publicKey: served.publicKey, signingKeyId: served.id, currencyLimitDays: expect.any(Number), isDemo: true });
    expect(full.aircraftTypes.map((t) => t.id)).toContain(aircraftTypeId);
    expect(full.airframes.length).toBeGreaterThan(0);
    const first = full.revisions.find((r) => r.id === firstId);
    expect(first).toMatchObject({ status: 'published', speedBookId, aircraftTypeId, number: 1, supersededAt: null, withdrawnAt: null });
    expect(full.revisions.map((r) => r.id)).not.toContain(draftId);
    const stored = await Revision.findAll({ where: { operatorId: full.operator.id, status: ['draft', 'in_review'] } });
    for (const hidden of stored) expect(full.revisions.map((r) => r.id)).not.toContain(hidden.id);
    for (const revision of full.revisions) expect(await verifies(full.operator.publicKey, full.operator.id, revision)).toBe(true);
    // A changed figure no longer matches the signature.
    expect(await verifies(full.operator.publicKey, full.operator.id, { ...first!, number: 7 })).toBe(false);

    const again = await sync(as.pilot, full.cursor);
    expect(again).toMatchObject({ cursor: full.cursor, aircraftTypes: [], airframes: [], revisions: [] });

    // The draft goes through review and is published: the new one and the superseded one come back.
    await as.engineer.agent.patch(`/api/revisions/${draftId}`).set('x-csrf-token', as.engineer.token).send({ content: demoPistonTrainerContentRevised() }).expect(200);
    await as.engineer.agent.post(`/api/revisions/${draftId}/submit`).set('x-csrf-token', as.engineer.token).expect(200);
    const inReview = await sync(as.pilot, full.cursor);
    expect(inReview.revisions).toEqual([]);
    await as.approver.agent.post(`/api/revisions/${draftId}/approve`).set('x-csrf-token', as.approver.token).expect(200);
    const afterPublish = await sync(as.pilot, inReview.cursor);
    expect(afterPublish.cursor).not.toBe(inReview.cursor);
    expect(afterPublish.revisions.map((r) => [r.id, r.status]).sort()).toEqual([[firstId, 'superseded'], [draftId, 'published']].sort());
    expect(afterPublish.revisions.find((r) => r.id === firstId)!.supersededAt).toBe(afterPublish.revisions.find((r) => r.id === draftId)!.publishedAt);
    for (const revision of afterPublish.revisions) expect(await verifies(afterPublish.operator.publicKey, afterPublish.operator.id, revision)).toBe(true);

    // A withdrawal, even right after the previous sync, shows up.
    await as.approver.agent.post(`/api/revisions/${draftId}/withdraw`).set('x-csrf-token', as.approver.token).send({ reason: 'Figure under query' }).expect(200);
    const afterWithdraw = await sync(as.inspector, afterPublish.cursor);
    expect(afterWithdraw.revisions.map((r) => [r.id, r.status])).toEqual([[draftId, 'withdrawn']]);
    expect(afterWithdraw.revisions[0].withdrawnAt).toEqual(expect.any(String));
    expect((await sync(as.pilot, afterWithdraw.cursor)).revisions).toEqual([]);

    const other = await sync(as.secondPilot);
    expect(other.operator.id).not.toBe(full.operator.id);
    expect(other.operator.publicKey).not.toBe(full.operator.publicKey);
    const otherIds = other.revisions.map((r) => r.id);
    for (const id of [firstId, draftId]) expect(otherIds).not.toContain(id);
    expect(other.aircraftTypes.map((t) => t.id)).not.toContain(aircraftTypeId);
    expect(other.airframes.every((a) => !full.airframes.some((b) => b.id === a.id))).toBe(true);
  });

  it('sends a full sync gzip-compressed to a device that accepts it', async () => {
    const res = await as.pilot.agent.get('/api/sync').set('accept-encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(syncResponseSchema.parse(res.body).revisions.length).toBeGreaterThan(0);
  });

  it('answers 401 signed out and 400 with a field message for a cursor it did not give out', async () => {
    const { agent } = await import('supertest').then((s) => ({ agent: s.default(harness.app) }));
    await agent.get('/api/sync').expect(401);
    for (const cursor of ['not a cursor!', Buffer.from('v1.-4').toString('base64url'), Buffer.from('v2.10').toString('base64url'), 'x'.repeat(300)]) {
      const res = await as.pilot.agent.get('/api/sync').query({ cursor }).expect(400);
      expect(res.body.error.fields).toHaveProperty('cursor');
    }
    const res = await as.pilot.agent.get('/api/sync').query({ cursor: ['a', 'b'] }).expect(400);
    expect(res.body.error.fields).toHaveProperty('cursor');
  });
});

describe('GET and PATCH /api/operator/settings', () => {
  it('lets an administrator set the currency limit, audited and shown in sync; other roles 403; bad values 400', async () => {
    const patch = (who: Session, body: unknown) => who.agent.patch('/api/operator/settings').set('x-csrf-token', who.token).send(body as object);
    const res = await patch(as.admin, { currencyLimitDays: 14 }).expect(200);
    expect(res.body).toEqual({ settings: { currencyLimitDays: 14, approachAdditivePolicy: { headwindFraction: 0.5, gustFraction: 1, minimumKt: 5, maximumKt: 20 } } });
    expect((await as.admin.agent.get('/api/operator/settings').expect(200)).body).toEqual(res.body);
    await as.pilot.agent.get('/api/operator/settings').expect(403);
    const synced = await sync(as.pilot);
    expect(synced.operator.currencyLimitDays).toBe(14);
    const audit = await AuditEvent.findOne({ where: { operatorId: synced.operator.id, action: 'operator.settings-updated' }, order: [['id', 'DESC']] });
    expect(JSON.parse(audit!.details!)).toMatchObject({ currencyLimitDays: { after: 14 } });
    expect((await sync(as.secondPilot)).operator.currencyLimitDays).toBe(30);

    for (const role of ['pilot', 'engineer', 'approver', 'inspector'] as const) await patch(as[role], { currencyLimitDays: 10 }).expect(403);
    for (const bad of [{ currencyLimitDays: 0 }, { currencyLimitDays: 366 }, { currencyLimitDays: 2.5 }, { currencyLimitDays: '30' }, {}, { currencyLimitDays: 30, extra: 1 }]) {
      const answer = await patch(as.admin, bad).expect(400);
      expect(Object.keys(answer.body.error.fields).length).toBeGreaterThan(0);
    }
    expect((await patch(as.admin, { currencyLimitDays: 0 }).expect(400)).body.error.fields.currencyLimitDays).toMatch(/At least 1/);
    await patch(as.admin, { currencyLimitDays: 30 }).expect(200);
    expect((await sync(as.pilot)).operator.currencyLimitDays).toBe(30);
  });
});
