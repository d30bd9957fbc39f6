import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { openLocalDatabase, stopLocalInstance } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../dev/demo-seed';
import { SpeedwrightDeviceDatabase, type CardLogRecord } from '../../src/app/core/storage/device-database';
import { flushOutbox, reportOf, runSync, SyncFailure, waitingEntries, type SyncPerson } from '../../src/app/core/sync/device-sync';
import { loginResponseSchema } from '@shared/api/auth';
import { buildCard, type CardInputs } from '@shared/card';
import { createSequelize } from '../../db/connection';
import { initModels, CardIssue } from '../models';
import { agentTransport } from '../../test/api/device-sync-transport';
import { csrfAgent, startHarness, TEST_PASSWORD, TEST_SIGNING_KEY_SECRET, type Harness } from '../../test/api/harness';

/**
 * The device's outbox when the database goes away: MariaDB is stopped before a batch and
 * while one is in flight. The device keeps every entry the server did not answer for; once the
 * database is back, sending again stores each card exactly once (the server is idempotent by
 * entry id) and the device marks all of them sent.
 *
 * This file stops its database on purpose, so it runs on an instance of its own (`fault`,
 * db/local.ts) and never takes the shared test instance from the files running beside it.
 */
const DATABASE = 'speedwright_fault_test';
const ENTRIES = 100;

let harness: Harness;
let device: SpeedwrightDeviceDatabase;
let pilot: SyncPerson;
let transport: ReturnType<typeof agentTransport>;

jest.setTimeout(240_000);

async function startDatabase(fresh: boolean): Promise<string> {
  return (await openLocalDatabase('fault', DATABASE, { fresh })).url;
}

beforeAll(async () => {
  const url = await startDatabase(true);
  const sequelize = createSequelize(url);
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize, TEST_PASSWORD, { signingKeySecret: TEST_SIGNING_KEY_SECRET });
  await sequelize.close();
  harness = startHarness({ DATABASE_URL: url });
  const { agent, token } = await csrfAgent(harness.app);
  const login = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: 'pilot@demo.speedwright.example', password: TEST_PASSWORD }).expect(200);
  const user = loginResponseSchema.parse(login.body).user;
  const fresh = await agent.get('/api/auth/csrf').expect(200);
  pilot = { userId: user.id, operatorId: user.operatorId };
  transport = agentTransport({ agent, token: fresh.body.token as string });
  device = new SpeedwrightDeviceDatabase(`speedwright-fault-${randomUUID()}`);
  await runSync(device, transport, pilot);
});

afterAll(async () => {
  await harness?.close();
  device?.close();
  await stopLocalInstance('fault');
});

/** `count` cards for the demo trainer ZZ-KFA, built on the device from its synced revision, waiting to be sent. */
async function issueCards(count: number): Promise<CardLogRecord[]> {
  const airframe = (await device.airframes.where('operatorId').equals(pilot.operatorId).toArray()).find((a) => a.registration === 'ZZ-KFA')!;
  const type = (await device.aircraftTypes.get(airframe.aircraftTypeId))!;
  const revision = (await device.revisions.where('aircraftTypeId').equals(type.id).toArray()).find((r) => r.status === 'published')!;
  const operator = (await device.operators.get(pilot.operatorId))!;
  const entries: CardLogRecord[] = [];
  for (let i = 0; i < count; i++) {
    const inputs: CardInputs = {
      airframeId: airframe.id,
      weightKg: 900 + i,
      configuration: 'takeoff-flap',
      departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
      isaDeviationC: 3,
      cruise: { iasKt: 110 },
      altitudeStepFt: 2000,
    };
    const card = buildCard(
      { id: revision.id, number: revision.number, publishedAt: revision.publishedAt, contentSha256: revision.contentSha256, content: revision.content },
      inputs,
      {
        airframe: { id: airframe.id, registration: airframe.registration },
        aircraftType: { designator: type.designator, name: type.name },
        speedBook: { id: revision.speedBookId, title: revision.speedBookTitle },
        demo: operator.isDemo,
      },
    );
    entries.push({
      id: randomUUID(),
      airframeId: airframe.id,
      revisionId: revision.id,
      inputs: inputs as unknown as Record<string, unknown>,
      digest: card.digest,
      issuedAt: new Date(Date.UTC(2026, 11, 2, 6, 0, i)).toISOString(),
      sentAt: null,
      issuedById: pilot.userId,
      operatorId: pilot.operatorId,
      registration: airframe.registration,
      revisionNumber: revision.number,
      refusal: null,
    });
  }
  await device.cardLog.bulkAdd(entries);
  return entries;
}

