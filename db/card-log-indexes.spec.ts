import { QueryTypes } from 'sequelize';
import { openLocalDatabase } from './local';
import { createMigrator } from './migrator';
import { createSequelize } from './connection';

// The card log's page by airframe (server/cards/card-issues.service.ts, listCardIssues) is read
// along one index, newest first, without sorting the airframe's entries (issue 15 part 5;
// `npm run bench:scale` measures it at 1 M entries). Both directions of the migration are checked.
describe('the card log index by airframe and issue time', () => {
  it('serves the airframe page without a sort, and the migration undoes itself', async () => {
    const { url } = await openLocalDatabase('test', 'speedwright_card_log_indexes', { fresh: true });
    const sequelize = createSequelize(url);
    const indexes = async () =>
      (
        await sequelize.query<{ name: string; columns: string }>(
          `SELECT index_name AS name, GROUP_CONCAT(column_name ORDER BY seq_in_index) AS columns FROM information_schema.statistics
           WHERE table_schema = DATABASE() AND table_name = 'card_issues' GROUP BY index_name`,
          { type: QueryTypes.SELECT },
        )
      ).reduce<Record<string, string>>((all, row) => ({ ...all, [row.name]: row.columns }), {});
    try {
      const migrator = createMigrator(sequelize);
      await migrator.up();
      const after = await indexes();
      expect(after['card_issues_operator_id_airframe_id_issued_at']).toBe('operator_id,airframe_id,issued_at');
      expect(after['card_issues_operator_id_airframe_id']).toBeUndefined();

      // The query's shape as listCardIssues sends it for one airframe, newest first, one page.
      const plan = await sequelize.query<{ table: string; key: string | null; Extra: string | null }>(
        'EXPLAIN SELECT id FROM card_issues WHERE operator_id = 1 AND airframe_id = 2 ORDER BY issued_at DESC, id DESC LIMIT 51',
        { type: QueryTypes.SELECT },
      );
      expect(plan[0]!.key).toBe('card_issues_operator_id_airframe_id_issued_at');
      expect(plan[0]!.Extra ?? '').not.toMatch(/filesort/i);

      await migrator.down({ to: '20261205-1001-card-log-airframe-time-index' });
      const before = await indexes();
      expect(before['card_issues_operator_id_airframe_id']).toBe('operator_id,airframe_id');
      expect(before['card_issues_operator_id_airframe_id_issued_at']).toBeUndefined();
    } finally {
      await sequelize.close();
    }
  }, 120_000);
});
