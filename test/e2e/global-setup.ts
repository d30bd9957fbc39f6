/**
 * Before the end-to-end tests: a fresh e2e database on the private test instance, migrated
 * and seeded, and the real server (production build of the app) on a free loopback port.
 */
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { localSecrets, openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../../db/seed';
import { createSequelize } from '../../server/database';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { serve } from '../../server/main';
import { initModels } from '../../server/models';
import { E2E_PASSWORD } from './constants';

declare global {
  // eslint-disable-next-line no-var
  var speedwrightE2e: { stop(): Promise<void>; startedDb: boolean } | undefined;
}

export default async function globalSetup(): Promise<void> {
  const { url, instance } = await openLocalDatabase('test', 'speedwright_e2e_test', { fresh: true });
  const sequelize = createSequelize(url);
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize, E2E_PASSWORD, { signingKeySecret: localSecrets().signingKeySecret });
  await sequelize.close();

  // Mail of the e2e run lands here; tests read it with readMailbox() and follow the links
  // (PUBLIC_URL stays at its default, so they take the path and token and use E2E_BASE_URL).
  const mailboxDir = join(projectRoot, '.data', 'mailbox-e2e');
  rmSync(mailboxDir, { recursive: true, force: true });
  const smtp = await startFakeSmtp({ dir: mailboxDir });
  const server = await serve({
    NODE_ENV: 'test',
    SMTP_URL: smtp.url,
    MAILBOX_DIR: mailboxDir,
    ATTACHMENTS_DIR: join(projectRoot, '.data', 'attachments-e2e'),
    PORT: '0',
    HOST: '127.0.0.1',
    DATABASE_URL: url,
    SESSION_SECRET: localSecrets().sessionSecret,
    SIGNING_KEY_SECRET: localSecrets().signingKeySecret,
    LOG_LEVEL: 'warn',
    LOGIN_RATE_LIMIT_PER_15_MIN: '1000',
    APP_DIST: join(projectRoot, 'dist/app/browser'),
  });
  const stop = async () => {
    await server.stop();
    await smtp.stop();
  };
  globalThis.speedwrightE2e = { stop, startedDb: instance.startedHere };
  const baseUrl = `http://localhost:${server.port}`;
  process.env['E2E_BASE_URL'] = baseUrl;
  writeFileSync(join(projectRoot, '.data', 'e2e-env.json'), JSON.stringify({ baseUrl }));
}
