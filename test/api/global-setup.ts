/**
 * Before the API tests: the private test MariaDB instance (its own data directory and port,
 * never the demo database), a fresh test database, migrations and the seed.
 */
import '../support/shared-alias';
import { rmSync, writeFileSync } from 'node:fs';
import { openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../../server/dev/demo-seed';
import { createSequelize } from '../../db/connection';
import { startFakeSmtp, type FakeSmtp } from '../../server/dev/fake-smtp';
import { initModels } from '../../server/models';
import { TEST_SIGNING_KEY_SECRET } from './constants';
import { API_TEST_DATABASE, apiTestAttachmentsDir, apiTestEnvFile, apiTestMailboxDir, TEST_PASSWORD } from './constants';

declare global {
  // The fake SMTP server lives in jest's main process for the whole run; teardown stops it.
  var speedwrightApiSmtp: FakeSmtp | undefined;
}

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
  rmSync(apiTestMailboxDir(), { recursive: true, force: true });
  rmSync(apiTestAttachmentsDir(), { recursive: true, force: true });
  const smtp = await startFakeSmtp({ dir: apiTestMailboxDir() });
  globalThis.speedwrightApiSmtp = smtp;
  writeFileSync(apiTestEnvFile(), JSON.stringify({ url, startedHere, smtpUrl: smtp.url }));
}
