/**
 * The card API against the test database: the preview by role and operator, its refusals, and
 * the card log's idempotent reporting and reading.
 */
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { airframeListSchema, aircraftTypeListSchema } from '@shared/api/fleet';
import { revisionResponseSchema, speedBookListSchema } from '@shared/api/revisions';
import { CARD_CODE_PATTERN, isCardCode } from '@shared/card-check/card-code';
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';
import { cardIssueBatchResponseSchema, cardIssuePageSchema, cardPreviewResponseSchema, type CardIssueEntry } from '@shared/card/card-api';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { startHarness, type Harness } from '../../test/api/harness';
import * as cardCode from '@shared/card-check/card-code';
import type { Actor } from '../audit/actor';
import { AuditEvent, CardIssue } from '../models';
import { issueCardCode } from './card-issues.service';
import { newSpeedBook, publish, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

jest.setTimeout(60_000);

let harness: Harness;
let as: SessionsByRole;

interface Demo {
  jetRevisionId: number;
  jetAirframeId: number;
  trainerRevisionId: number;
  trainerSupersededId: number;
  trainerAirframeId: number;
}
let demo: Demo;

beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
  const books = speedBookListSchema.parse((await as.pilot.agent.get('/api/speed-books').expect(200)).body).speedBooks;
  const types = aircraftTypeListSchema.parse((await as.pilot.agent.get('/api/aircraft-types').expect(200)).body).aircraftTypes;
  const airframes = airframeListSchema.parse((await as.pilot.agent.get('/api/airframes').expect(200)).body).airframes;
  const typeId = (designator: string) => types.find((type) => type.designator === designator)!.id;
  const current = (designator: string) => books.find((book) => book.aircraftTypeId === typeId(designator))!.currentRevision!;
  const airframe = (registration: string) => airframes.find((a) => a.registration === registration)!.id;
  const trainer = current('ZZP1');
  const trainerBook = (await as.pilot.agent.get(`/api/speed-books/${trainer.speedBookId}`).expect(200)).body.speedBook;
  demo = {
    jetRevisionId: current('ZZJ2').id,
    jetAirframeId: airframe('ZZ-KFJ'),
    trainerRevisionId: trainer.id,
    trainerSupersededId: trainerBook.revisions.find((r: { status: string }) => r.status === 'superseded').id,
    trainerAirframeId: airframe('ZZ-KFA'),
  };
});
afterAll(() => harness.close());

/** The signed-in person of a session as a service actor. */
async function actorFor(who: Session): Promise<Actor> {
  const me = (await who.agent.get('/api/auth/me').expect(200)).body.user as { id: number; operatorId: number; role: Actor['role'] };
  return { operatorId: me.operatorId, userId: me.id, role: me.role };
}

const post = (who: Session, path: string) => who.agent.post(path).set('x-csrf-token', who.token);

const jetInputs = (overrides: Partial<CardInputs> = {}): CardInputs => ({
  airframeId: demo.jetAirframeId,
  weightKg: 4500,
  landingWeightKg: 4100,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 1200, qnhHpa: 1009, oatC: 24, dewPointC: 14 },
  isaDeviationC: 8,
  cruise: { mach: 0.68 },
  altitudeStepFt: 2000,
  ...overrides,
});

const trainerInputs = (airframeId: number, overrides: Partial<CardInputs> = {}): CardInputs => ({
  airframeId,
  weightKg: 1000,
  configuration: 'takeoff-flap',
  departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
  isaDeviationC: 3,
  cruise: { iasKt: 110 },
  altitudeStepFt: 2000,
  ...overrides,
});

async function previewDigest(who: Session, revisionId: number, inputs: CardInputs): Promise<string> {
  const res = await post(who, '/api/cards/preview').send({ revisionId, inputs }).expect(200);
  return cardPreviewResponseSchema.parse(res.body).card.digest;
}

