import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { auditPageSchema } from '@shared/api/audit';
import { signingKeyResponseSchema } from '@shared/api/revisions';
import { apiTestMailboxDir } from '../../test/api/constants';
import { csrfAgent, demoEmail, mailTo, signIn, startHarness, TEST_PUBLIC_URL, TEST_SIGNING_KEY_SECRET, type Harness } from '../../test/api/harness';
import { demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { newSpeedBook, newTeam, publish } from '../../test/api/test-helpers';
import { DomainError } from '../errors/domain-error';
import { AuditEvent, Operator, SigningKey, User } from '../models';
import { commandLineOrigin, createOperator, listOperators, slugOf } from './operator-onboarding.service';

/**
 * Onboarding a real operator (issue 14, part 2): the service in this process, and the command
 * line spawned with tsx against the same test database and fake mail server, as an operator's
 * IT person runs it.
 */
jest.setTimeout(120_000);

const run = promisify(execFile);
const root = join(__dirname, '..', '..');
const NEW_PASSWORD = 'a long enough new password';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

const unique = () => randomBytes(3).toString('hex');
const origin = commandLineOrigin('operator:create');

function tokenOf(link: string): string {
  const url = new URL(link);
  expect(url.origin + url.pathname).toBe(`${TEST_PUBLIC_URL}/invitation`);
  return new URLSearchParams(url.hash.slice(1)).get('token')!;
}

/** The command line as `npm run operator:…` runs it (tsx), with the server's variables pointing at the test database. */
async function cli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(join(root, 'node_modules', '.bin', 'tsx'), [join(root, 'server', 'cli', 'operator.ts'), ...args], {
      cwd: root,
      env: {
        PATH: process.env['PATH'],
        DATABASE_URL: process.env['DATABASE_URL'],
        SMTP_URL: process.env['SMTP_URL'],
        MAILBOX_DIR: apiTestMailboxDir(),
        PUBLIC_URL: TEST_PUBLIC_URL,
        SIGNING_KEY_SECRET: TEST_SIGNING_KEY_SECRET,
      },
      timeout: 60_000,
    });
    return { code: 0, stdout, stderr };
  } catch (error) {
    const failed = error as { code: number; stdout: string; stderr: string };
    return { code: failed.code, stdout: failed.stdout, stderr: failed.stderr };
  }
}

