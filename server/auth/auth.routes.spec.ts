import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { sessionUserSchema } from '@shared/api/auth';
import { ROLES } from '@shared/auth/roles';
import { csrfAgent, demoEmail, signIn, startHarness, TEST_PASSWORD, type Harness } from '../../test/api/harness';
import { User } from '../models';
import { SESSION_COOKIE } from '../app';

let harness: Harness;
beforeAll(() => {
  harness = startHarness({ LOCK_AFTER_FAILED_SIGN_INS: '3' });
});
afterAll(() => harness.close());

const sessionCookie = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((cookie) => cookie.startsWith(`${SESSION_COOKIE}=`));

describe('sign-in', () => {
  it.each(ROLES)('signs in the demo %s and answers the user with role and operator', async (role) => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: demoEmail(role), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const user = sessionUserSchema.parse(res.body.user);
    expect(user).toMatchObject({ email: demoEmail(role), role, operatorName: 'Kestrel Fen Aviation (demo)' });
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toEqual(res.body.user);
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: '  Pilot@Demo.Speedwright.Example ', password: TEST_PASSWORD }).expect(200);
  });

  it('issues a new session id at sign-in (no session fixation)', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const before = await agent.get('/api/auth/csrf');
    const login = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: demoEmail('pilot'), password: TEST_PASSWORD }).expect(200);
    const preCookie = sessionCookie(before) ?? '';
    const postCookie = sessionCookie(login);
    expect(postCookie).toBeDefined();
    expect(postCookie!.split(';')[0]).not.toBe(preCookie.split(';')[0]);
    expect(postCookie).toMatch(/HttpOnly/);
    expect(postCookie).toMatch(/SameSite=Lax/);
  });

  it('refuses a wrong password with a sentence and no user', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: demoEmail('engineer'), password: 'not-the-password' });
    expect(res.status).toBe(401);
    expect(res.body.error).toMatchObject({ code: 'invalid_credentials', message: 'The e-mail or password is not right.' });
    expect(res.body.user).toBeUndefined();
  });

  it('answers an unknown e-mail exactly like a wrong password', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: 'nobody@demo.speedwright.example', password: 'x' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('refuses sign-in without the CSRF token (login is protected too)', async () => {
    const res = await request(harness.app).post('/api/auth/login').send({ email: demoEmail('pilot'), password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
  });

  it('makes the address wait after repeated failures, even for the right password, and says so', async () => {
    const email = demoEmail('inspector');
    const { agent, token } = await csrfAgent(harness.app);
    const attempt = (password: string) => agent.post('/api/auth/login').set('x-csrf-token', token).send({ email, password });
    expect((await attempt('wrong-1')).status).toBe(401);
    expect((await attempt('wrong-2')).status).toBe(401);
    const third = await attempt('wrong-3');
    expect(third.status).toBe(423);
    expect(third.body.error.message).toMatch(/Too many wrong passwords for this address\. Try again in 1 minute/);
    const right = await attempt(TEST_PASSWORD);
    expect(right.status).toBe(423);
    // The administrator's people list shows the wait.
    expect((await User.findOne({ where: { email }, rejectOnEmpty: true })).lockedUntil).not.toBeNull();
    await harness.sequelize.query("DELETE FROM rate_limit_hits WHERE `key` LIKE 'sign-in-address:%'", { type: QueryTypes.DELETE });
    expect((await attempt(TEST_PASSWORD)).status).toBe(200);
  });

  it('refuses a person locked by the administrator and ends their session', async () => {
    const email = demoEmail('pilot', 'second');
    const { agent } = await signIn(harness.app, email);
    await agent.get('/api/auth/me').expect(200);
    await User.update({ lockedByAdmin: true }, { where: { email } });
    try {
      await agent.get('/api/auth/me').expect(401);
      const { agent: other, token } = await csrfAgent(harness.app);
      const res = await other.post('/api/auth/login').set('x-csrf-token', token).send({ email, password: TEST_PASSWORD });
      expect(res.status).toBe(423);
      expect(res.body.error.message).toMatch(/administrator/);
    } finally {
      await User.update({ lockedByAdmin: false }, { where: { email } });
    }
  });

  it('names the fields that are wrong', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: 'not-an-address', password: '', remember: true });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_request');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'password', 'remember']);
  });

  it('signs out: the session is gone and writes need a new token', async () => {
    const { agent, token } = await signIn(harness.app, demoEmail('approver'));
    await agent.post('/api/auth/logout').set('x-csrf-token', token).expect(204);
    await agent.get('/api/auth/me').expect(401);
  });

  it('answers 401 to /me when signed out', async () => {
    const res = await request(harness.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('not_signed_in');
  });
});

describe('login rate limit', () => {
  let limited: Harness;
  beforeAll(() => {
    limited = startHarness({ LOGIN_RATE_LIMIT_PER_15_MIN: '2' });
  });
  afterAll(() => limited.close());

  it('answers 429 after too many failed attempts from one address, counted in MariaDB', async () => {
    await limited.sequelize.query('DELETE FROM rate_limit_hits', { type: QueryTypes.DELETE });
    const { agent, token } = await csrfAgent(limited.app);
    const attempt = () => agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: 'nobody@demo.speedwright.example', password: 'x' });
    expect((await attempt()).status).toBe(401);
    expect((await attempt()).status).toBe(401);
    const third = await attempt();
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe('too_many_attempts');
    const rows = await limited.sequelize.query("SELECT hits FROM rate_limit_hits WHERE `key` LIKE 'login:%'", { type: QueryTypes.SELECT });
    expect(rows).toEqual([{ hits: 3 }]);
    await limited.sequelize.query('DELETE FROM rate_limit_hits', { type: QueryTypes.DELETE });
  });
});
