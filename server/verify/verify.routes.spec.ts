/**
 * The public card check against the test database: every status a code can have (current,
 * superseded after a new publication, withdrawn, unknown), malformed codes and a wrong check
 * character, no disclosure beyond the card (the exact key sets, no cookie), the source a check
 * page re-derives the card from, and the rate limit on codes that match no card.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import request from 'supertest';
import { generateCardCode, cardCodeCheckCharacter, formatCardCode } from '@shared/card-check/card-code';
import { verifyResponseSchema, verifySourceResponseSchema } from '@shared/card-check/verify-api';
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';
import { cardIssueBatchResponseSchema, cardPreviewResponseSchema } from '@shared/card/card-api';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, publish, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

jest.setTimeout(60_000);

let harness: Harness;
let as: SessionsByRole;
let book: { aircraftTypeId: number; speedBookId: number };
let airframe: { id: number; registration: string };

const post = (who: Session, path: string) => who.agent.post(path).set('x-csrf-token', who.token);

beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
  book = await newSpeedBook(as.admin, as.engineer);
  const registration = `ZZ-${randomBytes(2).toString('hex').toUpperCase()}`;
  const created = await post(as.admin, '/api/airframes').send({ registration, serial: `T-${registration}`, aircraftTypeId: book.aircraftTypeId }).expect(201);
  airframe = { id: created.body.airframe.id, registration: created.body.airframe.registration };
});
afterAll(() => harness.close());

const inputs = (weightKg = 1000): CardInputs => ({
  airframeId: airframe.id,
  weightKg,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
  isaDeviationC: 3,
  cruise: { iasKt: 110 },
  altitudeStepFt: 2000,
});

/** The pilot previews a card of `revisionId`, reports it as issued at `issuedAt`; its code and digest. */
async function issue(revisionId: number, cardInputs: CardInputs, issuedAt = '2026-12-01T09:30:00.000Z'): Promise<{ code: string; digest: string }> {
  const card = cardPreviewResponseSchema.parse((await post(as.pilot, '/api/cards/preview').send({ revisionId, inputs: cardInputs }).expect(200)).body).card;
  const entry = { id: randomUUID(), airframeId: airframe.id, revisionId, inputs: cardInputs, digest: card.digest, issuedAt };
  const [result] = cardIssueBatchResponseSchema.parse((await post(as.pilot, '/api/card-issues').send({ entries: [entry] }).expect(200)).body).results;
  if (result.outcome !== 'recorded') throw new Error(result.error.message);
  return { code: result.code, digest: card.digest };
}

const verify = (code: string, app = harness.app) => request(app).get(`/api/verify/${encodeURIComponent(code)}`);

async function publishedAtOf(revisionId: number): Promise<string> {
  return (await as.pilot.agent.get(`/api/revisions/${revisionId}`).expect(200)).body.revision.publishedAt as string;
}

