/**
 * The real Speedwright server (production build of the app) on a free loopback port, against
 * a fresh database of its own on the private test instance, migrated and seeded with the demo
 * data. Used by the end-to-end tests' global setup and by the benchmarks that drive Chromium.
 *
 * The server runs in a process of its own: jest's main process also runs the API tests'
 * global setup, which binds the shared Sequelize models to a connection it then closes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { projectRoot } from '../../db/instance';
import { localSecrets, openLocalDatabase } from '../../db/local';
import { createMigrator } from '../../db/migrator';
import { seedDemo } from '../../server/dev/demo-seed';
import { createSequelize } from '../../db/connection';
import { startFakeSmtp } from '../../server/dev/fake-smtp';
import { initModels } from '../../server/models';

export interface AppServerOptions {
  /** Database on the test instance, dropped and created afresh. */
  database: string;
  /** Password of every demo person. */
  password: string;
  /** Short name for the folders under .data/ (mailbox-<name>, attachments-<name>). */
  name: string;
  logLevel?: string;
}

export interface AppServer {
  baseUrl: string;
  mailboxDir: string;
  /** Whether the test instance was started here (then the caller stops it at the end). */
  startedDb: boolean;
  stop(): Promise<void>;
}

export async function startAppServer({ database, password, name, logLevel = 'warn' }: AppServerOptions): Promise<AppServer> {
  const { url, instance } = await openLocalDatabase('test', database, { fresh: true });
  const sequelize = createSequelize(url);
  initModels(sequelize);
  await createMigrator(sequelize).up();
  await seedDemo(sequelize, password, { signingKeySecret: localSecrets().signingKeySecret });
  await sequelize.close();

  // Mail lands here; tests read it with readMailbox() and follow the links (PUBLIC_URL stays at
  // its default, so they take the path and token and use the base URL).
  const mailboxDir = join(projectRoot, '.data', `mailbox-${name}`);
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
      ATTACHMENTS_DIR: join(projectRoot, '.data', `attachments-${name}`),
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: url,
      SESSION_SECRET: localSecrets().sessionSecret,
      SIGNING_KEY_SECRET: localSecrets().signingKeySecret,
      LOG_LEVEL: logLevel,
      LOGIN_RATE_LIMIT_PER_15_MIN: '1000',
      APP_DIST: join(projectRoot, 'dist/app/browser'),
    },
  });
  const baseUrl = `http://localhost:${port}`;
  await waitUntilHealthy(server, baseUrl);
  return {
    baseUrl,
    mailboxDir,
    startedDb: instance.startedHere,
    async stop() {
      await stopProcess(server);
      await smtp.stop();
    },
  };
}

/** A free loopback port. */
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
    if (server.exitCode !== null) throw new Error(`The server exited with code ${server.exitCode}.`);
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((done) => setTimeout(done, 200));
  }
  server.kill('SIGKILL');
  throw new Error('The server did not answer /api/health within 60 s.');
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
