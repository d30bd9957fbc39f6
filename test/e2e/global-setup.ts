/**
 * Before the end-to-end tests: a fresh e2e database on the private test instance, migrated
 * and seeded, and the real server (production build of the app) on a free loopback port.
 *
 * The server runs in a process of its own: jest's main process also runs the API tests'
 * global setup, which binds the shared Sequelize models to a connection it then closes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { localSecrets, openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../../db/seed';
import { createSequelize } from '../../server/database';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
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
  const port = await freePort();
  const server = spawn(process.execPath, ['--import', 'tsx', join(projectRoot, 'server/main.ts')], {
    cwd: projectRoot,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: {
    ...process.env,
    NODE_ENV: 'test',
    SMTP_URL: smtp.url,
    MAILBOX_DIR: mailboxDir,
    ATTACHMENTS_DIR: join(projectRoot, '.data', 'attachments-e2e'),
    PORT: String(port),
    HOST: '127.0.0.1',
    DATABASE_URL: url,
    SESSION_SECRET: localSecrets().sessionSecret,
    SIGNING_KEY_SECRET: localSecrets().signingKeySecret,
    LOG_LEVEL: 'warn',
    LOGIN_RATE_LIMIT_PER_15_MIN: '1000',
    APP_DIST: join(projectRoot, 'dist/app/browser'),
    },
  });
  const baseUrl = `http://localhost:${port}`;
  await waitUntilHealthy(server, baseUrl);
  const stop = async () => {
    await stopProcess(server);
    await smtp.stop();
  };
  globalThis.speedwrightE2e = { stop, startedDb: instance.startedHere };
  process.env['E2E_BASE_URL'] = baseUrl;
  writeFileSync(join(projectRoot, '.data', 'e2e-env.json'), JSON.stringify({ baseUrl }));
}

/** A free loopback port (the benchmarks use it too). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

/** Waits until the server child process answers /api/health (60 s at most). */
export async function waitUntilHealthy(server: ChildProcess, baseUrl: string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`The e2e server exited with code ${server.exitCode}.`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((done) => setTimeout(done, 200));
  }
  server.kill('SIGKILL');
  throw new Error('The e2e server did not answer /api/health within 60 s.');
}

/** SIGTERM, then SIGKILL after 10 s. */
export function stopProcess(server: ChildProcess): Promise<void> {
  if (server.exitCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const kill = setTimeout(() => server.kill('SIGKILL'), 10_000);
    server.once('exit', () => {
      clearTimeout(kill);
      resolve();
    });
    server.kill('SIGTERM');
  });
}
