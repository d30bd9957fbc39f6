import request from 'supertest';
import { csrfAgent, startHarness, type Harness } from '../../test/api/harness';

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

describe('bad input', () => {
  it('answers malformed JSON with 400 and a sentence', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).set('content-type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_json', message: 'The request body is not valid JSON.' });
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js|stack/);
  });

  it('answers a body over the limit with 413', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent
      .post('/api/auth/login')
      .set('x-csrf-token', token)
      .set('content-type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.example', password: 'x'.repeat(1_100_000) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('answers wrong types and missing fields field by field', async () => {
    const { agent, token } = await csrfAgent(harness.app);
    const res = await agent.post('/api/auth/login').set('x-csrf-token', token).send({ email: 42 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ email: expect.any(String), password: expect.any(String) });
  });

  it('answers unknown API routes with 404 JSON, not the app', async () => {
    const res = await request(harness.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body.error.code).toBe('no_such_route');
  });

  it('sends a content-security policy without inline scripts and a request id', async () => {
    const res = await request(harness.app).get('/api/health');
    expect(res.headers['content-security-policy']).toMatch(/script-src 'self'(;|$)/);
    expect(res.headers['content-security-policy']).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('keeps a caller’s well-formed request id', async () => {
    const res = await request(harness.app).get('/api/health').set('x-request-id', 'ramp-tablet-42');
    expect(res.headers['x-request-id']).toBe('ramp-tablet-42');
  });
});
