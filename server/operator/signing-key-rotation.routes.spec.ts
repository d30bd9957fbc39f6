import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { sessionUserSchema } from '@shared/api/auth';
import { signingKeyResponseSchema } from '@shared/api/revisions';
import { auditPageSchema } from '@shared/api/audit';
import { buildCard, type CardInputs } from '@shared/card';
import { verifyResponseSchema, verifySourceResponseSchema } from '@shared/card-check/verify-api';
import { demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { SpeedwrightDeviceDatabase, type CardLogRecord, type RevisionRecord } from '../../src/app/core/storage/device-database';
import { runSync } from '../../src/app/core/sync/device-sync';
import { checkSourceSignature } from '../../src/app/check/source-signature';
import { agentTransport } from '../../test/api/device-sync-transport';
import { startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, newTeam, publish, type Session } from '../../test/api/test-helpers';
import { verifyStatement } from '../revisions/signing';

/**
 * Signing-key rotation (issue 14, part 3) against the real server: only an administrator
 * rotates, each operator only its own key; the old key is retired and still served; a revision
 * published before the rotation and one after it both verify — on the server with their own key
 * and on a device through its sync core (src/app/core/sync/, fake-indexeddb) — and cards built
 * on the device from either are recorded and answer the public card check.
 */
jest.setTimeout(120_000);

let harness: Harness;
let admin: Session, engineer: Session, approver: Session, pilot: Session & { id: number };
let otherAdmin: Session;
let db: SpeedwrightDeviceDatabase;

beforeAll(async () => {
  harness = startHarness();
  [admin, engineer, approver, pilot] = await newTeam(harness.app, ['admin', 'engineer', 'approver', 'pilot']);
  [otherAdmin] = await newTeam(harness.app, ['admin']);
  db = new SpeedwrightDeviceDatabase(`speedwright-rotation-${randomUUID()}`);
}, 120_000);
afterAll(async () => {
  db.close();
  await db.delete();
  await harness.close();
});

const keysOf = async (session: Session) => signingKeyResponseSchema.parse((await session.agent.get('/api/operator/signing-key').expect(200)).body);
const rotate = (session: Session) => session.agent.post('/api/operator/signing-key/rotate').set('x-csrf-token', session.token);

/** A card built on the device from a stored revision, waiting in its outbox. */
function deviceCard(revision: RevisionRecord, airframe: { id: number; registration: string }, designator: string, typeName: string, issuedById: number): CardLogRecord {
  const inputs: CardInputs = { airframeId: airframe.id, weightKg: 1000, configuration: 'takeoff-flap', departure: { elevationFt: 500, qnhHpa: 1005, oatC: 22 }, isaDeviationC: 5, cruise: { iasKt: 100 }, altitudeStepFt: 1000 };
  const card = buildCard(
    { id: revision.id, number: revision.number, publishedAt: revision.publishedAt, contentSha256: revision.contentSha256, content: revision.content },
    inputs,
    { airframe, aircraftType: { designator, name: typeName }, speedBook: { id: revision.speedBookId, title: revision.speedBookTitle }, demo: true },
  );
  return { id: randomUUID(), airframeId: airframe.id, revisionId: revision.id, inputs: { ...card.inputs }, digest: card.digest, issuedAt: new Date().toISOString(), sentAt: null, issuedById, operatorId: revision.operatorId, registration: airframe.registration, revisionNumber: revision.number, refusal: null };
}

describe('POST /api/operator/signing-key/rotate', () => {
  it('is for administrators: engineers, approvers and pilots get 403, and without the CSRF token nobody rotates', async () => {
    const before = await keysOf(admin);
    for (const session of [engineer, approver, pilot]) {
      const res = await rotate(session).expect(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    await admin.agent.post('/api/operator/signing-key/rotate').expect(403);
    expect(await keysOf(admin)).toEqual(before);
  });

  it('retires the old key (kept, still served), signs new publications with the new one, and both revisions verify on the server, on the device and at the card check', async () => {
    const { aircraftTypeId, speedBookId } = await newSpeedBook(admin, engineer);
    const type = (await admin.agent.get(`/api/aircraft-types/${aircraftTypeId}`).expect(200)).body.aircraftType as { designator: string; name: string };
    const airframe = (await admin.agent.post('/api/airframes').set('x-csrf-token', admin.token).send({ registration: `ZZ-${randomUUID().slice(0, 3).toUpperCase()}`, serial: 'KR-1', aircraftTypeId }).expect(201)).body.airframe as { id: number; registration: string };
    const firstId = await publish(engineer, approver, speedBookId);
    const oldKey = (await keysOf(pilot)).signingKey;
    expect(oldKey.retiredAt).toBeNull();

    // The pilot's device syncs before the rotation: it knows only the old key.
    const me = sessionUserSchema.parse((await pilot.agent.get('/api/auth/me').expect(200)).body.user);
    const who = { userId: me.id, operatorId: me.operatorId };
    const transport = agentTransport(pilot);
    expect((await runSync(db, transport, who)).applied.refused).toEqual([]);
    expect((await db.signingKeys.toArray()).map((key) => key.id)).toEqual([oldKey.id]);

    // Another operator's rotation changes nothing here.
    const othersBefore = await keysOf(otherAdmin);
    const theirs = signingKeyResponseSchema.parse((await rotate(otherAdmin).expect(201)).body);
    expect(theirs.signingKeys.map((key) => key.id)).toEqual([theirs.signingKey.id, othersBefore.signingKey.id]);
    expect((await keysOf(pilot)).signingKeys).toEqual([oldKey]);

    const rotated = signingKeyResponseSchema.parse((await rotate(admin).expect(201)).body);
    const newKey = rotated.signingKey;
    expect(newKey.id).not.toBe(oldKey.id);
    expect(newKey.publicKey).not.toBe(oldKey.publicKey);
    expect(newKey.retiredAt).toBeNull();
    expect(rotated.signingKeys).toEqual([newKey, { ...oldKey, retiredAt: expect.any(String) }]);
    // Everyone who reads published data sees the same list, the retired key still served.
    expect(await keysOf(pilot)).toEqual(rotated);

    const secondId = await publish(engineer, approver, speedBookId, demoPistonTrainerContentRevised());
    const first = (await pilot.agent.get(`/api/revisions/${firstId}`).expect(200)).body.revision;
    const second = (await pilot.agent.get(`/api/revisions/${secondId}`).expect(200)).body.revision;
    expect([first.status, first.signingKeyId, second.status, second.signingKeyId]).toEqual(['superseded', oldKey.id, 'published', newKey.id]);

    // On the server: each signature verifies with the key its signingKeyId names, and not with the other.
    const statementOf = (revision: typeof first) =>
      signedRevisionStatement({ operatorId: me.operatorId, speedBookId, revisionId: revision.id, number: revision.number, contentSha256: revision.contentSha256, publishedAt: revision.publishedAt });
    expect(verifyStatement(oldKey.publicKey, statementOf(first), first.signature)).toBe(true);
    expect(verifyStatement(newKey.publicKey, statementOf(second), second.signature)).toBe(true);
    expect(verifyStatement(newKey.publicKey, statementOf(first), first.signature)).toBe(false);

    // On the device: the next sync learns the new key, keeps the old one, and stores both revisions.
    const after = await runSync(db, transport, who);
    expect(after.applied.refused).toEqual([]);
    expect((await db.signingKeys.orderBy('id').toArray()).map((key) => [key.id, key.retiredAt === null])).toEqual([
      [oldKey.id, false],
      [newKey.id, true],
    ]);
    const storedFirst = (await db.revisions.get(firstId))!;
    const storedSecond = (await db.revisions.get(secondId))!;
    expect([storedFirst.status, storedFirst.signingKeyId, storedSecond.signingKeyId]).toEqual(['superseded', oldKey.id, newKey.id]);

    // Cards built on the device from each revision reach the card log and answer the card check.
    const oldCard = deviceCard(storedFirst, airframe, type.designator, type.name, me.id);
    const newCard = deviceCard(storedSecond, airframe, type.designator, type.name, me.id);
    await db.cardLog.bulkAdd([oldCard, newCard]);
    expect((await runSync(db, transport, who)).outbox).toMatchObject({ recorded: 2, refused: 0 });
    const codeOf = async (id: string) => (await db.cardLog.get(id))!.code!;
    const oldCheck = verifyResponseSchema.parse((await pilot.agent.get(`/api/verify/${await codeOf(oldCard.id)}`).expect(200)).body);
    const newCheck = verifyResponseSchema.parse((await pilot.agent.get(`/api/verify/${await codeOf(newCard.id)}`).expect(200)).body);
    expect(oldCheck).toMatchObject({ status: 'superseded', revision: { number: 1 } });
    expect(newCheck).toMatchObject({ status: 'current', revision: { number: 2 } });
    // The check page's source names each revision's own key, and its signature verifies as the page checks it.
    const oldSource = verifySourceResponseSchema.parse((await pilot.agent.get(`/api/verify/${await codeOf(oldCard.id)}/source`).expect(200)).body);
    const newSource = verifySourceResponseSchema.parse((await pilot.agent.get(`/api/verify/${await codeOf(newCard.id)}/source`).expect(200)).body);
    expect(oldSource.signature).toMatchObject({ keyId: oldKey.id, publicKey: oldKey.publicKey, keyRetiredAt: rotated.signingKeys[1]!.retiredAt });
    expect(newSource.signature).toMatchObject({ keyId: newKey.id, publicKey: newKey.publicKey, keyRetiredAt: null });
    expect(await checkSourceSignature(oldSource)).toEqual({ kind: 'verified', keyId: oldKey.id, keyRetiredAt: rotated.signingKeys[1]!.retiredAt });
    expect(await checkSourceSignature(newSource)).toEqual({ kind: 'verified', keyId: newKey.id, keyRetiredAt: null });
    // The old revision presented with the new key does not verify.
    expect((await checkSourceSignature({ ...oldSource, signature: { ...oldSource.signature, keyId: newKey.id, publicKey: newKey.publicKey } })).kind).toBe('refused');

    // Audited, with the key ids.
    const events = auditPageSchema.parse((await admin.agent.get('/api/audit?action=signing-key.rotated').expect(200)).body).events;
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ entityType: 'signing-key', entityId: String(newKey.id), details: { algorithm: 'Ed25519', publicKey: newKey.publicKey, retiredKeyIds: [oldKey.id] } });
  });
});
