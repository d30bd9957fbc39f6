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

/**
 * Runs `work` in one transaction on the app's database: committed when it resolves, rolled back
 * when it throws. The seam for a cluster's certification failures: a retry of `work` on a
 * deadlock or a certification conflict belongs here, in this one place (not implemented: a single
 * MariaDB server needs none).
 */
export function transact<T>(work: (transaction: Transaction) => Promise<T>): Promise<T> {
  return database().transaction(work);
}
