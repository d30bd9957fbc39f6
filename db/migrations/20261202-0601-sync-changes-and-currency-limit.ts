import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/** The tables whose rows a device syncs; each row carries the change number of its last write. */
const SYNCED = ['aircraft_types', 'airframes', 'revisions'];

/**
 * The operator's currency limit, and a change number on every synced row for `GET /api/sync`.
 * The change number comes from one database sequence through triggers, so every insert or
 * update (through a model, a bulk update or raw SQL) takes a fresh, strictly larger number;
 * see server/sync/sync-cursor.ts for why a counter rather than `updated_at`.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  // Not QueryTypes.RAW: Sequelize 6 then deletes the mariadb connector's non-configurable
  // `meta` and throws (DEVELOPERS.md, pitfalls); UPDATE only reads affectedRows.
  const sql = (text: string) => queryInterface.sequelize.query(text, { type: QueryTypes.UPDATE });
  await queryInterface.addColumn('operators', 'currency_limit_days', { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 30 });
  await sql('CREATE SEQUENCE sync_change_seq START WITH 1 INCREMENT BY 1 NOCACHE');
  for (const table of SYNCED) {
    await queryInterface.addColumn(table, 'change_seq', { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, defaultValue: 0 });
    await sql(`UPDATE ${table} SET change_seq = NEXT VALUE FOR sync_change_seq ORDER BY updated_at, id`);
    await queryInterface.addIndex(table, ['operator_id', 'change_seq'], { name: `${table}_operator_change_seq` });
    await sql(`CREATE TRIGGER ${table}_change_seq_insert BEFORE INSERT ON ${table} FOR EACH ROW SET NEW.change_seq = NEXT VALUE FOR sync_change_seq`);
    await sql(`CREATE TRIGGER ${table}_change_seq_update BEFORE UPDATE ON ${table} FOR EACH ROW SET NEW.change_seq = NEXT VALUE FOR sync_change_seq`);
  }
};

export const down: Migration = async ({ context: queryInterface }) => {
  // Not QueryTypes.RAW: Sequelize 6 then deletes the mariadb connector's non-configurable
  // `meta` and throws (DEVELOPERS.md, pitfalls); UPDATE only reads affectedRows.
  const sql = (text: string) => queryInterface.sequelize.query(text, { type: QueryTypes.UPDATE });
  for (const table of SYNCED) {
    await sql(`DROP TRIGGER IF EXISTS ${table}_change_seq_insert`);
    await sql(`DROP TRIGGER IF EXISTS ${table}_change_seq_update`);
    // Plain ALTER TABLE: queryInterface.removeColumn first runs a RAW foreign-key lookup, which
    // meets the same connector `meta` problem.
    await sql(`ALTER TABLE ${table} DROP INDEX ${table}_operator_change_seq, DROP COLUMN change_seq`);
  }
  await sql('DROP SEQUENCE IF EXISTS sync_change_seq');
  await sql('ALTER TABLE operators DROP COLUMN currency_limit_days');
};
