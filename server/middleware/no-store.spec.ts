/**
 * No cache keeps an /api answer (security issue 12, finding 7; ASVS 8.2.1 "anti-caching
 * headers" for sensitive data): people, revisions, the card log, the operator's settings, an
 * error, a 404 — every answer behind the sign-in says `Cache-Control: no-store`, set once in
 * app.ts so a new route cannot forget it.
 */
import request from 'supertest';
import { startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, publish, signInEveryone, type SessionsByRole } from '../../test/api/test-helpers';

jest.setTimeout(60_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

describe('Cache-Control on the API', () => {
  it('is no-store on every answer with personal or operator data, errors and 404s included', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const revisionId = await publish(as.engineer, as.approver, speedBookId);
    const answers = [
      await as.admin.agent.get('/api/users').expect(200),
      await as.pilot.agent.get(`/api/revisions/${revisionId}`).expect(200),
      await as.admin.agent.get('/api/card-issues').expect(200),
      await as.admin.agent.get('/api/operator/settings').expect(200),
      await as.pilot.agent.get(`/api/speed-books/${speedBookId}`).expect(200),
      await as.pilot.agent.get('/api/aircraft-types').expect(200),
      await as.pilot.agent.get('/api/operator/settings').expect(403),
      await as.pilot.agent.get('/api/no-such-thing').expect(404),
      await request(harness.app).get('/api/users').expect(401),
    ];
    for (const answer of answers) expect([answer.req.path, answer.headers['cache-control']]).toEqual([answer.req.path, 'no-store']);
  });
});
