import request from 'supertest';
import { operatorPeopleSchema, operatorPersonResponseSchema } from '@shared/api/auth';
import { mailboxResponseSchema } from '@shared/api/mailbox';
import { csrfAgent, demoEmail, mailTo, mailsTo, signIn, startHarness, TEST_PASSWORD, TEST_PUBLIC_URL, type Harness } from '../../test/api/harness';
import { AuditEvent, Invitation, PasswordResetToken, User } from '../models';
import { sessionOf } from '../../test/api/role-sessions';
import { newTeam } from '../../test/api/test-helpers';

// argon2id takes a noticeable moment per password, and these tests set many.
jest.setTimeout(30_000);

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

const NEW_PASSWORD = 'a long enough new password';
let counter = 0;
/** A fresh address per test so parallel test files and repeated runs never share a mailbox entry. */
const freshEmail = (label: string) => `${label}-${Date.now()}-${++counter}@invited.speedwright.example`;

function tokenOf(link: string, path: string): string {
  const url = new URL(link);
  expect(url.origin + url.pathname).toBe(`${TEST_PUBLIC_URL}${path}`);
  expect(url.search).toBe('');
  const token = new URLSearchParams(url.hash.slice(1)).get('token');
  expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
  return token!;
}

async function invite(email: string, role = 'engineer', displayName = 'Nell Ashcombe') {
  const admin = await signIn(harness.app, demoEmail('admin'));
  const res = await admin.agent.post('/api/users').set('x-csrf-token', admin.token).send({ email, displayName, role });
  expect(res.status).toBe(201);
  const mail = await mailTo(email);
  return { admin, res, mail, token: tokenOf(mail.links[0]!, '/invitation') };
}

async function accept(token: string, password = NEW_PASSWORD, extra: Record<string, unknown> = {}) {
  const { agent, token: csrf } = await csrfAgent(harness.app);
  return agent.post('/api/auth/invitations/accept').set('x-csrf-token', csrf).send({ token, password, ...extra });
}

/** An invited person who accepted and can sign in. */
async function member(role: string, label = role) {
  const email = freshEmail(label);
  const { token, res } = await invite(email, role);
  expect((await accept(token)).status).toBe(200);
  return { email, id: operatorPersonResponseSchema.parse(res.body).user.id };
}

