import { createPool, createPoolCluster, type Pool, type PoolCluster, type PoolConfig } from 'mariadb';
import { DomainError } from '../errors/domain-error';
import { parseDatabaseUrl } from '../../db/connection';

/** Prepared-statement reads on a small pool of their own, for the public card check. */
export interface ReadPool {
  /** The first row of `sql` (a prepared statement), or undefined when there is none. */
  firstRow<T>(sql: string, values: unknown[]): Promise<T | undefined>;
  /** Closes the pool's connections (none are open before the first read). */
  close(): Promise<void>;
}

function poolConfig(url: string): PoolConfig {
  const { host, port, username, password, database } = parseDatabaseUrl(url);
  return {
    host,
    port,
    user: username,
    password,
    database,
    // As the Sequelize instance's connections (server/database.ts): UTC, numbers as numbers.
    timezone: '+00:00',
    bigIntAsNumber: true,
    insertIdAsNumber: true,
    decimalAsNumber: true,
    connectTimeout: 5000,
    acquireTimeout: 10_000,
    connectionLimit: 4,
    // No connection is held while the route is idle (nor in a test that never checks a card).
    minimumIdle: 0,
    idleTimeout: 60,
  };
}

const unavailable = () => new DomainError('unavailable', 'database_unavailable', 'The database is not reachable right now. Try again shortly.');

/**
 * A read pool on the replicas when `readUrls` name any (round robin), else on the primary. It is
 * the mariadb connector's public pool: its binary protocol with a per-connection statement cache
 * costs about half the CPU of `sequelize.query` on the card check (measured with the verify
 * benchmark's query). A broken or unreachable connection answers 503, like the error middleware
 * does for Sequelize's connection errors.
 */
export function createReadPool(databaseUrl: string, readUrls: string[] = []): ReadPool {
  let pool: Pool | PoolCluster | undefined;
  const open = (): Pool | PoolCluster => {
    if (pool) return pool;
    if (readUrls.length === 0) return (pool = createPool(poolConfig(databaseUrl)));
    const cluster = createPoolCluster({ defaultSelector: 'RR', removeNodeErrorCount: Infinity });
    readUrls.forEach((url, index) => cluster.add(`replica-${index}`, poolConfig(url)));
    return (pool = cluster);
  };
  return {
    async firstRow<T>(sql: string, values: unknown[]): Promise<T | undefined> {
      let connection;
      try {
        connection = await open().getConnection();
      } catch {
        throw unavailable();
      }
      try {
        const rows = (await connection.execute(sql, values)) as T[];
        return rows[0];
      } catch (error) {
        if ((error as { fatal?: boolean }).fatal) throw unavailable();
        throw error;
      } finally {
        await connection.release();
      }
    },
    async close(): Promise<void> {
      const closing = pool;
      pool = undefined;
      await closing?.end();
    },
  };
}
