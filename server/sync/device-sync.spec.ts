import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { sessionUserSchema } from '@shared/api/auth';
import { buildCard, type CardInputs } from '@shared/card';
import { cardIssuePageSchema } from '@shared/card/card-api';
import { demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { SpeedwrightDeviceDatabase, type CardLogRecord } from '../../src/app/core/storage/device-database';
import { SyncFailure, flushOutbox, revisionNotices, runSync, waitingEntries, type SyncTransport } from '../../src/app/core/sync/device-sync';
import { agentTransport } from '../../test/api/device-sync-transport';
import { startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, newTeam, publish, type Session } from '../../test/api/test-helpers';

/**
 * The device's sync core (src/app/core/sync/device-sync.ts) on fake-indexeddb against the real
 * server and MariaDB: a full sync verifies and stores the operator's data, a card built from it
 * on the "device" reaches the card log once however often it is sent, and a later publication
 * supersedes the revision behind the card.
 */
jest.setTimeout(60_000);

let harness: Harness;
let admin: Session, engineer: Session, approver: Session, pilot: Session & { id: number };
let db: SpeedwrightDeviceDatabase;

beforeAll(async () => {
  harness = startHarness();
  [admin, engineer, approver, pilot] = await newTeam(harness.app, ['admin', 'engineer', 'approver', 'pilot']);
}, 120_000);
afterAll(() => harness.close());
beforeEach(() => {
  db = new SpeedwrightDeviceDatabase(`speedwright-device-${randomUUID()}`);
});
afterEach(async () => {
  db.close();
  await db.delete();
});

/** A transport that fails every call, as when the server or its database is down. */
const unreachable: SyncTransport = {
  fetchChanges: () => Promise.reject(Object.assign(new Error("Speedwright cannot reach the server. Check the device's connection and try again."), { status: 0 })),
  sendCardIssues: () => Promise.reject(Object.assign(new Error('The server had a problem answering.'), { status: 503 })),
};

describe('device sync core against the server', () => {
  it('syncs, issues a card offline, reports it once, and notices the supersession', async () => {
    const { aircraftTypeId, speedBookId } = await newSpeedBook(admin, engineer);
    const airframe = (await admin.agent.post('/api/airframes').set('x-csrf-token', admin.token).send({ registration: `ZZ-${randomUUID().slice(0, 3).toUpperCase()}`, serial: 'DS-1', aircraftTypeId }).expect(201)).body.airframe;
    const firstId = await publish(engineer, approver, speedBookId);
    const me = sessionUserSchema.parse((await pilot.agent.get('/api/auth/me').expect(200)).body.user);
    const who = { userId: me.id, operatorId: me.operatorId };
    const transport = agentTransport(pilot);

    // Full sync: everything verified and stored.
    const first = await runSync(db, transport, who);
    expect(first.applied.refused).toEqual([]);
    expect((await db.revisions.get(firstId))).toMatchObject({ status: 'published', operatorId: me.operatorId });
    expect((await db.airframes.get(airframe.id))).toMatchObject({ registration: airframe.registration });
    const cursor = (await db.syncState.get(me.operatorId))!.cursor;
    expect(cursor).toEqual(expect.any(String));

    // Nothing changed: the same cursor, nothing stored.
    const again = await runSync(db, transport, who);
    expect(again.applied).toMatchObject({ revisionsStored: 0, airframesStored: 0, typesStored: 0, cursor });

    // "Offline": a card from the device's data, written to the outbox; the sync fails and keeps it.
    const stored = (await db.revisions.get(firstId))!;
    const type = (await db.aircraftTypes.get(aircraftTypeId))!;
    const inputs: CardInputs = { airframeId: airframe.id, weightKg: 1000, configuration: 'takeoff-flap', departure: { elevationFt: 500, qnhHpa: 1005, oatC: 22 }, isaDeviationC: 5, cruise: { iasKt: 100 }, altitudeStepFt: 1000 };
    const card = buildCard(
      { id: stored.id, number: stored.number, publishedAt: stored.publishedAt, contentSha256: stored.contentSha256, content: stored.content },
      inputs,
      { airframe: { id: airframe.id, registration: airframe.registration }, aircraftType: { designator: type.designator, name: type.name }, speedBook: { id: speedBookId, title: stored.speedBookTitle }, demo: true },
    );
    const entry: CardLogRecord = { id: randomUUID(), airframeId: airframe.id, revisionId: firstId, inputs: { ...card.inputs }, digest: card.digest, issuedAt: new Date().toISOString(), sentAt: null, issuedById: me.id, operatorId: me.operatorId, registration: airframe.registration, revisionNumber: 1, refusal: null };
    await db.cardLog.add(entry);
    await expect(runSync(db, unreachable, who)).rejects.toBeInstanceOf(SyncFailure);
    expect((await waitingEntries(db, me.id)).map((e) => e.id)).toEqual([entry.id]);

    // Back online: the entry reaches the server's card log.
    const online = await runSync(db, transport, who);
    expect(online.outbox).toMatchObject({ recorded: 1, waiting: 0 });
    const sentAt = (await db.cardLog.get(entry.id))!.sentAt;
    expect(sentAt).toEqual(expect.any(String));

    // Sent again (as after a lost answer): recorded once, answered as the first time.
    await db.cardLog.update(entry.id, { sentAt: null });
    expect(await flushOutbox(db, transport, who)).toMatchObject({ recorded: 1, failed: false });
    expect((await db.cardLog.get(entry.id))!.sentAt).toBe(sentAt);
    const log = cardIssuePageSchema.parse((await pilot.agent.get(`/api/card-issues?airframeId=${airframe.id}`).expect(200)).body);
    expect(log.entries.filter((listed) => listed.id === entry.id)).toHaveLength(1);
    expect(log.entries).toHaveLength(1);

    // A new revision is published: after the next sync the card rests on a superseded one.
    const secondId = await publish(engineer, approver, speedBookId, demoPistonTrainerContentRevised());
    const later = await runSync(db, transport, who);
    expect(later.applied.refused).toEqual([]);
    expect((await db.revisions.get(firstId))!.status).toBe('superseded');
    expect((await db.revisions.get(secondId))!.status).toBe('published');
    const notices = await revisionNotices(db, me.operatorId, me.id);
    expect(notices.map((n) => [n.entry.id, n.status, n.current?.id])).toEqual([[entry.id, 'superseded', secondId]]);
  });
});
