import { QueryTypes, type Transaction } from 'sequelize';
import { startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, newTeam, type Session } from '../../test/api/test-helpers';
import { transactOn } from '../transactions';

/**
 * The sync cursor never skips a committed change (server/sync/sync-cursor.ts, DEVELOPERS.md
 * "The sync cursor"): change numbers come from the operator's counter row, locked until the
 * writing transaction ends, so a second writer cannot take (or commit) a larger number while a
 * smaller one is uncommitted. With numbers taken from a sequence at write time, the second
 * transaction committed first, a sync in between answered its larger number as the cursor, and
 * the first transaction's change was never sent (the case below).
 */
jest.setTimeout(60_000);

let harness: Harness;
let admin: Session, engineer: Session, pilot: Session;

beforeAll(async () => {
  harness = startHarness();
  [admin, engineer, pilot] = await newTeam(harness.app, ['admin', 'engineer', 'pilot']);
}, 120_000);
afterAll(() => harness.close());

const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));

async function sync(cursor?: string): Promise<{ cursor: string; typeIds: number[] }> {
  const res = await pilot.agent.get('/api/sync').query(cursor ? { cursor } : {}).expect(200);
  return { cursor: res.body.cursor as string, typeIds: (res.body.aircraftTypes as { id: number }[]).map((type) => type.id) };
}

describe('sync cursor and commit order', () => {
  it('a device syncing while two transactions race still receives both changes', async () => {
    const first = (await newSpeedBook(admin, engineer)).aircraftTypeId;
    const second = (await newSpeedBook(admin, engineer)).aircraftTypeId;
    const before = await sync();
    expect(before.typeIds).toEqual(expect.arrayContaining([first, second]));

    const rename = (id: number, name: string, transaction: Transaction) =>
      harness.sequelize.query('UPDATE aircraft_types SET name = ? WHERE id = ?', { replacements: [name, id], transaction, type: QueryTypes.UPDATE });

    // Transaction A changes the first type and stays open (a slow request).
    let finishA!: () => void;
    const holdA = new Promise<void>((done) => (finishA = done));
    let aWrote!: () => void;
    const aHasWritten = new Promise<void>((done) => (aWrote = done));
    const a = transactOn(harness.sequelize, async (transaction) => {
      await rename(first, 'Renamed by A (invented)', transaction);
      aWrote();
      await holdA;
    });
    await aHasWritten;

    // Transaction B changes the second type and tries to commit at once, before A.
    let bCommitted = false;
    const b = transactOn(harness.sequelize, (transaction) => rename(second, 'Renamed by B (invented)', transaction)).then(() => {
      bCommitted = true;
    });
    await sleep(500);
    expect(bCommitted).toBe(false); // B waits for A's change number: it cannot commit a larger one first

    // A device syncs now: it sees neither change yet, and its cursor stays below both.
    const between = await sync(before.cursor);
    expect(between.typeIds).toEqual([]);

    finishA();
    await Promise.all([a, b]);
    const after = await sync(between.cursor);
    expect(after.typeIds.sort((x, y) => x - y)).toEqual([first, second].sort((x, y) => x - y));
    // And nothing is answered twice once the device holds both.
    expect((await sync(after.cursor)).typeIds).toEqual([]);
  });

  it('a sync between two commits answers the first and the next sync the second', async () => {
    const first = (await newSpeedBook(admin, engineer)).aircraftTypeId;
    const second = (await newSpeedBook(admin, engineer)).aircraftTypeId;
    const start = await sync();
    await harness.sequelize.query('UPDATE aircraft_types SET name = ? WHERE id = ?', { replacements: ['First change (invented)', first], type: QueryTypes.UPDATE });
    const middle = await sync(start.cursor);
    expect(middle.typeIds).toEqual([first]);
    await harness.sequelize.query('UPDATE aircraft_types SET name = ? WHERE id = ?', { replacements: ['Second change (invented)', second], type: QueryTypes.UPDATE });
    expect((await sync(middle.cursor)).typeIds).toEqual([second]);
  });
});
