import { openLocalDatabase } from './local';
import { createMigrator } from './migrator';
import { createSequelize } from '../server/database';

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
