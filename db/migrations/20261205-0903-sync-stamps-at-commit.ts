import { QueryTypes } from 'sequelize';
import type { Migration } from '../migration';

/** The tables whose rows a device syncs (as in migration 20261202-0601). */
const SYNCED = ['aircraft_types', 'airframes', 'revisions'];

/**
 * The change number of a synced row comes from the operator's row of `sync_counters`, bumped in
 * the writing transaction, instead of a database SEQUENCE. The counter row stays locked until the
 * transaction ends (and on a Galera cluster, two nodes that bump it at once conflict at
 * certification, so one of them retries), so change numbers of one operator are handed out in
 * commit order: a sync can never see a number while a smaller one is still uncommitted. A
 * sequence hands numbers out at write time, outside the transaction, which let a sync skip a
 * slow transaction; Galera also restricts sequences (MariaDB's "Galera Cluster Known
 * Limitations"). server/sync/sync-cursor.ts and DEVELOPERS.md ("The sync cursor") explain it.
 *
 * Devices keep their cursors: every operator's counter starts at the largest number handed out so
 * far, so every later number is larger than any cursor a device holds.
 */
export const up: Migration = async ({ context: queryInterface }) => {
  // Not QueryTypes.RAW: Sequelize 6 then deletes the mariadb connector's `meta` (DEVELOPERS.md, pitfalls).
  const sql = (text: string) => queryInterface.sequelize.query(text, { type: QueryTypes.UPDATE });
  await sql(
    'CREATE TABLE sync_counters (operator_id INT UNSIGNED NOT NULL PRIMARY KEY, last_change BIGINT UNSIGNED NOT NULL, ' +
      'CONSTRAINT sync_counters_operator FOREIGN KEY (operator_id) REFERENCES operators (id) ON DELETE CASCADE) ENGINE=InnoDB',
  );
  const highest = SYNCED.map((table) => `(SELECT COALESCE(MAX(change_seq), 0) FROM ${table})`).join(', ');
  await sql(`INSERT INTO sync_counters (operator_id, last_change) SELECT id, GREATEST(${highest}) FROM operators`);
  for (const table of SYNCED) {
    await sql(`DROP TRIGGER IF EXISTS ${table}_change_seq_insert`);
    await sql(`DROP TRIGGER IF EXISTS ${table}_change_seq_update`);
    for (const event of ['insert', 'update']) {
      await sql(
        `CREATE TRIGGER ${table}_change_seq_${event} BEFORE ${event.toUpperCase()} ON ${table} FOR EACH ROW BEGIN ` +
          'INSERT INTO sync_counters (operator_id, last_change) VALUES (NEW.operator_id, 1) ON DUPLICATE KEY UPDATE last_change = last_change + 1; ' +
          'SET NEW.change_seq = (SELECT last_change FROM sync_counters WHERE operator_id = NEW.operator_id); ' +
          'END',
      );
    }
  }
  await sql('DROP SEQUENCE IF EXISTS sync_change_seq');
};

export const down: Migration = async ({ context: queryInterface }) => {
  const sql = (text: string) => queryInterface.sequelize.query(text, { type: QueryTypes.UPDATE });
  const [row] = await queryInterface.sequelize.query<{ next: number }>('SELECT COALESCE(MAX(last_change), 0) + 1 AS next FROM sync_counters', { type: QueryTypes.SELECT });
  await sql(`CREATE SEQUENCE sync_change_seq START WITH ${Number(row?.next ?? 1)} INCREMENT BY 1 NOCACHE`);
  for (const table of SYNCED) {
    for (const event of ['insert', 'update']) {
      await sql(`DROP TRIGGER IF EXISTS ${table}_change_seq_${event}`);
      await sql(`CREATE TRIGGER ${table}_change_seq_${event} BEFORE ${event.toUpperCase()} ON ${table} FOR EACH ROW SET NEW.change_seq = NEXT VALUE FOR sync_change_seq`);
    }
  }
  await sql('DROP TABLE sync_counters');
};