describe('invitations', () => {
  it('invites by e-mail; the link in the mail sets the password, and the person signs in with it', async () => {
    const email = freshEmail('invitee');
    const { admin, res, mail, token } = await invite(email, 'engineer', 'Nell Ashcombe');
    const { user } = operatorPersonResponseSchema.parse(res.body);
    expect(user).toMatchObject({ email, displayName: 'Nell Ashcombe', role: 'engineer', locked: false, invitationPending: true });
    expect(res.body.mailSent).toBe(true);

    expect(mail.subject).toBe('You are invited to Kestrel Fen Aviation (demo) on Speedwright');
    expect(mail.text).toContain('Priya Halden has added you');
    expect(mail.text).toMatch(/works once and until \d{1,2} \w+ \d{4}, \d\d:\d\d UTC/);
    const stored = await Invitation.findOne({ where: { userId: user.id }, rejectOnEmpty: true });
    expect(stored.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored.tokenHash).not.toContain(token);
    const days = (stored.expiresAt.getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);

    // Before accepting there is no password to sign in with.
    const { agent: before, token: beforeCsrf } = await csrfAgent(harness.app);
    expect((await before.post('/api/auth/login').set('x-csrf-token', beforeCsrf).send({ email, password: NEW_PASSWORD })).status).toBe(401);

    const accepted = await accept(token, NEW_PASSWORD, { displayName: 'Nell Ashcombe-Reed' });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ email });

    const { agent } = await signIn(harness.app, email, NEW_PASSWORD);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email, role: 'engineer', displayName: 'Nell Ashcombe-Reed' });

    const people = operatorPeopleSchema.parse((await admin.agent.get('/api/users').expect(200)).body);
    expect(people.users.find((person) => person.email === email)).toMatchObject({ invitationPending: false });

    const actions = (await AuditEvent.findAll({ where: { entityType: 'user', entityId: String(user.id) }, order: [['id', 'ASC']] })).map((e) => e.action);
    expect(actions).toEqual(['user.invited', 'invitation.accepted']);
  });

  it('spends the link on first use', async () => {
    const { token } = await invite(freshEmail('twice'));
    expect((await accept(token)).status).toBe(200);
    const again = await accept(token, 'another long password');
    expect(again.status).toBe(410);
    expect(again.body.error).toMatchObject({ code: 'link_used', message: expect.stringMatching(/already been used/) });
  });

  it('refuses an expired link with a sentence', async () => {
    const email = freshEmail('late');
    const { token } = await invite(email);
    const user = await User.findOne({ where: { email }, rejectOnEmpty: true });
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    const res = await accept(token);
    expect(res.status).toBe(410);
    expect(res.body.error).toMatchObject({ code: 'link_expired', message: 'This invitation has expired. Ask your administrator to send a new one.' });
    expect((await User.findByPk(user.id, { rejectOnEmpty: true })).passwordHash).toBeNull();
  });

  it('refuses unknown and malformed tokens and short passwords field by field', async () => {
    const unknown = await accept('A'.repeat(43));
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.code).toBe('invalid_link');
    expect(unknown.body.error.fields.token).toMatch(/not valid/);

    const malformed = await accept('abc', 'short');
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields).toEqual({
      token: expect.stringMatching(/not complete/),
      password: expect.stringMatching(/at least 12 characters/),
    });
  });

  it('sends a new link on request; the old one stops working', async () => {
    const email = freshEmail('resend');
    const { admin, res, token: first } = await invite(email);
    const id = res.body.user.id as number;
    const again = await admin.agent.post(`/api/users/${id}/invitation`).set('x-csrf-token', admin.token);
    expect(again.status).toBe(201);
    const second = await mailTo(email, (entry) => !entry.text.includes(first) && entry.links.length > 0);
    const secondToken = tokenOf(second.links[0]!, '/invitation');
    expect(secondToken).not.toBe(first);

    expect((await accept(first)).body.error.code).toBe('link_replaced');
    expect((await accept(secondToken)).status).toBe(200);

    const accepted = await admin.agent.post(`/api/users/${id}/invitation`).set('x-csrf-token', admin.token);
    expect(accepted.status).toBe(409);
    expect(accepted.body.error.message).toMatch(/already accepted the invitation/);
    expect(await AuditEvent.count({ where: { action: 'user.invitation-resent', entityId: String(id) } })).toBe(1);
  });

  it('refuses an address that already belongs to one of the operator’s own people', async () => {
    const admin = await signIn(harness.app, demoEmail('admin'));
    const before = mailsTo(demoEmail('pilot')).length;
    const res = await admin.agent.post('/api/users').set('x-csrf-token', admin.token).send({ email: ' Pilot@Demo.Speedwright.Example ', displayName: 'Someone', role: 'pilot' });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'email_taken', fields: { email: expect.any(String) } });
    expect(mailsTo(demoEmail('pilot')).length).toBe(before);
  });

  it('answers an address that signs in at another operator exactly like a new one, and tells its owner what to do (issue 12, finding 10)', async () => {
    const admin = await signIn(harness.app, demoEmail('admin'));
    const [elsewherePerson] = await newTeam(harness.app, ['pilot']);
    const address = (await User.findByPk(elsewherePerson!.id, { rejectOnEmpty: true })).email;
    const send = (email: string) => admin.agent.post('/api/users').set('x-csrf-token', admin.token).send({ email, displayName: 'Someone New', role: 'pilot' });
    const elsewhere = await send(address);
    try {
    const fresh = await send(freshEmail('fresh'));
    const shape = (res: typeof fresh) => ({ status: res.status, keys: Object.keys(res.body).sort(), user: Object.keys(res.body.user ?? {}).sort(), pending: res.body.user?.invitationPending, mailSent: res.body.mailSent });
    expect(shape(elsewhere)).toEqual(shape(fresh));
    expect(elsewhere.status).toBe(201);
    // The people list shows both alike, as pending invitations.
    const list = (await admin.agent.get('/api/users').expect(200)).body.users as { email: string; invitationPending: boolean }[];
    expect(list.find((p) => p.email === address)?.invitationPending).toBe(true);

    const mail = await mailTo(address, (entry) => entry.subject.startsWith('You are invited to Kestrel Fen'));
    expect(mail.text).toMatch(/already signs in to Speedwright for another operator/);
    expect(mail.text).toMatch(/invite another of your e-mail addresses/);
    expect(mail.links.some((link) => link.includes('/invitation'))).toBe(false);
    // The account elsewhere keeps working.
    const second = await signIn(harness.app, address);
    expect((await second.agent.get('/api/auth/me').expect(200)).body.user.operatorName).toMatch(/^Test team/);
    } finally {
      await User.destroy({ where: { id: elsewhere.body.user.id } });
    }
  });

  it('lets one of two operators’ invitations to the same new address be accepted, not both', async () => {
    const address = freshEmail('both');
    const { token: first } = await invite(address, 'pilot');
    const otherAdmin = await signIn(harness.app, demoEmail('admin', 'second'));
    expect((await otherAdmin.agent.post('/api/users').set('x-csrf-token', otherAdmin.token).send({ email: address, displayName: 'Both Places', role: 'pilot' })).status).toBe(201);
    const secondMail = await mailTo(address, (entry) => entry.subject.includes('Larkspur'));
    const second = tokenOf(secondMail.links[0]!, '/invitation');
    expect((await accept(first)).status).toBe(200);
    const refused = await accept(second);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('address_in_use');
  });

  it('names every wrong field of an invitation and creates nothing', async () => {
    const admin = await signIn(harness.app, demoEmail('admin'));
    const count = await User.count();
    const res = await admin.agent.post('/api/users').set('x-csrf-token', admin.token).send({ email: 'nope', role: 'captain', extra: 1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['displayName', 'email', 'extra', 'role']);
    expect(res.body.error.fields.role).toMatch(/Choose one of the roles/);
    expect(await User.count()).toBe(count);
  });
});

