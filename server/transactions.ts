import type { Sequelize, Transaction } from 'sequelize';

/**
 * The one way services reach the database outside a model: `transact` for a unit of work,
 * `database()` for a raw query. Both use the Sequelize instance the app was built with, which
 * `initModels` registers here (so models and transactions always share one connection pool).
 */
let registered: Sequelize | undefined;

/** Called by `initModels`: the instance every later transaction runs on. */
export function useDatabase(sequelize: Sequelize): void {
  registered = sequelize;
}

/** The Sequelize instance the models were registered with (a programming error before `initModels`). */
export function database(): Sequelize {
  if (!registered) throw new Error('The models are not registered yet: call initModels(sequelize) first.');
  return registered;
}

/** How `transact` retries a transaction that lost a conflict. */
export interface RetryPolicy {
  /** Tries in all, the first included. */
  attempts: number;
  /** The cap of the wait before the second try; it doubles for each later try, up to `maxDelayMs`. */
  baseDelayMs: number;
  maxDelayMs: number;
  /** [0, 1): the jitter's source (Math.random outside the tests). */
  random: () => number;
  sleep: (ms: number) => Promise<void>;
}

/**
 * Five tries, waits drawn from 0–20, 0–40, 0–80 and 0–160 ms: enough for the few transactions
 * that touch one hot row (a speed book, an operator's sync counter) at the same moment from
 * several nodes, and bounded, so a request never loops.
 */
export const DEFAULT_RETRY: RetryPolicy = {
  attempts: 5,
  baseDelayMs: 20,
  maxDelayMs: 400,
  random: Math.random,
  sleep: (ms) => new Promise((done) => setTimeout(done, ms)),
};

/** ER_LOCK_DEADLOCK: InnoDB's deadlock victim, and Galera's answer to a transaction that failed certification or was aborted by a replicated one. */
export const ER_LOCK_DEADLOCK = 1213;
/** ER_QUERY_INTERRUPTED: what a statement can meet when Galera aborts its transaction for a replicated one (a brute-force abort). */
export const ER_QUERY_INTERRUPTED = 1317;
const RETRYABLE = new Set([ER_LOCK_DEADLOCK, ER_QUERY_INTERRUPTED]);

/** The MariaDB error number behind `error` (Sequelize keeps the driver's error as `parent`/`original`). */
function errnoOf(error: unknown): number | undefined {
  for (let current: unknown = error, depth = 0; current && typeof current === 'object' && depth < 4; depth++) {
    const errno = (current as { errno?: unknown }).errno;
    if (typeof errno === 'number') return errno;
    current = (current as { parent?: unknown; original?: unknown }).parent ?? (current as { original?: unknown }).original;
  }
  return undefined;
}

/** True for a conflict that the whole transaction, run again, can get past (deadlock, certification failure). */
export function isRetryableConflict(error: unknown): boolean {
  const errno = errnoOf(error);
  return errno !== undefined && RETRYABLE.has(errno);
}

/** The wait before try `attempt` + 1 ("full jitter": uniform between 0 and the doubled cap). */
export function retryDelayMs(attempt: number, policy: Pick<RetryPolicy, 'baseDelayMs' | 'maxDelayMs' | 'random'>): number {
  const cap = Math.min(policy.maxDelayMs, policy.baseDelayMs * 2 ** (attempt - 1));
  return Math.floor(policy.random() * cap);
}

/**
 * Runs `work` in one transaction on `sequelize`: committed when it resolves, rolled back when it
 * throws. On a deadlock or a Galera certification failure (at any statement or at the commit)
 * the whole transaction runs again, at most `policy.attempts` times with a random wait between
 * tries (exponential back-off with full jitter); any other error, and the last conflict, reach
 * the caller unchanged. `work` must therefore be safe to run again: everything it does goes
 * through `transaction` (files and mail belong before or after it).
 */
export async function transactOn<T>(sequelize: Sequelize, work: (transaction: Transaction) => Promise<T>, policy: RetryPolicy = DEFAULT_RETRY): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await sequelize.transaction(work);
    } catch (error) {
      if (attempt >= policy.attempts || !isRetryableConflict(error)) throw error;
      await policy.sleep(retryDelayMs(attempt, policy));
    }
  }
}

/** `transactOn` the app's database with the default retry: the one transaction helper of the server. */
export function transact<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
  return transactOn(database(), work);
}
