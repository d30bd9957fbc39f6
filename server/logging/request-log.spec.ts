/**
 * The logs hold ids, never a person's e-mail address, name or network address in clear
 * (README, "Logs"): the request log, the card check's own line and the mail log, captured from
 * the real app while people sign in wrongly and rightly, invite someone and ask odd URLs.
 */
import { Writable } from 'node:stream';
import request from 'supertest';
import { csrfAgent, startHarness, type Harness } from '../../test/api/harness';
import { newTeam } from '../../test/api/test-helpers';
import { logPseudonym } from './log-pseudonym';
import { errorSerializer } from './log-serializers';
import { createLogger } from './request-log';

/** SESSION_SECRET of test/api/harness.ts: the key of the pseudonyms. */
const HARNESS_SESSION_SECRET = 'test-session-secret-that-is-long-enough-0123456789';

describe('the logs', () => {
  let harness: Harness;
  const lines: string[] = [];
  const capture = new Writable({
    write(chunk: Buffer, _encoding, done) {
      lines.push(...chunk.toString('utf8').split('\n').filter(Boolean));
      done();
    },
  });

  beforeAll(() => {
    harness = startHarness({}, { logger: createLogger('info', capture) });
  });
  afterAll(() => harness.close());

  async function waitForLine(match: (line: string) => boolean): Promise<string> {
    for (let tries = 0; tries < 100; tries++) {
      const line = lines.find(match);
      if (line) return line;
      await new Promise((done) => setTimeout(done, 50));
    }
    throw new Error('The expected log line never came.');
  }

  it('name requests, people and clients by id or pseudonym only', async () => {
    const [admin] = await newTeam(harness.app, ['admin']);
    const pseudonym = logPseudonym(HARNESS_SESSION_SECRET);
    const invitee = { email: 'ines.privatperson@mail.example', displayName: 'Ines Privatperson', role: 'pilot' };

    // A proxy in front (TRUST_PROXY=loopback) names the client's address.
    const stranger = await csrfAgent(harness.app);
    await stranger.agent
      .post('/api/auth/login')
      .set('x-csrf-token', stranger.token)
      .set('X-Forwarded-For', '198.51.100.23')
      .send({ email: 'who.is.this@mail.example', password: 'not the password 123' })
      .expect(401);
    const invited = await admin!.agent
      .post('/api/users')
      .set('x-csrf-token', admin!.token)
      .set('X-Forwarded-For', '203.0.113.77')
      .set('X-Request-Id', 'invite-request-1')
      .send(invitee);
    expect(invited.status).toBe(201);
    await request(harness.app).get('/api/no-such-route?email=ines.privatperson%40mail.example&who=ines.privatperson@mail.example').set('X-Forwarded-For', '203.0.113.77').expect(404);
    await request(harness.app).get('/api/verify/K7M4RTX9X').set('X-Forwarded-For', '198.51.100.24');
    const mailLine = await waitForLine((line) => line.includes('"mail sent"') || line.includes('mail could not be sent'));

    const everything = lines.join('\n');
    for (const personal of ['mail.example', 'Ines Privatperson', 'Privatperson', 'speedwright.example', '198.51.100.23', '203.0.113.77', '198.51.100.24', '127.0.0.1']) {
      expect({ personal, found: everything.includes(personal) }).toEqual({ personal, found: false });
    }

    const entries = lines.map((line) => JSON.parse(line) as Record<string, unknown>);
    const inviteLine = entries.find((entry) => (entry['req'] as { id?: string } | undefined)?.id === 'invite-request-1');
    expect(inviteLine).toMatchObject({
      req: { id: 'invite-request-1', method: 'POST', url: '/api/users', client: pseudonym('203.0.113.77') },
      res: { statusCode: 201 },
      userId: admin!.id,
      operatorId: expect.any(Number),
    });
    expect(Object.keys(inviteLine!['req'] as object).sort()).toEqual(['client', 'id', 'method', 'url']);
    const notFound = entries.find((entry) => (entry['res'] as { statusCode?: number } | undefined)?.statusCode === 404);
    expect((notFound!['req'] as { url: string }).url).toBe('/api/no-such-route?email=[address]&who=[address]');
    const cardCheck = entries.find((entry) => entry['msg'] === 'card check answered');
    expect(cardCheck).toMatchObject({ client: pseudonym('198.51.100.24'), reqId: expect.any(String) });
    expect(JSON.parse(mailLine)).toMatchObject({ to: pseudonym(invitee.email) });
  });

  it('keep an error’s type, message and codes, with addresses masked and no SQL or values', () => {
    const error = Object.assign(new Error("Duplicate entry 'ines.privatperson@mail.example' for key 'users_email'"), {
      sql: "INSERT INTO users (email) VALUES ('ines.privatperson@mail.example')",
      parameters: ['ines.privatperson@mail.example'],
      original: { code: 'ER_DUP_ENTRY', errno: 1062, sqlState: '23000', sql: 'INSERT …' },
    });
    const logged = errorSerializer(error);
    expect(logged).toMatchObject({ type: 'Error', message: "Duplicate entry '[address]' for key 'users_email'", db: { code: 'ER_DUP_ENTRY', errno: 1062, sqlState: '23000' } });
    expect(JSON.stringify(logged)).not.toContain('mail.example');
    expect(Object.keys(logged).sort()).toEqual(['db', 'message', 'stack', 'type']);
  });
});