describe('password reset', () => {
  const reset = async (email: string) => {
    const { agent, token } = await csrfAgent(harness.app);
    return agent.post('/api/auth/password-reset').set('x-csrf-token', token).send({ email });
  };
  const confirm = async (token: string, password = 'the newest long password') => {
    const { agent, token: csrf } = await csrfAgent(harness.app);
    return agent.post('/api/auth/password-reset/confirm').set('x-csrf-token', csrf).send({ token, password });
  };

  it('mails a one-hour link; the new password works, the old one and old sessions do not', async () => {
    const { email, id } = await member('pilot', 'forgetful');
    const oldSession = await signIn(harness.app, email, NEW_PASSWORD);

    const res = await reset(email.toUpperCase());
    expect(res.status).toBe(202);
    const mail = await mailTo(email, (entry) => entry.subject === 'Choose a new Speedwright password');
    expect(mail.text).toContain('works once and until');
    const token = tokenOf(mail.links[0]!, '/reset-password');
    const stored = await PasswordResetToken.findOne({ where: { userId: id }, rejectOnEmpty: true });
    const minutes = (stored.expiresAt.getTime() - Date.now()) / 60_000;
    expect(minutes).toBeGreaterThan(59);
    expect(minutes).toBeLessThanOrEqual(60);

    const done = await confirm(token);
    expect(done.status).toBe(200);
    expect(done.body).toEqual({ email });
    await oldSession.agent.get('/api/auth/me').expect(401);
    await signIn(harness.app, email, 'the newest long password');
    const { agent, token: csrf } = await csrfAgent(harness.app);
    expect((await agent.post('/api/auth/login').set('x-csrf-token', csrf).send({ email, password: NEW_PASSWORD })).status).toBe(401);

    const reuse = await confirm(token, 'yet another long password');
    expect(reuse.status).toBe(410);
    expect(reuse.body.error.code).toBe('link_used');
    expect(await AuditEvent.count({ where: { action: 'user.password-reset', entityId: String(id) } })).toBe(1);
  });

  it('refuses an expired reset link', async () => {
    const { email, id } = await member('pilot', 'slow');
    expect((await reset(email)).status).toBe(202);
    const token = tokenOf((await mailTo(email, (entry) => entry.subject.includes('new Speedwright password'))).links[0]!, '/reset-password');
    await PasswordResetToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: id } });
    const res = await confirm(token);
    expect(res.status).toBe(410);
    expect(res.body.error).toMatchObject({ code: 'link_expired', message: expect.stringMatching(/one hour/) });
    await signIn(harness.app, email, NEW_PASSWORD);
  });

  it('answers an unknown address exactly like a known one and sends nothing', async () => {
    const unknown = freshEmail('nobody');
    const { email } = await member('pilot', 'known');
    const a = await reset(unknown);
    const b = await reset(email);
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(a.body).toEqual(b.body);
    await mailTo(email, (entry) => entry.subject.includes('new Speedwright password'));
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(mailsTo(unknown)).toEqual([]);
  });

  it('stops mailing one account after three links in an hour', async () => {
    const { email } = await member('pilot', 'impatient');
    for (let i = 0; i < 5; i++) expect((await reset(email)).status).toBe(202);
    await new Promise((resolve) => setTimeout(resolve, 400));
    expect(mailsTo(email).filter((entry) => entry.subject.includes('new Speedwright password'))).toHaveLength(3);
  });

  it('names a bad address and a short password', async () => {
    expect((await reset('not an address')).body.error.fields).toEqual({ email: expect.any(String) });
    const res = await confirm('B'.repeat(43), 'short');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/at least 12/);
  });
});

