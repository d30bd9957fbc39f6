import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { isCardCode } from '@shared/card-check/card-code';
import { openLocalDatabase } from './local';
import { createMigrator } from './migrator';
import { createSequelize } from './connection';
import { initModels } from '../server/models';
import { seedDemo } from '../server/dev/demo-seed';

// Every migration must undo itself: up, all the way down, and up again, on a database of its
// own on the private test instance.
describe('migrations', () => {
  it('go up, all the way down, and up again', async () => {
    const { url } = await openLocalDatabase('test', 'speedwright_migrations_check', { fresh: true });
    const sequelize = createSequelize(url);
    try {
      const migrator = createMigrator(sequelize);
      const all = (await migrator.pending()).map((migration) => migration.name);
      expect(all.length).toBeGreaterThan(0);
      await migrator.up();
      expect(await migrator.pending()).toEqual([]);
      await migrator.down({ to: 0 });
      expect((await migrator.executed()).map((migration) => migration.name)).toEqual([]);
      await migrator.up();
      expect((await migrator.executed()).map((migration) => migration.name)).toEqual(all);
    } finally {
      await sequelize.close();
    }
  }, 120_000);
});

// Card log entries written before card codes existed get a valid, distinct code each.
describe('the card-code migration', () => {
  it('gives every existing card log entry its own valid code', async () => {
    const { url } = await openLocalDatabase('test', 'speedwright_migrations_codes', { fresh: true });
    const sequelize = createSequelize(url);
    try {
      const migrator = createMigrator(sequelize);
      await migrator.up({ to: '20261202-0601-sync-changes-and-currency-limit' });
      const ids = ['00000000-0000-4000-8000-000000000001', '00000000-0000-4000-8000-000000000002', '00000000-0000-4000-8000-000000000003'];
      await sequelize.transaction(async (transaction) => {
        // The entries alone, without their operator, people and fleet: foreign keys off for this connection.
        await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { type: QueryTypes.UPDATE, transaction });
        for (const id of ids) {
          await sequelize.query(
            "INSERT INTO card_issues (id, operator_id, issued_by_id, airframe_id, revision_id, inputs, digest, entry_sha256, issued_at, received_at) VALUES (?, 1, 1, 1, 1, '{}', REPEAT('a', 64), REPEAT('b', 64), NOW(3), NOW(3))",
            { type: QueryTypes.INSERT, replacements: [id], transaction },
          );
        }
        await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { type: QueryTypes.UPDATE, transaction });
      });
      await migrator.up();
      const rows = await sequelize.query<{ id: string; code: string }>('SELECT id, code FROM card_issues ORDER BY id', { type: QueryTypes.SELECT });
      expect(rows.map((row) => row.id)).toEqual(ids);
      for (const row of rows) expect(isCardCode(row.code)).toBe(true);
      expect(new Set(rows.map((row) => row.code)).size).toBe(3);
      await expect(
        sequelize.query("UPDATE card_issues SET code = ? WHERE id = ?", { type: QueryTypes.UPDATE, replacements: [rows[0].code, ids[1]] }),
      ).rejects.toBeInstanceOf(UniqueConstraintError);
    } finally {
      await sequelize.close();
    }
  }, 120_000);
});

// Revisions written before contributors were recorded get what the rows and the audit trail know:
// the author as creator, and whoever submitted them (security issue 12, finding 1).
describe('the revision-contributors migration', () => {
  it('gives every existing revision its author and, from the audit trail, its submitter', async () => {
    const { url } = await openLocalDatabase('test', 'speedwright_migrations_contributors', { fresh: true });
    const sequelize = createSequelize(url);
    try {
      initModels(sequelize);
      const migrator = createMigrator(sequelize);
      await migrator.up();
      await seedDemo(sequelize, 'migration-check-password', { signingKeySecret: 'migration-check-signing-key-secret-0123456789' });
      const recorded = await sequelize.query<{ revision_id: number; user_id: number; kind: string }>(
        'SELECT revision_id, user_id, kind FROM revision_contributors ORDER BY revision_id, user_id, kind',
        { type: QueryTypes.SELECT },
      );
      expect(recorded.length).toBeGreaterThan(0);

      // As if the seed had run before the table existed: down past it (table dropped), up again.
      await migrator.down({ to: '20261205-0801-revision-contributors' });
      await migrator.up();
      const backfilled = await sequelize.query<{ revision_id: number; user_id: number; kind: string }>(
        'SELECT revision_id, user_id, kind FROM revision_contributors ORDER BY revision_id, user_id, kind',
        { type: QueryTypes.SELECT },
      );
      const revisions = await sequelize.query<{ id: number; author_id: number }>('SELECT id, author_id FROM revisions', { type: QueryTypes.SELECT });
      for (const revision of revisions) expect(backfilled).toContainEqual({ revision_id: revision.id, user_id: revision.author_id, kind: 'created' });
      const submissions = await sequelize.query<{ entity_id: string; actor_id: number }>(
        "SELECT entity_id, actor_id FROM audit_events WHERE action = 'revision.submitted'",
        { type: QueryTypes.SELECT },
      );
      expect(submissions.length).toBeGreaterThan(0);
      for (const submission of submissions) expect(backfilled).toContainEqual({ revision_id: Number(submission.entity_id), user_id: submission.actor_id, kind: 'submitted' });
      // Everything the services recorded is found again from the rows and the audit trail.
      expect(backfilled).toEqual(recorded);
    } finally {
      await sequelize.close();
    }
  }, 180_000);
});

