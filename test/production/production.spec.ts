/**
 * The production path end to end (issue 14): the build installed with production dependencies
 * only into a temporary folder (`production-copy.ts`), its configuration check, `npm run serve`
 * against a fresh MariaDB database, readiness before and after `npm run migrate`, the web app,
 * no demo data, and a graceful stop. The tests run in order and share the installed copy and
 * the server; further steps (the operator commands, key rotation) go between "migrates" and
 * "stops", using `server`, `copy` and `runInCopy`.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import mariadb from 'mariadb';
import { parseDatabaseUrl } from '../../db/connection';
import { stopLocalInstance } from '../../db/local';
import { MIGRATION_NAMES } from '../../db/migrator';
import { prepareProductionCopy, productionEnv, runInCopy, startProductionServer, type ProductionCopy, type ProductionServer } from './production-copy';

jest.setTimeout(120_000);

let copy: ProductionCopy;
let server: ProductionServer;

beforeAll(async () => {
  copy = await prepareProductionCopy();
  console.log(`npm ci --omit=dev: ${copy.installSeconds.toFixed(1)} s, node_modules ${(copy.installBytes / 1e6).toFixed(1)} MB`);
}, 900_000);

afterAll(async () => {
  const startedInstance = server?.startedInstance;
  await server?.stop();
  copy?.remove();
  if (startedInstance) await stopLocalInstance('test');
});

/** `node dist/server/main.js` in the copy with `env` only (no database is reached before the check). */
function startRefused(env: NodeJS.ProcessEnv): { status: number | null; stderr: string } {
  const run = spawnSync(process.execPath, ['dist/server/main.js'], { cwd: copy.dir, env: { PATH: process.env['PATH'], ...env }, encoding: 'utf8', timeout: 60_000 });
  return { status: run.status, stderr: run.stderr };
}

describe('the production build, installed with production dependencies only', () => {
  it('holds the runtime packages and none of the development ones', () => {
    const installed = (name: string) => existsSync(join(copy.dir, 'node_modules', name, 'package.json'));
    for (const runtime of ['express', 'sequelize', 'mariadb', 'argon2', 'pdfmake', 'umzug', '@fontsource/roboto']) expect({ runtime, installed: installed(runtime) }).toEqual({ runtime, installed: true });
    for (const dev of ['tsx', 'jest', 'esbuild', 'typescript', 'smtp-server', 'mailparser', '@angular/core', 'playwright-core']) expect({ dev, installed: installed(dev) }).toEqual({ dev, installed: false });
  });

  it('refuses to start with a weak secret, a missing mail server or the mailbox page, naming the variable', () => {
    const good = productionEnv(4300, 'mariadb://speedwright:pw@127.0.0.1:9/none', 'smtp://127.0.0.1:25', copy);
    const weak = startRefused({ ...good, SESSION_SECRET: 'a'.repeat(44) });
    expect(weak.status).toBe(1);
    expect(weak.stderr).toContain('Speedwright did not start.');
    expect(weak.stderr).toContain('SESSION_SECRET uses only 1 different characters (at least 10 needed).');

    const noMail = startRefused({ ...good, SMTP_URL: undefined });
    expect(noMail.status).toBe(1);
    expect(noMail.stderr).toContain('SMTP_URL is not set');

    const plainHttp = startRefused({ ...good, PUBLIC_URL: 'http://speeds.fleet.example' });
    expect(plainHttp.status).toBe(1);
    expect(plainHttp.stderr).toContain('PUBLIC_URL must be an https:// address outside this machine');

    // Accepted by the sources (npm start, the tests), refused by the compiled build.
    const mailbox = startRefused({ ...good, MAILBOX_DIR: join(copy.dir, 'mailbox') });
    expect(mailbox.status).toBe(1);
    expect(mailbox.stderr).toContain('MAILBOX_DIR is set, but the mailbox page of the local fake mail server is a development piece');
  });

  it('starts with `npm run serve` against a fresh database: live, and not ready before the migrations', async () => {
    server = await startProductionServer(copy);
    const live = await fetch(`${server.url}/api/health/live`);
    expect(live.status).toBe(200);
    expect(await live.json()).toEqual({ status: 'live' });
    const ready = await fetch(`${server.url}/api/health/ready`);
    expect(ready.status).toBe(503);
    expect(await ready.json()).toMatchObject({ status: 'not-ready', reason: 'migrations_pending', pending: [...MIGRATION_NAMES] });
  });

  it('migrates with the compiled `npm run migrate`, then is ready', async () => {
    const status = await runInCopy(copy, 'migrate', ['status'], { DATABASE_URL: server.databaseUrl });
    expect(status.status).toBe(0);
    expect(status.stdout).toContain(`${MIGRATION_NAMES.length} migration(s) pending: run \`npm run migrate\`.`);
    const migrate = await runInCopy(copy, 'migrate', [], { DATABASE_URL: server.databaseUrl });
    expect({ status: migrate.status, stderr: migrate.stderr }).toEqual({ status: 0, stderr: '' });
    expect(migrate.stdout).toContain(`Ran ${MIGRATION_NAMES.length} migration(s); the database is current (${MIGRATION_NAMES.length} migrations).`);
    const again = await runInCopy(copy, 'migrate', [], { DATABASE_URL: server.databaseUrl });
    expect(again.stdout).toContain('nothing to do');

    const ready = await fetch(`${server.url}/api/health/ready`);
    expect(ready.status).toBe(200);
    expect(await ready.json()).toEqual({ status: 'ready', db: 'ok', migrations: { applied: MIGRATION_NAMES.length, inBuild: MIGRATION_NAMES.length } });
    const health = await fetch(`${server.url}/api/health`);
    expect(await health.json()).toEqual({ status: 'ok', db: 'ok' });
  });

  it('serves the web app: the sign-in page', async () => {
    const page = await fetch(`${server.url}/sign-in`);
    expect(page.status).toBe(200);
    expect(page.headers.get('content-type')).toMatch(/^text\/html/);
    const html = await page.text();
    expect(html).toContain('<sw-root');
    expect(html).toContain('<title>Speedwright');
    expect((await fetch(`${server.url}/ngsw.json`)).status).toBe(200);
  });

  it('holds no demo data: no operator, no person, and the demo sign-in fails', async () => {
    const { host, port, username, password, database } = parseDatabaseUrl(server.databaseUrl);
    const conn = await mariadb.createConnection({ host, port, user: username, password, database, bigIntAsNumber: true });
    try {
      const [operators] = await conn.query<{ count: number }[]>('SELECT COUNT(*) AS count FROM operators');
      const [users] = await conn.query<{ count: number }[]>('SELECT COUNT(*) AS count FROM users');
      expect({ operators: operators!.count, users: users!.count }).toEqual({ operators: 0, users: 0 });
    } finally {
      await conn.end();
    }
    const csrf = await fetch(`${server.url}/api/auth/csrf`);
    const cookie = csrf.headers.getSetCookie().map((line) => line.split(';')[0]).join('; ');
    const { token } = (await csrf.json()) as { token: string };
    const signIn = await fetch(`${server.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie },
      body: JSON.stringify({ email: 'admin@demo.speedwright.example', password: 'speedwright-demo' }),
    });
    expect(signIn.status).toBe(401);
  });

  // Further steps of the production path (operator:create, key rotation, …) go here.

  it('stops gracefully on SIGTERM: exit code 0, and the port is closed', async () => {
    const code = await server.stop();
    expect(code).toBe(0);
    expect(server.output()).toContain('"msg":"stopped"');
    await expect(fetch(`${server.url}/api/health/live`)).rejects.toThrow();
  });
});