describe('PATCH /api/users/:id', () => {
  it('changes the role of a signed-in person at once', async () => {
    const { email, id } = await member('engineer', 'promoted');
    const person = await signIn(harness.app, email, NEW_PASSWORD);
    await person.agent.get('/api/users').expect(403);

    const admin = await signIn(harness.app, demoEmail('admin'));
    const res = await admin.agent.patch(`/api/users/${id}`).set('x-csrf-token', admin.token).send({ role: 'admin' });
    expect(res.status).toBe(200);
    expect(operatorPersonResponseSchema.parse(res.body).user).toMatchObject({ id, role: 'admin' });
    await person.agent.get('/api/users').expect(200);
    expect((await person.agent.get('/api/auth/me')).body.user.role).toBe('admin');

    // The new admin steps down again: allowed, because the demo admin remains.
    const down = await person.agent.patch(`/api/users/${id}`).set('x-csrf-token', person.token).send({ role: 'pilot' });
    expect(down.status).toBe(200);
    await person.agent.get('/api/users').expect(403);
    const events = await AuditEvent.findAll({ where: { action: 'user.role-changed', entityId: String(id) }, order: [['id', 'ASC']] });
    expect(events.map((e) => e.detailsObject())).toEqual([{ from: 'engineer', to: 'admin' }, { from: 'admin', to: 'pilot' }]);
  });

  it('locks a person out of their open session and sign-in, and unlocks them', async () => {
    const { email, id } = await member('pilot', 'locked');
    const person = await signIn(harness.app, email, NEW_PASSWORD);
    const admin = await signIn(harness.app, demoEmail('admin'));
    const locked = await admin.agent.patch(`/api/users/${id}`).set('x-csrf-token', admin.token).send({ locked: true });
    expect(locked.status).toBe(200);
    expect(locked.body.user.locked).toBe(true);
    await person.agent.get('/api/auth/me').expect(401);
    const { agent, token } = await csrfAgent(harness.app);
    expect((await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email, password: NEW_PASSWORD })).status).toBe(423);

    await admin.agent.patch(`/api/users/${id}`).set('x-csrf-token', admin.token).send({ locked: false }).expect(200);
    await signIn(harness.app, email, NEW_PASSWORD);
    const actions = (await AuditEvent.findAll({ where: { entityId: String(id), action: ['user.locked', 'user.unlocked'] }, order: [['id', 'ASC']] })).map((e) => e.action);
    expect(actions).toEqual(['user.locked', 'user.unlocked']);
  });

  it('keeps the last administrator who can sign in, and nobody locks themself', async () => {
    const admin = await signIn(harness.app, demoEmail('admin'));
    const adminId = (await admin.agent.get('/api/auth/me')).body.user.id as number;
    // An invited admin who has not chosen a password does not count.
    await invite(freshEmail('pending-admin'), 'admin');

    const demote = await admin.agent.patch(`/api/users/${adminId}`).set('x-csrf-token', admin.token).send({ role: 'approver' });
    expect(demote.status).toBe(409);
    expect(demote.body.error).toMatchObject({ code: 'last_admin', message: expect.stringMatching(/only administrator who can sign in/) });

    const lockSelf = await admin.agent.patch(`/api/users/${adminId}`).set('x-csrf-token', admin.token).send({ locked: true });
    expect(lockSelf.status).toBe(409);
    expect(lockSelf.body.error).toMatchObject({ code: 'cannot_lock_self', message: expect.stringMatching(/cannot lock your own account/) });

    const still = await User.findByPk(adminId, { rejectOnEmpty: true });
    expect(still).toMatchObject({ role: 'admin', lockedByAdmin: false });
    await admin.agent.get('/api/users').expect(200);
  });

  it('answers 404 for another operator’s person and for ids that do not exist', async () => {
    const demoPilot = await User.findOne({ where: { email: demoEmail('pilot') }, rejectOnEmpty: true });
    const second = await signIn(harness.app, demoEmail('admin', 'second'));
    for (const send of [
      () => second.agent.patch(`/api/users/${demoPilot.id}`).set('x-csrf-token', second.token).send({ role: 'admin' }),
      () => second.agent.post(`/api/users/${demoPilot.id}/invitation`).set('x-csrf-token', second.token),
      () => second.agent.patch('/api/users/99999999').set('x-csrf-token', second.token).send({ locked: true }),
      () => second.agent.patch('/api/users/abc').set('x-csrf-token', second.token).send({ locked: true }),
    ]) {
      const res = await send();
      expect(res.status).toBe(404);
      expect(res.body.error).toEqual(expect.objectContaining({ code: 'not_found', message: 'That person does not exist.' }));
    }
    expect((await User.findByPk(demoPilot.id, { rejectOnEmpty: true })).role).toBe('pilot');
  });

  it('refuses an empty change and unknown fields', async () => {
    const admin = await signIn(harness.app, demoEmail('admin'));
    const { id } = await member('pilot', 'unchanged');
    const empty = await admin.agent.patch(`/api/users/${id}`).set('x-csrf-token', admin.token).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields['(body)']).toMatch(/at least one of role, locked or displayName/);
    const wrong = await admin.agent.patch(`/api/users/${id}`).set('x-csrf-token', admin.token).send({ locked: 'yes', passwordHash: 'x' });
    expect(wrong.status).toBe(400);
    expect(Object.keys(wrong.body.error.fields).sort()).toEqual(['locked', 'passwordHash']);
  });
});

