/**
 * What a backup or restore asks of the database itself, through a Sequelize instance of its own
 * (the CLI is not the server: no models are registered). Reads go through information_schema,
 * so the account needs no more than the rights the server's own account has on its database.
 */
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { createSequelize, parseDatabaseUrl } from '../../db/connection';
import { DomainError } from '../errors/domain-error';

/**
 * The per-operator counter rows that number synced rows (migration 20261205-0903;
 * server/sync/sync-cursor.ts): `last_change` is the last number handed out for the operator.
 */
export const SYNC_COUNTERS = 'sync_counters';
/** The column the counters' triggers stamp on every synced table. */
export const SYNC_STAMP_COLUMN = 'change_seq';

const ER_BAD_DB = 1049;
const ER_ACCESS_DENIED = 1045;
const ER_DBACCESS_DENIED = 1044;

/**
 * A connection to the database of `databaseUrl`, proven with a query.
 * @throws DomainError (unavailable) with a sentence when the server, the account or the database is not there
 */
export async function openDatabase(databaseUrl: string): Promise<Sequelize> {
  const { host, port, database, username } = parseDatabaseUrl(databaseUrl);
  const sequelize = createSequelize(databaseUrl);
  try {
    await sequelize.authenticate();
    return sequelize;
  } catch (error) {
    await sequelize.close().catch(() => undefined);
    const errno = (error as { parent?: { errno?: number }; original?: { errno?: number } }).parent?.errno;
    const create = `CREATE DATABASE \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`;
    if (errno === ER_BAD_DB) {
      throw new DomainError('unavailable', 'database_missing', `There is no database ${database} on ${host}:${port}: create it empty (${create}) and give ${username} all rights on it.`);
    }
    if (errno === ER_DBACCESS_DENIED) {
      throw new DomainError(
        'unavailable',
        'database_access_denied',
        `The account ${username} may not use the database ${database} on ${host}:${port}, or there is no such database: create it empty (${create}) and give ${username} all rights on it.`,
      );
    }
    if (errno === ER_ACCESS_DENIED) {
      throw new DomainError('unavailable', 'database_access_denied', `MariaDB on ${host}:${port} refused the account ${username}: check the user and password in DATABASE_URL.`);
    }
    throw new DomainError('unavailable', 'database_unreachable', `MariaDB does not answer on ${host}:${port}: start it, or check the host and port in DATABASE_URL.`);
  }
}

const select = <T extends object>(sequelize: Sequelize, sql: string, replacements: unknown[] = []) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });

// Not QueryTypes.RAW: Sequelize 6 then deletes the mariadb connector's non-configurable `meta`
// and throws (DEVELOPERS.md, pitfalls); UPDATE reads only affectedRows.
const execute = (sequelize: Sequelize, sql: string, transaction?: Transaction, replacements: unknown[] = []) =>
  sequelize.query(sql, { type: QueryTypes.UPDATE, replacements, ...(transaction ? { transaction } : {}) });

const quoted = (name: string) => `\`${name.replace(/`/g, '``')}\``;

export interface DatabaseObjects {
  /** Tables, views and sequences (triggers belong to their tables). */
  tables: number;
  routines: number;
  events: number;
}

/** How many objects the connected database holds: all zero for an empty one. */
export async function databaseObjects(sequelize: Sequelize): Promise<DatabaseObjects> {
  const [row] = await select<{ tables: number; routines: number; events: number }>(
    sequelize,
    `SELECT (SELECT COUNT(*) FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE()) AS tables,
            (SELECT COUNT(*) FROM information_schema.ROUTINES WHERE ROUTINE_SCHEMA = DATABASE()) AS routines,
            (SELECT COUNT(*) FROM information_schema.EVENTS WHERE EVENT_SCHEMA = DATABASE()) AS events`,
  );
  return { tables: Number(row?.tables ?? 0), routines: Number(row?.routines ?? 0), events: Number(row?.events ?? 0) };
}

/** The names in umzug's `schema_migrations` table, oldest first (none when there is no such table). */
export async function appliedMigrations(sequelize: Sequelize): Promise<string[]> {
  const [exists] = await select<{ n: number }>(sequelize, "SELECT COUNT(*) AS n FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'schema_migrations'");
  if (!Number(exists?.n)) return [];
  const rows = await select<{ name: string }>(sequelize, 'SELECT name FROM schema_migrations ORDER BY name');
  return rows.map((row) => row.name);
}

export async function serverVersion(sequelize: Sequelize): Promise<string> {
  const [row] = await select<{ version: string }>(sequelize, 'SELECT VERSION() AS version');
  return row?.version ?? '';
}

/**
 * Drops every object of the connected database: how a failed restore hands back the empty
 * database it was given. Only ever called on a database the restore found empty.
 */
