import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { createSequelize } from '../db/connection';
import { DEFAULT_RETRY, ER_LOCK_DEADLOCK, ER_QUERY_INTERRUPTED, isRetryableConflict, retryDelayMs, transactOn, type RetryPolicy } from './transactions';

/**
 * The one transaction helper's retry (MariaDB's "Galera Cluster Known Limitations": a
 * transaction that fails certification gets error 1213 and the application must retry it).
 * A fake Sequelize injects the faults; the last case makes a real InnoDB deadlock.
 */

/** An error shaped as Sequelize gives it: the driver's error (with `errno`) as `parent`/`original`. */
function driverError(errno: number, message: string): Error {
  const original = Object.assign(new Error(message), { errno });
  return Object.assign(new Error(message), { name: 'SequelizeDatabaseError', parent: original, original });
}

const deadlock = () => driverError(ER_LOCK_DEADLOCK, 'Deadlock found when trying to get lock; try restarting transaction');

/** A Sequelize whose commit fails with `faults` in turn, then succeeds. */
function fakeSequelize(faults: Error[]) {
  const calls = { transactions: 0, works: 0 };
  const sequelize = {
    async transaction<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
      calls.transactions++;
      const result = await work({} as Transaction);
      const fault = faults.shift();
      if (fault) throw fault; // at commit, after the work ran: Galera's certification failure
      return result;
    },
  } as unknown as Sequelize;
  return { sequelize, calls };
}

function policy(overrides: Partial<RetryPolicy> = {}): RetryPolicy & { waits: number[] } {
  const waits: number[] = [];
  return { ...DEFAULT_RETRY, random: () => 0.5, sleep: async (ms) => void waits.push(ms), waits, ...overrides };
}

describe('transactOn', () => {
  it('runs the work again when its first commit fails certification, and answers the second result', async () => {
    const { sequelize, calls } = fakeSequelize([deadlock()]);
    const retry = policy();
    let run = 0;
    await expect(transactOn(sequelize, async () => ++run, retry)).resolves.toBe(2);
    expect(calls.transactions).toBe(2);
    expect(retry.waits).toEqual([10]); // half of the first cap (20 ms)
  });

  it('retries a brute-force abort (query interrupted) too', async () => {
    const { sequelize, calls } = fakeSequelize([driverError(ER_QUERY_INTERRUPTED, 'Query execution was interrupted')]);
    await expect(transactOn(sequelize, async () => 'done', policy())).resolves.toBe('done');
    expect(calls.transactions).toBe(2);
  });

  it('does not retry any other error', async () => {
    const duplicate = driverError(1062, "Duplicate entry 'x' for key 'PRIMARY'");
    const { sequelize, calls } = fakeSequelize([duplicate]);
    const retry = policy();
    await expect(transactOn(sequelize, async () => 1, retry)).rejects.toBe(duplicate);
    expect(calls.transactions).toBe(1);
    expect(retry.waits).toEqual([]);
  });

  it('does not retry an error the work throws itself', async () => {
    const { sequelize, calls } = fakeSequelize([]);
    const refusal = new Error('A revision holds at most 20 source pages.');
    await expect(
      transactOn(
        sequelize,
        async () => {
          throw refusal;
        },
        policy(),
      ),
    ).rejects.toBe(refusal);
    expect(calls.transactions).toBe(1);
  });

  it('keeps the bound: after the last try the conflict reaches the caller', async () => {
    const faults = Array.from({ length: 10 }, deadlock);
    const last = faults[DEFAULT_RETRY.attempts - 1];
    const { sequelize, calls } = fakeSequelize(faults);
    const retry = policy({ random: () => 0.999 });
    await expect(transactOn(sequelize, async () => 1, retry)).rejects.toBe(last);
    expect(calls.transactions).toBe(DEFAULT_RETRY.attempts);
    // Exponential caps 20, 40, 80, 160 ms, each wait drawn below its cap.
    expect(retry.waits).toEqual([19, 39, 79, 159]);
  });
});

describe('retry delays', () => {
  it('are drawn from zero up to a cap that doubles and stops at the maximum', () => {
    const base = { baseDelayMs: 20, maxDelayMs: 400 };
    expect(retryDelayMs(1, { ...base, random: () => 0 })).toBe(0);
    expect(retryDelayMs(3, { ...base, random: () => 0.5 })).toBe(40);
    expect(retryDelayMs(10, { ...base, random: () => 0.999999 })).toBe(399);
  });

  it('recognises the conflict behind a Sequelize error and nothing else', () => {
    expect(isRetryableConflict(deadlock())).toBe(true);
    expect(isRetryableConflict(Object.assign(new Error('x'), { errno: ER_LOCK_DEADLOCK }))).toBe(true);
    expect(isRetryableConflict(driverError(1205, 'Lock wait timeout exceeded'))).toBe(false);
    expect(isRetryableConflict(new Error('plain'))).toBe(false);
    expect(isRetryableConflict(undefined)).toBe(false);
  });
});

describe('transactOn against MariaDB', () => {
  let sequelize: Sequelize;
  const table = `retry_probe_${process.pid}`;
  beforeAll(async () => {
    sequelize = createSequelize(process.env['DATABASE_URL']!);
    await sequelize.query(`CREATE TABLE ${table} (id INT PRIMARY KEY, hits INT NOT NULL) ENGINE=InnoDB`, { type: QueryTypes.UPDATE });
    await sequelize.query(`INSERT INTO ${table} VALUES (1, 0), (2, 0)`, { type: QueryTypes.INSERT });
  });
  afterAll(async () => {
    await sequelize.query(`DROP TABLE IF EXISTS ${table}`, { type: QueryTypes.UPDATE });
    await sequelize.close();
  });

  it('gets both of two deadlocking transactions through, each applied once', async () => {
    // Each transaction bumps row `first`, waits until the other has bumped its first row, then
    // bumps the other row: a lock cycle, so InnoDB chooses one as its deadlock victim (1213).
    let arrived = 0;
    let release!: () => void;
    const bothHoldOneRow = new Promise<void>((done) => (release = done));
    let tries = 0;
    const bump = (first: number, second: number) =>
      transactOn(
        sequelize,
        async (transaction) => {
          tries++;
          await sequelize.query(`UPDATE ${table} SET hits = hits + 1 WHERE id = ?`, { replacements: [first], transaction, type: QueryTypes.UPDATE });
          if (++arrived === 2) release();
          await bothHoldOneRow;
          await sequelize.query(`UPDATE ${table} SET hits = hits + 1 WHERE id = ?`, { replacements: [second], transaction, type: QueryTypes.UPDATE });
        },
        { ...DEFAULT_RETRY, random: () => 0.5 },
      );
    await Promise.all([bump(1, 2), bump(2, 1)]);
    expect(tries).toBe(3); // one victim, run again once
    const rows = await sequelize.query<{ id: number; hits: number }>(`SELECT id, hits FROM ${table} ORDER BY id`, { type: QueryTypes.SELECT });
    expect(rows).toEqual([
      { id: 1, hits: 2 },
      { id: 2, hits: 2 },
    ]);
  });
});