describe('the fake mailbox page', () => {
  it('never shows an administrator the token of a person’s password-reset link (issue 12, informational)', async () => {
    const { email } = await member('pilot', 'reset-mailbox');
    const { agent, token } = await csrfAgent(harness.app);
    await agent.post('/api/auth/password-reset').set('x-csrf-token', token).send({ email }).expect(202);
    const sent = await mailTo(email, (entry) => /new Speedwright password/.test(entry.subject));
    expect(sent.links.some((link) => /\/reset-password#token=[A-Za-z0-9_-]{43}$/.test(link))).toBe(true);
    const admin = await signIn(harness.app, demoEmail('admin'));
    const shown = mailboxResponseSchema.parse((await admin.agent.get('/api/dev/mailbox').expect(200)).body).messages.find((m) => m.id === sent.id);
    expect(shown).toBeDefined();
    expect(JSON.stringify(shown)).not.toMatch(/#token=[A-Za-z0-9_-]{43}/);
    expect(shown!.links[0]).toMatch(/\/reset-password#token=\(hidden/);
  });

  it('shows an admin the mail to their own operator’s people only', async () => {
    const email = freshEmail('mailbox');
    await invite(email);
    const admin = await signIn(harness.app, demoEmail('admin'));
    const ours = mailboxResponseSchema.parse((await admin.agent.get('/api/dev/mailbox').expect(200)).body);
    const message = ours.messages.find((m) => m.to.includes(email));
    expect(message).toMatchObject({ subject: expect.stringMatching(/invited/), links: [expect.stringMatching(/\/invitation#token=/)] });

    const second = await signIn(harness.app, demoEmail('admin', 'second'));
    const theirs = mailboxResponseSchema.parse((await second.agent.get('/api/dev/mailbox').expect(200)).body);
    expect(theirs.messages.some((m) => m.to.includes(email))).toBe(false);
  });
});

describe('who may do what', () => {
  const roles = ['pilot', 'engineer', 'approver', 'inspector'] as const;
  let targetId: number;
  beforeAll(async () => {
    targetId = (await member('pilot', 'target')).id;
  });

  type Call = (agent: Awaited<ReturnType<typeof signIn>>['agent'], token: string) => request.Test;
  const routes: Record<string, Call> = {
    'GET /api/users': (agent) => agent.get('/api/users'),
    'POST /api/users': (agent, token) => agent.post('/api/users').set('x-csrf-token', token).send({ email: freshEmail('matrix'), displayName: 'Matrix Person', role: 'pilot' }),
    'PATCH /api/users/:id': (agent, token) => agent.patch(`/api/users/${targetId}`).set('x-csrf-token', token).send({ displayName: 'Renamed Pilot' }),
    'POST /api/users/:id/invitation': (agent, token) => agent.post(`/api/users/${targetId}/invitation`).set('x-csrf-token', token),
    'GET /api/dev/mailbox': (agent) => agent.get('/api/dev/mailbox'),
  };
  const expected: Record<string, Record<string, number>> = {
    'GET /api/users': { admin: 200, second: 200 },
    'POST /api/users': { admin: 201, second: 201 },
    // The target has accepted, so a new invitation is a conflict for its own admin.
    'PATCH /api/users/:id': { admin: 200, second: 404 },
    'POST /api/users/:id/invitation': { admin: 409, second: 404 },
    'GET /api/dev/mailbox': { admin: 200, second: 200 },
  };

  for (const [name, call] of Object.entries(routes)) {
    it.each(roles)(`${name} answers 403 to a %s`, async (role) => {
      const { agent, token } = await sessionOf(harness.app, role);
      const res = await call(agent, token);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    });
    it(`${name} answers ${expected[name]!['admin']} to the admin and ${expected[name]!['second']} to the second operator’s admin`, async () => {
      const admin = await signIn(harness.app, demoEmail('admin'));
      expect((await call(admin.agent, admin.token)).status).toBe(expected[name]!['admin']);
      const second = await signIn(harness.app, demoEmail('admin', 'second'));
      expect((await call(second.agent, second.token)).status).toBe(expected[name]!['second']);
    });
    it(`${name} answers 401 when signed out`, async () => {
      const { agent, token } = await csrfAgent(harness.app);
      expect((await call(agent, token)).status).toBe(401);
    });
  }

  it('lets anyone use the mail links without signing in (the token is the proof)', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    expect((await agent.post('/api/auth/invitations/accept').set('x-csrf-token', token).send({ token: 'C'.repeat(43), password: NEW_PASSWORD })).status).toBe(400);
    expect((await agent.post('/api/auth/password-reset').set('x-csrf-token', token).send({ email: freshEmail('anyone') })).status).toBe(202);
    expect((await agent.post('/api/auth/password-reset/confirm').set('x-csrf-token', token).send({ token: 'C'.repeat(43), password: NEW_PASSWORD })).status).toBe(400);
    expect((await request(harness.app).post('/api/auth/password-reset').send({ email: freshEmail('nocsrf') })).status).toBe(403);
  });

  it('keeps the demo password of the seeded accounts working', async () => {
    await signIn(harness.app, demoEmail('admin'), TEST_PASSWORD);
  });
});

// Last in the file: a second harness re-binds the models to its own connection and closes it.
describe('without the fake mailbox', () => {
  it('has no mailbox page when no fake mailbox is in use', async () => {
    const real = startHarness({ MAILBOX_DIR: undefined });
    try {
      const admin = await signIn(real.app, demoEmail('admin'));
      const res = await admin.agent.get('/api/dev/mailbox');
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('no_such_route');
    } finally {
      await real.close();
    }
  });
});
