import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from './connection';

/**
 * Galera replicates row changes by primary key; a table without one is not safely replicated
 * (MariaDB's "Galera Cluster Known Limitations": "All tables should have a primary key"), and
 * every table must be InnoDB (the only engine Galera replicates). Checked on the migrated test
 * database, so a later migration that forgets either fails here.
 */
let sequelize: Sequelize;
beforeAll(() => {
  sequelize = createSequelize(process.env['DATABASE_URL']!);
});
afterAll(() => sequelize.close());

describe('every table of the migrated database', () => {
  it('has a primary key (sessions and rate-limit counters included)', async () => {
    const tables = await sequelize.query<{ name: string; hasPrimaryKey: number }>(
      `SELECT t.TABLE_NAME AS name,
              EXISTS (SELECT 1 FROM information_schema.TABLE_CONSTRAINTS c
                       WHERE c.TABLE_SCHEMA = t.TABLE_SCHEMA AND c.TABLE_NAME = t.TABLE_NAME AND c.CONSTRAINT_TYPE = 'PRIMARY KEY') AS hasPrimaryKey
         FROM information_schema.TABLES t
        WHERE t.TABLE_SCHEMA = DATABASE() AND t.TABLE_TYPE = 'BASE TABLE' AND t.TABLE_NAME NOT LIKE 'retry\\_probe\\_%'`,
      { type: QueryTypes.SELECT },
    );
    const names = tables.map((table) => table.name);
    // The check is only worth something if it saw the tables it is about.
    expect(names).toEqual(expect.arrayContaining(['sessions', 'rate_limit_hits', 'schema_migrations', 'sync_counters', 'card_issues', 'revisions']));
    expect(tables.filter((table) => !Number(table.hasPrimaryKey)).map((table) => table.name)).toEqual([]);
  });

  it('is InnoDB, and the database holds no SEQUENCE, which Galera restricts', async () => {
    const rows = await sequelize.query<{ name: string; engine: string | null; type: string }>(
      "SELECT TABLE_NAME AS name, ENGINE AS engine, TABLE_TYPE AS type FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE IN ('BASE TABLE', 'SEQUENCE')",
      { type: QueryTypes.SELECT },
    );
    expect(rows.filter((row) => row.type === 'SEQUENCE').map((row) => row.name)).toEqual([]);
    expect(rows.filter((row) => row.engine !== 'InnoDB').map((row) => `${row.name} (${row.engine})`)).toEqual([]);
  });
});