describe('POST /api/cards/preview', () => {
  it('gives a pilot the card of the published revision, the same card the device computes', async () => {
    const res = await post(as.pilot, '/api/cards/preview').send({ revisionId: demo.jetRevisionId, inputs: jetInputs() }).expect(200);
    const { card } = cardPreviewResponseSchema.parse(res.body);
    expect(card).toMatchObject({ demo: true, airframe: { registration: 'ZZ-KFJ' }, aircraftType: { designator: 'ZZJ2', category: 'jet' }, revision: { id: demo.jetRevisionId, number: 1 } });
    expect(card.altitudeTable).toHaveLength(22); // 0 to 40,000 ft every 2,000 ft, then the 41,000 ft ceiling

    // The device's side: the revision as synced, and buildCard on it.
    const revision = revisionResponseSchema.parse((await as.pilot.agent.get(`/api/revisions/${demo.jetRevisionId}`).expect(200)).body).revision;
    const book = (await as.pilot.agent.get(`/api/speed-books/${revision.speedBookId}`).expect(200)).body.speedBook;
    const local = buildCard(
      { id: revision.id, number: revision.number, publishedAt: revision.publishedAt, contentSha256: revision.contentSha256!, content: revision.content },
      jetInputs(),
      { airframe: { id: demo.jetAirframeId, registration: 'ZZ-KFJ' }, aircraftType: { designator: 'ZZJ2', name: card.aircraftType.name }, speedBook: { id: book.id, title: book.title }, demo: true },
    );
    expect(local.digest).toBe(card.digest);
    expect(JSON.parse(JSON.stringify(local))).toEqual(card);
  });

  it('lets an engineer preview a draft; a pilot cannot see it', async () => {
    const { aircraftTypeId, speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const airframe = await post(as.admin, '/api/airframes').send({ registration: `ZZ-${randomUUID().slice(0, 3).toUpperCase()}`, serial: 'T-1', aircraftTypeId }).expect(201);
    const draft = await post(as.engineer, `/api/speed-books/${speedBookId}/revisions`).send({ content: demoPistonTrainerContent(), changeSummary: 'Draft for preview' }).expect(201);
    const inputs = trainerInputs(airframe.body.airframe.id);
    const res = await post(as.engineer, '/api/cards/preview').send({ revisionId: draft.body.revision.id, inputs }).expect(200);
    expect(res.body.card.revision).toEqual({ id: draft.body.revision.id, number: 1, publishedAt: null, contentSha256: contentSha256(demoPistonTrainerContent()) });
    await post(as.approver, '/api/cards/preview').send({ revisionId: draft.body.revision.id, inputs }).expect(200);
    const hidden = await post(as.pilot, '/api/cards/preview').send({ revisionId: draft.body.revision.id, inputs }).expect(404);
    expect(hidden.body.error.code).toBe('not_found');

    // A draft with problems is refused with the reason.
    await as.engineer.agent.patch(`/api/revisions/${draft.body.revision.id}`).set('x-csrf-token', as.engineer.token).send({ content: { schemaVersion: 1 } }).expect(200);
    const refused = await post(as.engineer, '/api/cards/preview').send({ revisionId: draft.body.revision.id, inputs }).expect(422);
    expect(refused.body.error).toMatchObject({ code: 'card_refused', fields: { revisionId: expect.stringMatching(/is not complete/) } });
  });

  it('is not for inspectors or administrators, and not across operators', async () => {
    await post(as.inspector, '/api/cards/preview').send({ revisionId: demo.jetRevisionId, inputs: jetInputs() }).expect(403);
    await post(as.admin, '/api/cards/preview').send({ revisionId: demo.jetRevisionId, inputs: jetInputs() }).expect(403);
    const other = await post(as.secondPilot, '/api/cards/preview').send({ revisionId: demo.jetRevisionId, inputs: jetInputs() }).expect(404);
    expect(other.body.error.code).toBe('not_found');
    await as.pilot.agent.post('/api/cards/preview').send({ revisionId: demo.jetRevisionId, inputs: jetInputs() }).expect(403); // no CSRF token
  });

  it('answers 422 card_refused with the input at fault', async () => {
    const refused = async (inputs: CardInputs, revisionId = demo.jetRevisionId) =>
      (await post(as.pilot, '/api/cards/preview').send({ revisionId, inputs }).expect(422)).body.error;
    expect(await refused(jetInputs({ weightKg: 4900 }))).toMatchObject({
      code: 'card_refused',
      message: 'The takeoff weight 4,900 kg is above the maximum takeoff weight of 4,800 kg.',
      fields: { 'inputs.weightKg': expect.stringContaining('4,800 kg') },
    });
    expect((await refused(jetInputs({ landingWeightKg: 4450 }))).fields).toHaveProperty(['inputs.landingWeightKg']);
    // The jet's book declares its takeoff envelope from −1,000 to 10,000 ft (its tables' range).
    expect((await refused(jetInputs({ departure: { elevationFt: 11000, qnhHpa: 1013, oatC: 0 } }))).fields['inputs.departure.elevationFt']).toMatch(/^The day is outside this book's takeoff envelope: the departure pressure altitude of 11,006 ft is above its range of −1,000 to 10,000 ft\.$/);
    expect((await refused(jetInputs({ departure: { elevationFt: 1200, qnhHpa: 1009, oatC: 95 } }))).fields).toHaveProperty(['inputs.departure.oatC']);
    // An airframe of another type.
    expect((await refused(jetInputs({ airframeId: demo.trainerAirframeId }))).fields['inputs.airframeId']).toMatch(/is not a Heronbolt J2/);
    // Not a body the API takes at all.
    const bad = await post(as.pilot, '/api/cards/preview').send({ revisionId: 'x', inputs: jetInputs() }).expect(400);
    expect(bad.body.error.fields).toHaveProperty('revisionId');
  });

  it('refuses a revision whose stored content no longer matches its published hash', async () => {
    const { aircraftTypeId, speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const airframe = await post(as.admin, '/api/airframes').send({ registration: `ZZ-${randomUUID().slice(0, 3).toUpperCase()}`, serial: 'T-2', aircraftTypeId }).expect(201);
    const revisionId = await publish(as.engineer, as.approver, speedBookId);
    const inputs = trainerInputs(airframe.body.airframe.id);
    await previewDigest(as.pilot, revisionId, inputs);
    const altered = demoPistonTrainerContent();
    altered.limits.vneKt = 165;
    // Behind the application's back (the model refuses such a change): what a damaged or edited database would hold.
    await harness.sequelize.query('UPDATE revisions SET content = ? WHERE id = ?', { replacements: [JSON.stringify(altered), revisionId], type: QueryTypes.UPDATE });
    const res = await post(as.pilot, '/api/cards/preview').send({ revisionId, inputs }).expect(422);
    expect(res.body.error).toMatchObject({ code: 'card_refused', fields: { revisionId: expect.stringMatching(/does not match its published hash/) } });
  });

  it('answers 409 for a superseded revision', async () => {
    const res = await post(as.pilot, '/api/cards/preview').send({ revisionId: demo.trainerSupersededId, inputs: trainerInputs(demo.trainerAirframeId) }).expect(409);
    expect(res.body.error.code).toBe('revision_not_current');
  });
});

describe('POST and GET /api/card-issues', () => {
  async function entryFor(who: Session, overrides: Partial<CardIssueEntry> = {}, inputs = jetInputs()): Promise<CardIssueEntry> {
    return {
      id: randomUUID(),
      airframeId: inputs.airframeId,
      revisionId: demo.jetRevisionId,
      inputs,
      digest: await previewDigest(who, overrides.revisionId ?? demo.jetRevisionId, inputs),
      issuedAt: new Date().toISOString(),
      ...overrides,
    };
  }
  const report = async (who: Session, entries: CardIssueEntry[]) =>
    cardIssueBatchResponseSchema.parse((await post(who, '/api/card-issues').send({ entries }).expect(200)).body).results;
  const stored = async (ids: string[]) => ({
    rows: await CardIssue.count({ where: { id: ids } }),
    audits: await AuditEvent.count({ where: { action: 'card.issued', entityId: ids } }),
  });

  it('records a batch once: the same batch again, and a partly new one, answer as the first time', async () => {
    const a = await entryFor(as.pilot);
    const b = await entryFor(as.pilot, {}, jetInputs({ weightKg: 4300 }));
    const first = await report(as.pilot, [a, b]);
    expect(first).toEqual([
      { id: a.id, outcome: 'recorded', status: 201, code: expect.stringMatching(CARD_CODE_PATTERN), digest: a.digest, receivedAt: expect.any(String) },
      { id: b.id, outcome: 'recorded', status: 201, code: expect.stringMatching(CARD_CODE_PATTERN), digest: b.digest, receivedAt: expect.any(String) },
    ]);
    const codes = first.map((result) => (result.outcome === 'recorded' ? result.code : ''));
    expect(codes.every(isCardCode)).toBe(true);
    expect(codes[0]).not.toBe(codes[1]);
    // A replay gives the same codes: the code is drawn once, on the first report.
    expect(await report(as.pilot, [a, b])).toEqual(first);
    expect(await report(as.pilot, [{ ...a, id: a.id.toUpperCase() }])).toEqual([first[0]]);
    expect((await CardIssue.findByPk(a.id, { rejectOnEmpty: true })).code).toBe(codes[0]);
    const c = await entryFor(as.pilot, {}, jetInputs({ weightKg: 4200 }));
    const overlap = await report(as.pilot, [b, c]);
    expect(overlap[0]).toEqual(first[1]);
    expect(overlap[1]).toMatchObject({ id: c.id, outcome: 'recorded' });
    expect(await stored([a.id, b.id, c.id])).toEqual({ rows: 3, audits: 3 });
  });

  it('refuses the same id with a different entry (409), also from another person of the operator', async () => {
    const a = await entryFor(as.pilot);
    await report(as.pilot, [a]);
    const later = await report(as.pilot, [{ ...a, issuedAt: new Date(Date.now() + 60_000).toISOString() }]);
    expect(later).toEqual([{ id: a.id, outcome: 'conflict', status: 409, error: expect.objectContaining({ code: 'entry_id_taken' }) }]);
    expect((await report(as.engineer, [a]))[0]).toMatchObject({ outcome: 'conflict', status: 409 });
    // Another operator learns nothing about the id: its answer is the one for a new id
    // (issue 12, informational: the card it names is not this operator's, so it is refused).
    const fromElsewhere = (await report(as.secondPilot, [a]))[0]!;
    const newIdElsewhere = (await report(as.secondPilot, [{ ...a, id: randomUUID() }]))[0]!;
    expect(fromElsewhere.outcome).toBe('refused');
    expect({ ...fromElsewhere, id: 'x' }).toEqual({ ...newIdElsewhere, id: 'x' });
    expect(await stored([a.id])).toEqual({ rows: 1, audits: 1 });
  });

  it('stores an entry once when 100 reports of it arrive at the same time', async () => {
    const entry = await entryFor(as.pilot);
    const responses = await Promise.all(Array.from({ length: 100 }, () => post(as.pilot, '/api/card-issues').send({ entries: [entry] })));
    expect(responses.map((res) => res.status)).toEqual(Array(100).fill(200));
    const results = responses.map((res) => res.body.results[0]);
    expect(new Set(results.map((result) => JSON.stringify(result))).size).toBe(1);
    expect(results[0]).toMatchObject({ id: entry.id, outcome: 'recorded', status: 201, code: (await CardIssue.findByPk(entry.id, { rejectOnEmpty: true })).code });
    expect(await stored([entry.id])).toEqual({ rows: 1, audits: 1 });
  });

  it('re-derives each card and refuses a digest that does not match, or a card that cannot be given', async () => {
    const good = await entryFor(as.pilot);
    const wrong = { ...(await entryFor(as.pilot)), digest: '0'.repeat(64) };
    const heavy = { ...(await entryFor(as.pilot)), id: randomUUID(), inputs: jetInputs({ weightKg: 4900 }) };
    const foreign = { ...(await entryFor(as.pilot)), id: randomUUID(), airframeId: demo.trainerAirframeId };
    const results = await report(as.pilot, [good, wrong, heavy, foreign]);
    expect(results.map((r) => [r.outcome, r.status])).toEqual([
      ['recorded', 201],
      ['refused', 422],
      ['refused', 422],
      ['refused', 422],
    ]);
    expect(results[1]).toMatchObject({ error: { code: 'digest_mismatch' } });
    expect(results[2]).toMatchObject({ error: { code: 'card_refused', refusal: { code: 'weight-out-of-range', field: 'weightKg' } } });
    expect(results[3]).toMatchObject({ error: { code: 'card_refused' } });
    expect(await stored([good.id, wrong.id, heavy.id, foreign.id])).toEqual({ rows: 1, audits: 1 });
    // Reported again, a refused entry is refused again: nothing was kept of it.
    expect((await report(as.pilot, [wrong]))[0]).toEqual(results[1]);
  });

  it('records a card of a revision superseded since the device synced it', async () => {
    const inputs = trainerInputs(demo.trainerAirframeId);
    const revision = revisionResponseSchema.parse((await as.pilot.agent.get(`/api/revisions/${demo.trainerSupersededId}`).expect(200)).body).revision;
    const types = aircraftTypeListSchema.parse((await as.pilot.agent.get('/api/aircraft-types').expect(200)).body).aircraftTypes;
    const book = (await as.pilot.agent.get(`/api/speed-books/${revision.speedBookId}`).expect(200)).body.speedBook;
    const type = types.find((t) => t.id === book.aircraftTypeId)!;
    const card = buildCard(
      { id: revision.id, number: revision.number, publishedAt: revision.publishedAt, contentSha256: revision.contentSha256!, content: revision.content },
      inputs,
      { airframe: { id: demo.trainerAirframeId, registration: 'ZZ-KFA' }, aircraftType: { designator: type.designator, name: type.name }, speedBook: { id: book.id, title: book.title }, demo: true },
    );
    const entry = { id: randomUUID(), airframeId: demo.trainerAirframeId, revisionId: revision.id, inputs, digest: card.digest, issuedAt: '2026-11-30T07:15:00.000Z' };
    expect((await report(as.pilot, [entry]))[0]).toMatchObject({ outcome: 'recorded' });
  });

  it('shows pilots their own cards and the log readers all; filters and pages; 404 across operators', async () => {
    const mine = await entryFor(as.pilot, { issuedAt: '2026-11-20T10:00:00.000Z' });
    const engineers = await entryFor(as.engineer, { issuedAt: '2026-11-20T11:00:00.000Z' });
    await report(as.pilot, [mine]);
    await report(as.engineer, [engineers]);
    const window = 'from=2026-11-20T00:00:00Z&to=2026-11-20T23:59:59Z';
    const list = async (who: Session, query: string) => cardIssuePageSchema.parse((await who.agent.get(`/api/card-issues?${query}`).expect(200)).body);

    expect((await list(as.pilot, window)).entries.map((e) => e.id)).toEqual([mine.id]);
    for (const reader of [as.engineer, as.approver, as.admin, as.inspector]) {
      expect((await list(reader, window)).entries.map((e) => e.id)).toEqual([engineers.id, mine.id]);
    }
    const page = await list(as.inspector, `${window}&limit=1`);
    expect(page.entries.map((e) => e.id)).toEqual([engineers.id]);
    const reported = await report(as.engineer, [engineers]);
    expect(page.entries[0].code).toBe(reported[0].outcome === 'recorded' ? reported[0].code : 'none');
    expect(page.entries[0]).toMatchObject({ airframe: { id: demo.jetAirframeId, registration: 'ZZ-KFJ' }, revision: { id: demo.jetRevisionId, number: 1 }, issuedBy: { name: expect.any(String) }, digest: engineers.digest, issuedAt: '2026-11-20T11:00:00.000Z' });
    const next = await list(as.inspector, `${window}&limit=1&cursor=${page.nextCursor}`);
    expect(next).toEqual({ entries: [expect.objectContaining({ id: mine.id })], nextCursor: null });
    expect((await list(as.inspector, `${window}&airframeId=${demo.trainerAirframeId}`)).entries).toEqual([]);
    expect((await list(as.inspector, `${window}&revisionId=${demo.jetRevisionId}`)).entries).toHaveLength(2);

    expect((await as.inspector.agent.get(`/api/card-issues/${mine.id}`).expect(200)).body.entry).toMatchObject({ id: mine.id, code: expect.stringMatching(CARD_CODE_PATTERN), inputs: mine.inputs });
    await as.pilot.agent.get(`/api/card-issues/${engineers.id}`).expect(404);
    await as.secondPilot.agent.get(`/api/card-issues/${mine.id}`).expect(404);
    await as.secondAdmin.agent.get(`/api/card-issues/${mine.id}`).expect(404);
    expect((await list(as.secondAdmin, window)).entries).toEqual([]);
    await as.inspector.agent.get('/api/card-issues?limit=500').expect(400);
  });

  it('gives a fresh code when the drawn one is taken, and issueCardCode gives the code or throws the refusal', async () => {
    const first = await entryFor(as.pilot);
    const firstCode = await issueCardCode(await actorFor(as.pilot), first);
    expect(isCardCode(firstCode)).toBe(true);
    expect(await issueCardCode(await actorFor(as.pilot), first)).toBe(firstCode);
    // The next draw repeats the first card's code, then gives a new one.
    const next = await entryFor(as.pilot, {}, jetInputs({ weightKg: 4400 }));
    const spy = jest.spyOn(cardCode, 'generateCardCode').mockReturnValueOnce(firstCode);
    try {
      const secondCode = await issueCardCode(await actorFor(as.pilot), next);
      expect(spy).toHaveBeenCalledTimes(2);
      expect(isCardCode(secondCode)).toBe(true);
      expect(secondCode).not.toBe(firstCode);
    } finally {
      spy.mockRestore();
    }
    await expect(issueCardCode(await actorFor(as.pilot), { ...first, issuedAt: new Date(Date.now() + 1000).toISOString() })).rejects.toMatchObject({ status: 409, code: 'entry_id_taken' });
    await expect(issueCardCode(await actorFor(as.pilot), { ...first, id: randomUUID(), digest: 'f'.repeat(64) })).rejects.toMatchObject({ status: 422, code: 'digest_mismatch' });
  });

  it('takes reports only from roles that issue cards, in batches of at most 100', async () => {
    const entry = await entryFor(as.pilot);
    await post(as.inspector, '/api/card-issues').send({ entries: [entry] }).expect(403);
    await post(as.admin, '/api/card-issues').send({ entries: [entry] }).expect(403);
    const tooMany = await post(as.pilot, '/api/card-issues').send({ entries: Array(101).fill(entry) }).expect(400);
    expect(tooMany.body.error.fields).toHaveProperty('entries');
    await post(as.pilot, '/api/card-issues').send({ entries: [{ ...entry, id: 'not-a-uuid' }] }).expect(400);
  });
});
