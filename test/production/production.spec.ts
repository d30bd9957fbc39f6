/**
 * The production path end to end (issue 14): the build installed with production dependencies
 * only into a temporary folder (`production-copy.ts`), its configuration check, `npm run serve`
 * against a fresh MariaDB database, readiness before and after `npm run migrate`, the web app,
 * no demo data, then the flow through the installed copy's commands and the server's
 * HTTP API only (an operator created with `operator:create`, invitations followed from the fake
 * mail server, a revision published, the signing key rotated, a second revision, both verified
 * with the device's own function; backup, check, restore onto a second server), and a graceful
 * stop. The tests run in order and share the installed copy and the server; further steps go
 * before "stops", using `server`, `copy` and `runInCopy`.
 */
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { cpSync, existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import mariadb from 'mariadb';
import { parseDatabaseUrl } from '../../db/connection';
import { openLocalDatabase, stopLocalInstance } from '../../db/local';
import { MIGRATION_NAMES } from '../../db/migrator';
import { readMailbox, waitForMail } from '../../server/dev/mailbox';
import { signingKeyResponseSchema, type SigningKeyResponse } from '@shared/api/revisions';
import { syncResponseSchema } from '@shared/api/sync';
import { demoPistonTrainerContent, demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import type { RevisionContent } from '@shared/speed-book/revision-content';
import { importOperatorKeys, verifyRevision } from '../../src/app/core/sync/revision-verification';
import { BrowserSession, linkToken } from './browser-session';
import { prepareProductionCopy, productionEnv, runInCopy, startProductionServer, type ProductionCopy, type ProductionServer } from './production-copy';

jest.setTimeout(120_000);

let copy: ProductionCopy;
let server: ProductionServer;
/** The second server, on the database restored from the backup. */
let restoredServer: ProductionServer | undefined;

beforeAll(async () => {
  copy = await prepareProductionCopy();
  console.log(`npm ci --omit=dev: ${copy.installSeconds.toFixed(1)} s, node_modules ${(copy.installBytes / 1e6).toFixed(1)} MB`);
}, 900_000);

afterAll(async () => {
  const startedInstance = server?.startedInstance;
  await restoredServer?.stop();
  await server?.stop();
  copy?.remove();
  if (startedInstance) await stopLocalInstance('test');
});

/** `node dist/server/main.js` in the copy with `env` only (no database is reached before the check). */
function startRefused(env: NodeJS.ProcessEnv): { status: number | null; stderr: string } {
  const run = spawnSync(process.execPath, ['dist/server/main.js'], { cwd: copy.dir, env: { PATH: process.env['PATH'], ...env }, encoding: 'utf8', timeout: 60_000 });
  return { status: run.status, stderr: run.stderr };
}

/**
 * What a pilot's device does with `GET /api/sync` before storing anything
 * (src/app/core/sync/revision-verification.ts, Ed25519 per RFC 8032 through WebCrypto): the
 * first revision verifies with the retired key, the second with the active one, each by its
 * `signingKeyId`; the first presented as signed with the other key is refused.
 */
async function expectDeviceVerifies(session: BrowserSession, ids: { operatorId: number; firstRevisionId: number; secondRevisionId: number; oldKeyId: number; newKeyId: number }): Promise<void> {
  const sync = syncResponseSchema.parse(await session.get('/api/sync'));
  expect(sync.operator.id).toBe(ids.operatorId);
  expect(sync.operator.signingKeyId).toBe(ids.newKeyId);
  const keys = await importOperatorKeys(sync.operator.signingKeys);
  const first = sync.revisions.find((revision) => revision.id === ids.firstRevisionId);
  const second = sync.revisions.find((revision) => revision.id === ids.secondRevisionId);
  expect([first?.status, first?.number, first?.signingKeyId]).toEqual(['superseded', 1, ids.oldKeyId]);
  expect([second?.status, second?.number, second?.signingKeyId]).toEqual(['published', 2, ids.newKeyId]);
  const operator = { id: sync.operator.id };
  expect(await verifyRevision(first!, operator, keys)).toEqual({ ok: true });
  expect(await verifyRevision(second!, operator, keys)).toEqual({ ok: true });
  const firstWithNewKey = await verifyRevision({ ...first!, signingKeyId: ids.newKeyId }, operator, keys);
  expect(firstWithNewKey.ok).toBe(false);
  expect(!firstWithNewKey.ok && firstWithNewKey.sentence).toContain(`its signature does not verify with the operator’s public key No. ${ids.newKeyId}`);
  const secondWithOldKey = await verifyRevision({ ...second!, signingKeyId: ids.oldKeyId }, operator, keys);
  expect(secondWithOldKey.ok).toBe(false);
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

  // The flow, through the installed copy's commands and the running server's API only.
  describe('an operator set up from nothing: CLI, invitations, a published revision, key rotation, device verification', () => {
    // Invented demo data — not for flight: the operator, its people and its airframe.
    const OPERATOR_NAME = 'Quillmere Flight School (invented)';
    const ADMIN = { email: 'r.tessaly@quillmere-flight.example', name: 'Rowan Tessaly' };
    const ENGINEER = { email: 'm.ostrander@quillmere-flight.example', name: 'Mira Ostrander' };
    const APPROVER = { email: 'j.vell@quillmere-flight.example', name: 'Jonah Vell' };
    const PILOT = { email: 'a.kerrow@quillmere-flight.example', name: 'Ada Kerrow' };
    const REGISTRATION = 'ZZ-QFA';
    const password = () => `Quill-${randomBytes(12).toString('base64url')}`;
    const passwords = new Map<string, string>();

    let operatorId: number;
    let admin: BrowserSession, engineer: BrowserSession, approver: BrowserSession, pilot: BrowserSession;
    let firstRevisionId: number, secondRevisionId: number;
    let rotation: SigningKeyResponse;

    const listOperators = async () => {
      const list = await runInCopy(copy, 'operator:list', ['--json'], server.env);
      expect({ status: list.status, stderr: list.stderr }).toEqual({ status: 0, stderr: '' });
      return (JSON.parse(list.stdout) as { operators: { id: number; name: string; isDemo: boolean; people: number; aircraftTypes: number; airframes: number; publishedRevisions: number }[] }).operators;
    };

    /** The person follows the link of the invitation mail: chooses a password on the page's API, then signs in. */
    const acceptInvitationAndSignIn = async (link: string, email: string): Promise<BrowserSession> => {
      expect(link.startsWith(`${server.env['PUBLIC_URL']}/`)).toBe(true);
      const chosen = password();
      const visitor = new BrowserSession(server.url);
      await visitor.post('/api/auth/invitations/accept', { token: linkToken(link), password: chosen });
      // The link works once.
      const again = await visitor.request('POST', '/api/auth/invitations/accept', { token: linkToken(link), password: password() });
      expect(again.status).toBeGreaterThanOrEqual(400);
      expect(again.status).toBeLessThan(500);
      passwords.set(email, chosen);
      const session = new BrowserSession(server.url);
      await session.signIn(email, chosen);
      return session;
    };

    const invite = async (person: { email: string; name: string }, role: string): Promise<BrowserSession> => {
      const answer = await admin.post<{ user: { email: string; role: string }; mailSent: boolean }>('/api/users', { email: person.email, displayName: person.name, role }, 201);
      expect(answer).toMatchObject({ user: { email: person.email, role }, mailSent: true });
      const mail = await waitForMail(server.mailboxDir, (entry) => entry.to.includes(person.email));
      const link = mail.links.find((candidate) => candidate.includes('#token='));
      expect(link).toBeDefined();
      return acceptInvitationAndSignIn(link!, person.email);
    };

    const publishRevision = async (speedBookId: number, content: RevisionContent, changeSummary: string): Promise<number> => {
      const draft = await engineer.post<{ revision: { id: number } }>(`/api/speed-books/${speedBookId}/revisions`, { content, changeSummary }, 201);
      const id = draft.revision.id;
      await engineer.post(`/api/revisions/${id}/submit`);
      // Four eyes: the engineer who wrote it cannot approve it; the approver does.
      expect((await engineer.request('POST', `/api/revisions/${id}/approve`, {})).status).toBe(403);
      await approver.post(`/api/revisions/${id}/approve`);
      return id;
    };

    it('creates the operator with `npm run operator:create`: the printed link is the mailed one, listed by `operator:list -- --json`, and a second one of the same name is refused', async () => {
      const created = await runInCopy(copy, 'operator:create', ['--name', OPERATOR_NAME, '--admin-email', ADMIN.email, '--admin-name', ADMIN.name], server.env);
      expect({ status: created.status, stderr: created.stderr }).toMatchObject({ status: 0 });
      // Its only other output is the mail log (JSON lines on stderr, the address masked): nothing above info.
      expect(created.stderr.split('\n').filter((line) => line.trim() !== '' && !/^\{"level":30,.*"msg":"mail sent"\}$/.test(line))).toEqual([]);
      expect(created.stderr).not.toContain(ADMIN.email);
      expect(created.stdout).toContain(`Created operator “${OPERATOR_NAME}”`);
      expect(created.stdout).toContain(`The invitation was mailed to ${ADMIN.email}.`);
      const printedLink = created.stdout.trim().split('\n').at(-1)!.trim();
      const mail = await waitForMail(server.mailboxDir, (entry) => entry.to.includes(ADMIN.email));
      expect(mail.links).toContain(printedLink);

      const operators = await listOperators();
      expect(operators).toEqual([expect.objectContaining({ name: OPERATOR_NAME, isDemo: false, people: 1, aircraftTypes: 0, airframes: 0, publishedRevisions: 0 })]);
      operatorId = operators[0]!.id;

      const twin = await runInCopy(copy, 'operator:create', ['--name', OPERATOR_NAME.toUpperCase(), '--admin-email', 'someone.else@quillmere-flight.example'], server.env);
      expect(twin.status).toBe(1);
      expect(twin.stderr).toContain('already exists; choose another name (names are compared without regard to case).');
      // Nothing written: the same single operator, and no second mail.
      expect(await listOperators()).toEqual(operators);
      expect(readMailbox(server.mailboxDir)).toHaveLength(1);

      admin = await acceptInvitationAndSignIn(printedLink, ADMIN.email);
      const me = await admin.get<{ user: { email: string; role: string; operatorId: number } }>('/api/auth/me');
      expect(me.user).toMatchObject({ email: ADMIN.email, role: 'admin', operatorId });
    });

    it('the admin invites an engineer, an approver and a pilot, who each set a password from their mail; the admin adds a type and an airframe; a revision is published', async () => {
      engineer = await invite(ENGINEER, 'engineer');
      approver = await invite(APPROVER, 'approver');
      pilot = await invite(PILOT, 'pilot');

      const { aircraftType } = await admin.post<{ aircraftType: { id: number } }>(
        '/api/aircraft-types',
        { designator: 'QFT1', name: 'Quillmere trainer (invented)', category: 'piston-single', engines: 1, ceilingFt: 14000 },
        201,
      );
      const { airframe } = await admin.post<{ airframe: { registration: string } }>('/api/airframes', { registration: REGISTRATION, serial: 'QF-0101', aircraftTypeId: aircraftType.id }, 201);
      expect(airframe.registration).toBe(REGISTRATION);
      const { speedBook } = await engineer.post<{ speedBook: { id: number } }>('/api/speed-books', { aircraftTypeId: aircraftType.id, title: 'QFT1 speeds (invented demo data — not for flight)' }, 201);
      firstRevisionId = await publishRevision(speedBook.id, demoPistonTrainerContent(), 'First issue');
      const first = await pilot.get<{ revision: { status: string; number: number } }>(`/api/revisions/${firstRevisionId}`);
      expect(first.revision).toMatchObject({ status: 'published', number: 1 });

      // The admin rotates the signing key; the engineer's second revision is approved and signed with the new key.
      const before = signingKeyResponseSchema.parse(await admin.get('/api/operator/signing-key'));
      rotation = signingKeyResponseSchema.parse(await admin.post('/api/operator/signing-key/rotate', {}, 201));
      expect(rotation.signingKey.id).not.toBe(before.signingKey.id);
      secondRevisionId = await publishRevision(speedBook.id, demoPistonTrainerContentRevised(), 'Revised approach speeds');

      expect(await listOperators()).toEqual([expect.objectContaining({ id: operatorId, people: 4, aircraftTypes: 1, airframes: 1, publishedRevisions: 1 })]);
    });

    it('both revisions verify as a device verifies them, each with the key its signingKeyId names; one presented with the other key is refused', async () => {
      const keys = signingKeyResponseSchema.parse(await pilot.get('/api/operator/signing-key'));
      expect(keys).toEqual(rotation);
      const [active, retired] = keys.signingKeys;
      expect(keys.signingKeys).toHaveLength(2);
      expect(active!.retiredAt).toBeNull();
      expect(retired!.retiredAt).not.toBeNull();

      await expectDeviceVerifies(pilot, { operatorId, firstRevisionId, secondRevisionId, oldKeyId: retired!.id, newKeyId: active!.id });
    });

    it('backs up with the installed `npm run backup`, passes `backup:check`, refuses a backup with one byte changed, and a server on the restored database serves both revisions, still verifying', async () => {
      const backupDir = join(copy.dir, 'backup-1');
      const backup = await runInCopy(copy, 'backup', ['--out', backupDir], server.env);
      expect({ status: backup.status, stderr: backup.stderr }).toMatchObject({ status: 0 });
      const check = await runInCopy(copy, 'backup:check', ['--from', backupDir], server.env);
      expect({ status: check.status, stderr: check.stderr }).toMatchObject({ status: 0 });

      // One byte changed in the dump: refused.
      const damagedDir = join(copy.dir, 'backup-damaged');
      cpSync(backupDir, damagedDir, { recursive: true });
      const dump = join(damagedDir, 'database.sql');
      const bytes = readFileSync(dump);
      const middle = Math.floor(bytes.length / 2);
      bytes[middle] = bytes[middle]! ^ 0x01;
      writeFileSync(dump, bytes);
      const damaged = await runInCopy(copy, 'backup:check', ['--from', damagedDir], server.env);
      expect(damaged.status).toBe(1);
      expect(damaged.stderr).toContain('database.sql');

      // Restore into a second, empty database and attachments folder; a second server on it, with the same secrets.
      const restoredDatabase = 'speedwright_production_restored';
      const { url: restoredUrl } = await openLocalDatabase('test', restoredDatabase, { fresh: true });
      const restoredAttachments = join(copy.dir, 'attachments-restored');
      const restore = await runInCopy(copy, 'restore', ['--from', backupDir], { ...server.env, DATABASE_URL: restoredUrl, ATTACHMENTS_DIR: restoredAttachments });
      expect({ status: restore.status, stderr: restore.stderr }).toMatchObject({ status: 0 });

      restoredServer = await startProductionServer(copy, {
        database: restoredDatabase,
        fresh: false,
        envOverrides: { SESSION_SECRET: server.env['SESSION_SECRET'], SIGNING_KEY_SECRET: server.env['SIGNING_KEY_SECRET'], ATTACHMENTS_DIR: restoredAttachments },
      });
      expect((await fetch(`${restoredServer.url}/api/health/ready`)).status).toBe(200);
      const restoredPilot = new BrowserSession(restoredServer.url);
      await restoredPilot.signIn(PILOT.email, passwords.get(PILOT.email)!);
      expect(signingKeyResponseSchema.parse(await restoredPilot.get('/api/operator/signing-key'))).toEqual(rotation);
      await expectDeviceVerifies(restoredPilot, { operatorId, firstRevisionId, secondRevisionId, oldKeyId: rotation.signingKeys[1]!.id, newKeyId: rotation.signingKey.id });
      expect(await restoredServer.stop()).toBe(0);
    });
  });

  it('stops gracefully on SIGTERM: exit code 0, and the port is closed', async () => {
    const code = await server.stop();
    expect(code).toBe(0);
    expect(server.output()).toContain('"msg":"stopped"');
    await expect(fetch(`${server.url}/api/health/live`)).rejects.toThrow();
  });
});
