import { QueryTypes } from 'sequelize';
import { createSequelize } from '../../db/connection';
import { openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { realOperatorCount, refuseRealOperatorDatabase } from './demo-database-guard';

// npm start's launcher may seed the demo into a database of its own or a demo one, never into
// one that holds a real operator; on a database of its own on the private test instance.
describe('the demo database guard', () => {
  it('lets the demo seed an empty or demo database and refuses one with a real operator', async () => {
    const { url } = await openLocalDatabase('test', 'speedwright_demo_guard_check', { fresh: true });
    const sequelize = createSequelize(url);
    try {
      await expect(realOperatorCount(sequelize)).resolves.toBe(0);
      await createMigrator(sequelize).up();
      const insert = (slug: string, isDemo: number) =>
        sequelize.query('INSERT INTO operators (slug, name, is_demo, created_at, updated_at) VALUES (?, ?, ?, NOW(), NOW())', {
          replacements: [slug, `${slug} (invented)`, isDemo],
          type: QueryTypes.INSERT,
        });
      await insert('guard-demo', 1);
      await expect(refuseRealOperatorDatabase(sequelize)).resolves.toBeUndefined();
      await insert('guard-real', 0);
      await expect(refuseRealOperatorDatabase(sequelize)).rejects.toThrow(
        'DATABASE_URL names a database with 1 operator of its own; the demo (npm start, npm run db:seed) would add the invented demo operators there.',
      );
    } finally {
      await sequelize.close();
    }
  }, 120_000);
});