describe('GET /api/verify/:code', () => {
  it('follows a card through current, superseded and withdrawn, telling only what the card prints', async () => {
    const first = await publish(as.engineer, as.approver, book.speedBookId);
    const card = await issue(first, inputs());

    const current = await verify(card.code).expect(200);
    expect(current.body).toEqual({
      status: 'current',
      revision: { number: 1, publishedAt: await publishedAtOf(first) },
      registration: airframe.registration,
      issuedAt: '2026-12-01T09:30:00.000Z',
    });
    // Exactly these keys, nothing else about the operator; no session cookie, never cached.
    expect(Object.keys(current.body).sort()).toEqual(['issuedAt', 'registration', 'revision', 'status']);
    expect(Object.keys(current.body.revision).sort()).toEqual(['number', 'publishedAt']);
    expect(current.headers['set-cookie']).toBeUndefined();
    expect(current.headers['cache-control']).toBe('no-store');
    expect(current.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(current.headers['etag']).toBeUndefined();
    expect(verifyResponseSchema.parse(current.body)).toEqual(current.body);

    // The printed form (dashes, lower case) asks about the same card.
    expect((await verify(formatCardCode(card.code).toLowerCase()).expect(200)).body).toEqual(current.body);

    // A new revision is published: the first card is superseded; a card of the new one is current.
    const content = demoPistonTrainerContent();
    const second = await publish(as.engineer, as.approver, book.speedBookId, { ...content, notes: 'Second test revision (invented).' });
    expect((await verify(card.code).expect(200)).body).toEqual({ ...current.body, status: 'superseded' });
    const later = await issue(second, inputs(980), '2026-12-01T11:00:00.000Z');
    expect((await verify(later.code).expect(200)).body).toEqual({
      status: 'current',
      revision: { number: 2, publishedAt: await publishedAtOf(second) },
      registration: airframe.registration,
      issuedAt: '2026-12-01T11:00:00.000Z',
    });

    // The new revision is withdrawn: its card says so; the older card stays superseded.
    await post(as.approver, `/api/revisions/${second}/withdraw`).send({ reason: 'Test withdrawal' }).expect(200);
    expect((await verify(later.code).expect(200)).body).toMatchObject({ status: 'withdrawn', revision: { number: 2 } });
    expect((await verify(card.code).expect(200)).body).toMatchObject({ status: 'superseded' });
  });

  it('answers only status unknown for a well-formed code no card has', async () => {
    const res = await verify(generateCardCode()).expect(200);
    expect(res.body).toEqual({ status: 'unknown' });
  });

  it('refuses a malformed code with a sentence (400), and says so when the check character does not fit', async () => {
    const short = await verify('K7M-4RT').expect(400);
    expect(short.body.error).toMatchObject({ code: 'invalid_code', message: 'A card code has 9 characters (such as K7M-4RT-X9X); this one has 6.', fields: { code: expect.any(String) } });
    expect(short.body.error.requestId).toBe(short.headers['x-request-id']);
    const letterO = await verify('K7M-4RT-X9O').expect(400);
    expect(letterO.body.error).toMatchObject({ code: 'invalid_code', message: expect.stringContaining('never contains the letter O') });
    const body = 'K7M4RTX9';
    const wrongCheck = [...'23456789ACEFHJKMNPRTWXY'].find((c) => c !== cardCodeCheckCharacter(body))!;
    const typo = await verify(body + wrongCheck).expect(400);
    expect(typo.body.error).toMatchObject({ code: 'code_check_failed', message: expect.stringContaining('last character does not fit') });
    await verify('%20').expect(400);
  });
});

describe('GET /api/verify/:code/source', () => {
  it('gives what the card was built from, and it re-derives the issued card to the digest', async () => {
    const revisionId = await publish(as.engineer, as.approver, book.speedBookId);
    const cardInputs = inputs(940);
    const card = await issue(revisionId, cardInputs);
    const res = await request(harness.app).get(`/api/verify/${card.code}/source`).expect(200);
    const source = verifySourceResponseSchema.parse(res.body);
    expect(Object.keys(res.body).sort()).toEqual(['context', 'digest', 'revision', 'signature']);
    expect(Object.keys(res.body.signature).sort()).toEqual(['algorithm', 'keyId', 'keyRetiredAt', 'operatorId', 'publicKey', 'value']);
    expect(Object.keys(res.body.revision).sort()).toEqual(['content', 'contentSha256', 'id', 'number', 'publishedAt']);
    expect(Object.keys(res.body.context).sort()).toEqual(['aircraftType', 'airframe', 'demo', 'speedBook']);
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(source.digest).toBe(card.digest);
    expect(source.revision).toMatchObject({ id: revisionId, publishedAt: await publishedAtOf(revisionId) });
    expect(source.context.airframe).toEqual(airframe);
    expect(buildCard(source.revision, cardInputs, source.context).digest).toBe(card.digest);
    // Other inputs give another card: the page can tell a payload that is not the issued card.
    expect(buildCard(source.revision, inputs(930), source.context).digest).not.toBe(card.digest);
  });

  it('answers 404 for an unknown code and 400 for a malformed one', async () => {
    expect((await request(harness.app).get(`/api/verify/${generateCardCode()}/source`).expect(404)).body.error.code).toBe('unknown_code');
    expect((await request(harness.app).get('/api/verify/ABC/source').expect(400)).body.error.code).toBe('invalid_code');
  });
});

describe('the limit on codes that match no card', () => {
  it('stops an address after too many unknown or malformed codes; real cards do not count', async () => {
    const limited = startHarness({ VERIFY_UNKNOWN_CODES_PER_15_MIN: '3' });
    try {
      const revisionId = await publish(as.engineer, as.approver, book.speedBookId);
      const card = await issue(revisionId, inputs(960));
      for (let i = 0; i < 10; i++) await verify(card.code, limited.app).expect(200);
      await verify(generateCardCode(), limited.app).expect(200);
      await verify('ABC', limited.app).expect(400);
      await request(limited.app).get(`/api/verify/${generateCardCode()}/source`).expect(404);
      const blocked = await verify(generateCardCode(), limited.app).expect(429);
      expect(blocked.body.error).toMatchObject({ code: 'too_many_unknown_codes', message: expect.stringContaining('Wait 15 minutes') });
    } finally {
      await limited.close();
    }
  });

  it('still answers a real card once the address is over its limit; only unknown and malformed codes get 429', async () => {
    const limited = startHarness({ VERIFY_UNKNOWN_CODES_PER_15_MIN: '100' });
    try {
      const revisionId = await publish(as.engineer, as.approver, book.speedBookId);
      const card = await issue(revisionId, inputs(970));
      for (let i = 0; i < 100; i++) await verify(generateCardCode(), limited.app).expect(200);
      await verify(generateCardCode(), limited.app).expect(429);
      const real = await verify(card.code, limited.app).expect(200);
      expect(real.body).toMatchObject({ status: 'current' });
      expect(real.headers['retry-after']).toBeUndefined();
      await request(limited.app).get(`/api/verify/${card.code}/source`).expect(200);
      await request(limited.app).get(`/api/verify/${generateCardCode()}/source`).expect(429);
      expect((await verify('ABC', limited.app).expect(429)).body.error.code).toBe('too_many_unknown_codes');
      // Checking the real card again and again never lifts the limit for guesses.
      for (let i = 0; i < 5; i++) await verify(card.code, limited.app).expect(200);
      await verify(generateCardCode(), limited.app).expect(429);
    } finally {
      await limited.close();
    }
  });
});
