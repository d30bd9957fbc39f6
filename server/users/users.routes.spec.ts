import request from 'supertest';
import { operatorPeopleSchema } from '../../shared/api/auth';
import { ROLES } from '../../shared/auth/roles';
import { demoEmail, signIn, startHarness, type Harness } from '../../test/api/harness';

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
    expect(users.map((u) => u.email).sort()).toEqual(ROLES.map((role) => demoEmail(role)).sort());
    expect(JSON.stringify(res.body)).not.toMatch(/password|hash/i);

    const second = await signIn(harness.app, demoEmail('admin', 'second'));
    const other = operatorPeopleSchema.parse((await second.agent.get('/api/users').expect(200)).body);
    expect(other.users.map((u) => u.email).sort()).toEqual([demoEmail('admin', 'second'), demoEmail('pilot', 'second')]);
  });

  it.each(ROLES.filter((role) => role !== 'admin'))('answers 403 to a %s', async (role) => {
    const { agent } = await signIn(harness.app, demoEmail(role));
    const res = await agent.get('/api/users');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('answers 401 when signed out', async () => {
    await request(harness.app).get('/api/users').expect(401);
  });
});
