/**
 * `npm start`: the whole product on this machine. Starts the private MariaDB (unless
 * DATABASE_URL names a server, which must then hold no operator but demo ones), migrates,
 * seeds the invented demo data, builds the web app,
 * serves it from supervised server processes (a process that dies is replaced) and prints the
 * URL. Ctrl-C stops the server and, if it started it, the database.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { openLocalDatabase, localSecrets, stopLocalInstance } from '../db/local';
import { projectRoot } from '../db/instance';
import { createMigrator } from '../db/migrator';
import { refuseRealOperatorDatabase } from './dev/demo-database-guard';
import { DEFAULT_DEMO_PASSWORD, seedDemo } from './dev/demo-seed';
import { createSequelize } from '../db/connection';
import { initModels } from './models';
import { startFakeSmtp, type FakeSmtp } from './dev/fake-smtp';
import { webConcurrency } from './main';
import { superviseWorkers } from './supervisor';

function step(text: string): void {
  console.log(`\u203a ${text}`);
}

async function launch(): Promise<void> {
  console.log('Speedwright DEMO (npm start): the invented demo operators are seeded, and without SMTP_URL mail goes to a local fake mailbox.');
  console.log('Not for an operator\'s own data: see README.md, "Running it for your operator" (npm run build, then npm run serve).\n');
  let stopDatabase = false;
  let databaseUrl = process.env['DATABASE_URL'];
  if (!databaseUrl) {
    step('Starting the private MariaDB instance');
    const local = await openLocalDatabase('dev', 'speedwright', { log: step });
    databaseUrl = local.url;
    stopDatabase = local.instance.startedHere;
  }

  step('Migrating and seeding the demo data (invented demo data — not for flight)');
  const sequelize = createSequelize(databaseUrl);
  initModels(sequelize);
  // A database named by DATABASE_URL may be an operator's real one; the private instance is the demo's own.
  if (process.env['DATABASE_URL']) {
    try {
      await refuseRealOperatorDatabase(sequelize);
    } catch (error) {
      await sequelize.close();
      throw error;
    }
  }
  await createMigrator(sequelize, undefined).up();
  await seedDemo(sequelize, process.env['DEMO_PASSWORD'] ?? DEFAULT_DEMO_PASSWORD, {
    signingKeySecret: process.env['SIGNING_KEY_SECRET'] ?? localSecrets().signingKeySecret,
  });
  await sequelize.close();

  // Without a real mail server, invitations and reset links land in a local mailbox that the
  // administrator can read in the app.
  let mailbox: FakeSmtp | undefined;
  if (!process.env['SMTP_URL']) {
    step('Starting the local fake mail server (nothing is delivered; messages are kept in .data/mailbox/)');
    mailbox = await startFakeSmtp({ dir: join(projectRoot, '.data', 'mailbox'), port: Number(process.env['FAKE_SMTP_PORT'] ?? 0) });
  }

  if (process.env['SKIP_BUILD'] !== '1') {
    step('Building the web app (production)');
    const build = spawnSync(process.execPath, [join(projectRoot, 'node_modules/@angular/cli/bin/ng.js'), 'build'], {
      cwd: projectRoot,
      stdio: 'inherit',
      // Fewer, larger initial chunks (Angular's chunk optimizer; DEVELOPERS.md, "A fast first visit").
      env: { ...process.env, NG_CLI_ANALYTICS: 'false', NG_BUILD_OPTIMIZE_CHUNKS: '1' },
    });
    if (build.status !== 0) throw new Error('The web app did not build; see the messages above.');
  }

  // The server runs in processes of its own under a supervisor that replaces one that dies
  // (server/supervisor.ts); WEB_CONCURRENCY of them, one by default.
  const supervisor = superviseWorkers({
    count: webConcurrency(process.env['WEB_CONCURRENCY']),
    exec: join(__dirname, 'main.ts'),
    env: {
      NODE_ENV: 'production',
      PUBLIC_URL: `http://localhost:${process.env['PORT'] ?? 4300}`,
      SESSION_SECRET: localSecrets().sessionSecret,
      SIGNING_KEY_SECRET: localSecrets().signingKeySecret,
      ...process.env,
      DATABASE_URL: databaseUrl,
      ...(mailbox ? { SMTP_URL: mailbox.url, MAILBOX_DIR: mailbox.dir } : {}),
      APP_DIST: process.env['APP_DIST'] ?? join(projectRoot, 'dist/app/browser'),
    },
  });
  const port = await supervisor.listening;
  console.log(`\nSpeedwright (demo) is running: http://localhost:${port}/`);
  console.log(`Demo accounts: pilot@demo.speedwright.example (and engineer@, approver@, admin@, inspector@), password ${process.env['DEMO_PASSWORD'] ? 'from DEMO_PASSWORD' : DEFAULT_DEMO_PASSWORD}`);
  if (mailbox) console.log('Mail goes to the local fake mailbox: sign in as admin@demo.speedwright.example to read it.');
  console.log('Press Ctrl-C to stop.\n');

  const shutdown = async () => {
    step('Stopping');
    await supervisor.stop();
    await mailbox?.stop();
    if (stopDatabase) await stopLocalInstance('dev');
    process.exit(0);
  };
  process.once('SIGINT', () => void shutdown());
  process.once('SIGTERM', () => void shutdown());
}

launch().catch((error: unknown) => {
  console.error(`\nSpeedwright could not start: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
