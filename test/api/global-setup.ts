/**
 * Before the API tests: the private test MariaDB instance (its own data directory and port,
 * never the demo database), a fresh test database, migrations and the seed.
 */
import { writeFileSync } from 'node:fs';
import { openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../../db/seed';
import { createSequelize } from '../../server/database';
import { initModels } from '../../server/models';
import { TEST_SIGNING_KEY_SECRET } from './constants';
import { API_TEST_DATABASE, apiTestEnvFile, TEST_PASSWORD } from './constants';


export default async function globalSetup(): Promise<void> {
  let url = process.env['TEST_DATABASE_URL'];
  let startedHere = false;
  if (!url) {
    const local = await openLocalDatabase('test', API_TEST_DATABASE, { fresh: true });
    url = local.url;
    startedHere = local.instance.startedHere;
  }
  const sequelize = createSequelize(url);
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize, TEST_PASSWORD, { signingKeySecret: TEST_SIGNING_KEY_SECRET });
  await sequelize.close();
  writeFileSync(apiTestEnvFile(), JSON.stringify({ url, startedHere }));
}