export async function dropEverything(sequelize: Sequelize): Promise<void> {
  const objects = await select<{ name: string; type: string }>(
    sequelize,
    `SELECT TABLE_NAME AS name, TABLE_TYPE AS type FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE()
     UNION ALL SELECT ROUTINE_NAME, ROUTINE_TYPE FROM information_schema.ROUTINES WHERE ROUTINE_SCHEMA = DATABASE()
     UNION ALL SELECT EVENT_NAME, 'EVENT' FROM information_schema.EVENTS WHERE EVENT_SCHEMA = DATABASE()`,
  );
  const statement = ({ type }: { type: string }) =>
    ({ VIEW: 'DROP VIEW IF EXISTS', SEQUENCE: 'DROP SEQUENCE IF EXISTS', PROCEDURE: 'DROP PROCEDURE IF EXISTS', FUNCTION: 'DROP FUNCTION IF EXISTS', EVENT: 'DROP EVENT IF EXISTS' })[type] ??
    'DROP TABLE IF EXISTS';
  // One connection, so that switching the foreign-key checks off holds for every drop.
  await sequelize.transaction(async (transaction) => {
    await execute(sequelize, 'SET FOREIGN_KEY_CHECKS = 0', transaction);
    for (const object of objects) await execute(sequelize, `${statement(object)} ${quoted(object.name)}`, transaction);
    await execute(sequelize, 'SET FOREIGN_KEY_CHECKS = 1', transaction);
  });
}

/**
 * How far a restore moves the sync numbering past what the backup had. Restored rows keep their
 * numbers, so a device whose cursor is older than the backup gets exactly the changes after its
 * cursor. But a backup restored after a loss is older than the last sync some devices made: their
 * cursors lie beyond the backup's numbers, and a change after the restore numbered from the
 * backup's counters (a withdrawal, say) would fall at or below such a cursor and never reach
 * them. Numbering after the restore starts this far on, far more than the changes a server makes
 * between two backups (a billion: years of writes at ten a second), so every cursor handed out
 * before the loss is below it. The cursor format carries up to 16 digits (server/sync/sync-cursor.ts).
 */
export const RESTORE_SEQUENCE_GAP = 1_000_000_000;

/**
 * Moves every operator's sync counter beyond every stamped row and every cursor handed out before
 * the backup was restored: `last_change` becomes the larger of its dumped value and the
 * operator's highest stamp, plus `gap` (an operator without a counter row gets one). A device's
 * next sync then neither misses a change made after the restore nor gets one twice.
 * @returns each operator's next change number (operator id → number), or null when the database has no counters
 */
export async function continueSyncNumbering(sequelize: Sequelize, gap = RESTORE_SEQUENCE_GAP): Promise<Record<string, number> | null> {
  const [counters] = await select<{ n: number }>(
    sequelize,
    "SELECT COUNT(*) AS n FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? AND TABLE_TYPE = 'BASE TABLE'",
    [SYNC_COUNTERS],
  );
  if (!Number(counters?.n)) return null;
  const stamped = await select<{ name: string }>(
    sequelize,
    "SELECT c.TABLE_NAME AS name FROM information_schema.COLUMNS c JOIN information_schema.TABLES t ON t.TABLE_SCHEMA = c.TABLE_SCHEMA AND t.TABLE_NAME = c.TABLE_NAME AND t.TABLE_TYPE = 'BASE TABLE' WHERE c.TABLE_SCHEMA = DATABASE() AND c.COLUMN_NAME = ? ORDER BY c.TABLE_NAME",
    [SYNC_STAMP_COLUMN],
  );
  // One statement: each operator's highest stamp over the synced tables, its counter, and the new value.
  const highest = stamped.length
    ? `GREATEST(0, ${stamped.map(({ name }) => `COALESCE((SELECT MAX(${quoted(SYNC_STAMP_COLUMN)}) FROM ${quoted(name)} WHERE operator_id = o.id), 0)`).join(', ')})`
    : '0';
  await execute(
    sequelize,
    `INSERT INTO ${quoted(SYNC_COUNTERS)} (operator_id, last_change) SELECT o.id, ${highest} + ? FROM operators o ` +
      `ON DUPLICATE KEY UPDATE last_change = GREATEST(${quoted(SYNC_COUNTERS)}.last_change, VALUES(last_change) - ?) + ?`,
    undefined,
    [gap, gap, gap],
  );
  return nextSyncNumbers(sequelize);
}

/** The change number each operator's next synced write would take (operator id → number), without taking it. */
export async function nextSyncNumbers(sequelize: Sequelize): Promise<Record<string, number>> {
  const rows = await select<{ operatorId: number; next: number }>(sequelize, `SELECT operator_id AS operatorId, last_change + 1 AS next FROM ${quoted(SYNC_COUNTERS)} ORDER BY operator_id`);
  return Object.fromEntries(rows.map((row) => [String(row.operatorId), Number(row.next)]));
}