async function storedOnServer(ids: string[]): Promise<number> {
  return CardIssue.count({ where: { id: ids } });
}

describe('the outbox when MariaDB stops', () => {
  it('keeps a batch sent while the database is down, and sends it once after it returns', async () => {
    const entries = await issueCards(5);
    await stopLocalInstance('fault');

    const outcome = await flushOutbox(device, transport, pilot);
    expect(outcome).toMatchObject({ recorded: 0, waiting: 5, failed: true });
    expect(outcome.failureStatus).toBeGreaterThanOrEqual(500);
    expect(outcome.problem).toMatch(/kept on this device/);
    await expect(runSync(device, transport, pilot)).rejects.toBeInstanceOf(SyncFailure);
    expect((await waitingEntries(device, pilot.userId)).map((e) => e.id).sort()).toEqual(entries.map((e) => e.id).sort());

    await startDatabase(false);
    const resent = await flushOutbox(device, transport, pilot);
    expect(resent).toMatchObject({ recorded: 5, waiting: 0, refused: 0, failed: false });
    expect(await storedOnServer(entries.map((e) => e.id))).toBe(5);
    expect(await waitingEntries(device, pilot.userId)).toEqual([]);
  });

  it('loses and doubles nothing when the database stops while a batch of 100 is being stored', async () => {
    const entries = await issueCards(ENTRIES);
    const ids = entries.map((e) => e.id);
    // The database goes down once the server has stored the first entries of the batch, so
    // it is part-way through it (on a fast machine it may have finished: both must end the same).
    let storedWhenStopped = -1;
    const stopMidBatch = async () => {
      const deadline = Date.now() + 10_000;
      while (Date.now() < deadline && (storedWhenStopped = await storedOnServer(ids)) === 0) await new Promise((done) => setTimeout(done, 2));
      await stopLocalInstance('fault');
    };
    let stopping: Promise<void> = Promise.resolve();
    const outcome = await flushOutbox(
      device,
      {
        ...transport,
        sendCardIssues: (batch) => {
          stopping = stopMidBatch();
          return transport.sendCardIssues(batch);
        },
      },
      pilot,
    );
    await stopping;
    expect(storedWhenStopped).toBeGreaterThan(0);
    const waitingAfterFault = await waitingEntries(device, pilot.userId);
    // Whatever the server did not answer for is still on the device, and nothing is marked
    // sent that the server did not confirm.
    expect(outcome.recorded + waitingAfterFault.length).toBe(ENTRIES);
    if (outcome.failed) expect(waitingAfterFault).toHaveLength(ENTRIES);

    await startDatabase(false);
    const storedBeforeResend = await storedOnServer(ids);
    const resent = await flushOutbox(device, transport, pilot);
    expect(resent).toMatchObject({ refused: 0, waiting: 0, failed: false });
    expect(resent.recorded).toBe(waitingAfterFault.length);
    expect(storedBeforeResend).toBeLessThanOrEqual(ENTRIES);
    // Exactly once each on the server, all marked sent on the device.
    expect(await storedOnServer(ids)).toBe(ENTRIES);
    const rows = await CardIssue.findAll({ where: { id: ids }, attributes: ['id', 'digest'] });
    expect(new Set(rows.map((r) => r.id)).size).toBe(ENTRIES);
    expect(new Map(rows.map((r) => [r.id, r.digest]))).toEqual(new Map(entries.map((e) => [e.id, e.digest])));
    const marked = await device.cardLog.bulkGet(ids);
    expect(marked.every((e) => e?.sentAt && e.refusal === null)).toBe(true);
    // A replay of the whole batch afterwards answers as the first time and stores nothing more.
    const replay = await transport.sendCardIssues(entries.map(reportOf));
    expect(replay.every((r) => r.outcome === 'recorded')).toBe(true);
    expect(await storedOnServer(ids)).toBe(ENTRIES);
  });
});