describe('createOperator (service)', () => {
  it('creates a real operator, its signing key and a pending administrator, invites them by mail, and audits it as the command line', async () => {
    const name = `Fenmoor Air Ambulance ${unique()} (invented)`;
    const email = `chief-${unique()}@fenmoor.example`;
    const created = await createOperator({ name, adminEmail: email.toUpperCase(), adminName: 'Ruth Calder' }, TEST_SIGNING_KEY_SECRET, origin);

    const operator = await Operator.findByPk(created.operator.id, { rejectOnEmpty: true });
    expect(operator).toMatchObject({ name, isDemo: false, slug: slugOf(name) });
    const admin = await User.findByPk(created.admin.id, { rejectOnEmpty: true });
    expect(admin).toMatchObject({ operatorId: operator.id, email, displayName: 'Ruth Calder', role: 'admin', passwordHash: null });
    const keys = await SigningKey.findAll({ where: { operatorId: operator.id } });
    expect(keys.map((key) => [key.id, key.active, key.publicKey])).toEqual([[created.signingKey.id, true, created.signingKey.publicKey]]);
    expect(created.mailSent).toBe(true);

    // The mail carries the link the command prints.
    const mail = await mailTo(email);
    expect(mail.subject).toBe(`You are invited to ${name} on Speedwright`);
    expect(mail.text).toContain('Your IT team has added you to');
    expect(mail.links).toContain(created.invitationLink);

    const events = await AuditEvent.findAll({ where: { operatorId: operator.id }, order: [['id', 'ASC']] });
    expect(events.map((event) => [event.action, event.actorId, event.ip, event.userAgent])).toEqual([
      ['signing-key.created', null, null, 'speedwright-cli (operator:create)'],
      ['operator.created', null, null, 'speedwright-cli (operator:create)'],
      ['user.invited', null, null, 'speedwright-cli (operator:create)'],
    ]);

    // The administrator accepts, signs in, and reads the operator's audit trail and key.
    const { agent, token } = await csrfAgent(harness.app);
    await agent.post('/api/auth/invitations/accept').set('x-csrf-token', token).send({ token: tokenOf(created.invitationLink), password: NEW_PASSWORD }).expect(200);
    const session = await signIn(harness.app, email, NEW_PASSWORD);
    const trail = auditPageSchema.parse((await session.agent.get('/api/audit?action=operator.created').expect(200)).body);
    expect(trail.events.map((event) => event.entityId)).toEqual([String(operator.id)]);
    expect(signingKeyResponseSchema.parse((await session.agent.get('/api/operator/signing-key').expect(200)).body).signingKey.id).toBe(created.signingKey.id);
  });

  it('refuses a duplicate name (any case), an address in use and a malformed one, with a sentence and nothing written', async () => {
    const name = `Greyling Charter ${unique()}`;
    await createOperator({ name, adminEmail: `ops-${unique()}@greyling.example` }, TEST_SIGNING_KEY_SECRET, origin);
    const operatorsBefore = await Operator.count();
    const usersBefore = await User.count();

    const refusal = async (request: Record<string, unknown>) => {
      const error = await createOperator(request, TEST_SIGNING_KEY_SECRET, origin).catch((caught: unknown) => caught);
      expect(error).toBeInstanceOf(DomainError);
      return error as DomainError;
    };
    const duplicate = await refusal({ name: `  ${name.toUpperCase()} `, adminEmail: `new-${unique()}@greyling.example` });
    expect([duplicate.kind, duplicate.code, duplicate.message]).toEqual(['conflict', 'operator_name_taken', `An operator named “${name}” already exists; choose another name (names are compared without regard to case).`]);

    const taken = await refusal({ name: `Other ${unique()}`, adminEmail: demoEmail('admin') });
    expect([taken.code, taken.message]).toEqual(['address_in_use', expect.stringMatching(/^The address admin@demo\.speedwright\.example already belongs to a person of “Kestrel Fen Aviation \(demo\)”/)]);

    const malformed = await refusal({ name: `Other ${unique()}`, adminEmail: 'not an address' });
    expect([malformed.kind, malformed.fields]).toEqual(['invalid', { adminEmail: 'Enter an e-mail address such as name@example.com.' }]);
    const badName = await refusal({ name: 'Line\nbreak', adminEmail: `x-${unique()}@example.com` });
    expect(badName.fields?.['name']).toMatch(/may not contain a line break/);

    expect(await Operator.count()).toBe(operatorsBefore);
    expect(await User.count()).toBe(usersBefore);
  });

  it('lists every operator with its people, types, airframes and revisions in force', async () => {
    const [admin, engineer, approver] = await newTeam(harness.app, ['admin', 'engineer', 'approver']);
    const { aircraftTypeId, speedBookId } = await newSpeedBook(admin!, engineer!);
    await admin!.agent.post('/api/airframes').set('x-csrf-token', admin!.token).send({ registration: `ZZ-${unique().slice(0, 3).toUpperCase()}`, serial: 'OL-1', aircraftTypeId }).expect(201);
    await publish(engineer!, approver!, speedBookId);
    // A second publication supersedes the first: one revision in force.
    await publish(engineer!, approver!, speedBookId, demoPistonTrainerContentRevised());
    const operatorId = (await User.findByPk(admin!.id, { rejectOnEmpty: true })).operatorId;
    const listed = (await listOperators()).find((one) => one.id === operatorId);
    expect(listed).toMatchObject({ people: 3, aircraftTypes: 1, airframes: 1, publishedRevisions: 1, isDemo: true });
  });

  it('keeps slugs unique and plain', async () => {
    expect(slugOf('Aéro Nord — Ambulance GmbH')).toBe('aero-nord-ambulance-gmbh');
    expect(slugOf('***')).toBe('operator');
    const stem = `slug-test-${unique()}`;
    const first = await createOperator({ name: `${stem}!`, adminEmail: `a-${unique()}@example.com` }, TEST_SIGNING_KEY_SECRET, origin);
    const second = await createOperator({ name: `${stem}?`, adminEmail: `b-${unique()}@example.com` }, TEST_SIGNING_KEY_SECRET, origin);
    expect([first.operator.slug, second.operator.slug]).toEqual([stem, `${stem}-2`]);
  });
});

describe('npm run operator:create / operator:list (spawned)', () => {
  it('creates an operator and prints the link, refuses the same name again with exit code 1, and lists it with its counts', async () => {
    const name = `Saltmarsh Flight School ${unique()} (invented)`;
    const email = `head-${unique()}@saltmarsh.example`;
    const created = await cli(['create', '--name', name, '--admin-email', email, '--admin-name', 'Osric Vale']);
    expect(created.code).toBe(0);
    expect(created.stdout).toContain(`Created operator “${name}”`);
    expect(created.stdout).toContain(`The invitation was mailed to ${email}.`);
    const printedLink = created.stdout.split('\n').find((line) => line.startsWith(`${TEST_PUBLIC_URL}/invitation#token=`));
    expect(printedLink).toBeDefined();
    const mail = await mailTo(email);
    expect(mail.links).toContain(printedLink);

    const again = await cli(['create', '--name', name.toLowerCase(), '--admin-email', `other-${unique()}@saltmarsh.example`]);
    expect(again.code).toBe(1);
    expect(again.stderr).toContain(`An operator named “${name}” already exists; choose another name`);

    const missing = await cli(['create', '--name', 'No Address Co']);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain('operator:create needs --name "<operator name>" and --admin-email <address>.');

    const listed = await cli(['list']);
    expect(listed.code).toBe(0);
    const row = listed.stdout.split('\n').find((line) => line.includes(name))!;
    // id, name, slug, people 1, types 0, airframes 0, published revisions 0, created.
    expect(row.trim().split(/\s{2,}/).slice(2, 7)).toEqual([slugOf(name), '1', '0', '0', '0']);
    const demo = listed.stdout.split('\n').find((line) => line.includes('Kestrel Fen Aviation (demo) [demo]'))!;
    expect(demo).toBeDefined();

    const json = await cli(['list', '--json']);
    const { operators } = JSON.parse(json.stdout) as { operators: Awaited<ReturnType<typeof listOperators>> };
    expect(operators.find((one) => one.name === name)).toEqual({ id: expect.any(Number), slug: slugOf(name), name, isDemo: false, people: 1, aircraftTypes: 0, airframes: 0, publishedRevisions: 0, createdAt: expect.any(String) });
  });
});
