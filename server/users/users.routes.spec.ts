import request from 'supertest';
import { operatorPeopleSchema } from '@shared/api/auth';
import { ROLES } from '@shared/auth/roles';
import { demoEmail, signIn, startHarness, type Harness } from '../../test/api/harness';
import { sessionOf } from '../../test/api/role-sessions';
import { User } from '../models';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

describe('GET /api/users', () => {
  it('lists only the administrator’s own operator’s people', async () => {
    const { agent } = await signIn(harness.app, demoEmail('admin'));
    const res = await agent.get('/api/users').expect(200);
    const { users } = operatorPeopleSchema.parse(res.body);
    // Other test files invite people into the demo operator while this one runs, so the list
    // is compared with the operator's rows in the database rather than with the seed alone.
    const demoOperatorId = (await User.findOne({ where: { email: demoEmail('admin') }, rejectOnEmpty: true })).operatorId;
    const expected = (await User.findAll({ where: { operatorId: demoOperatorId } })).map((u) => u.email);
    const listed = users.map((u) => u.email);
    expect(listed).toEqual(expect.arrayContaining(ROLES.map((role) => demoEmail(role))));
    expect(listed.every((email) => expected.includes(email))).toBe(true);
    expect(listed.some((email) => email.endsWith('@second.speedwright.example'))).toBe(false);
    expect(JSON.stringify(res.body)).not.toMatch(/password|hash/i);

    const second = await signIn(harness.app, demoEmail('admin', 'second'));
    const other = operatorPeopleSchema.parse((await second.agent.get('/api/users').expect(200)).body);
    expect(other.users.map((u) => u.email)).toEqual(expect.arrayContaining([demoEmail('admin', 'second'), demoEmail('pilot', 'second')]));
    expect(other.users.some((u) => u.email.endsWith('@demo.speedwright.example'))).toBe(false);
  });

  it.each(ROLES.filter((role) => role !== 'admin'))('answers 403 to a %s', async (role) => {
    const { agent } = await sessionOf(harness.app, role);
    const res = await agent.get('/api/users');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('answers 401 when signed out', async () => {
    await request(harness.app).get('/api/users').expect(401);
  });
});
