/**
 * `npm run db:seed`: the invented demo data (invented demo data — not for flight) in the private
 * development database, or in the server DATABASE_URL names. It seeds through the server's own
 * services (the revisions are written, submitted and approved as people would), so it lives with
 * the server and not in `db/`.
 */
import { createSequelize } from '../../db/connection';
import { openLocalDatabase } from '../../db/local';
import { initModels } from '../models';
import { refuseRealOperatorDatabase } from './demo-database-guard';
import { DEFAULT_DEMO_PASSWORD, seedDemo } from './demo-seed';

async function seed(): Promise<void> {
  const url = process.env['DATABASE_URL'] ?? (await openLocalDatabase('dev', 'speedwright')).url;
  const sequelize = createSequelize(url);
  initModels(sequelize);
  try {
    if (process.env['DATABASE_URL']) await refuseRealOperatorDatabase(sequelize);
    await seedDemo(sequelize, process.env['DEMO_PASSWORD'] ?? DEFAULT_DEMO_PASSWORD);
    console.log('Demo data seeded (invented demo data — not for flight).');
  } finally {
    await sequelize.close();
  }
}

seed().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
