/**
 * Deeply nested JSON answers 400 with the field, never 500 (security issue 12, finding 3):
 * 6,000 levels in a draft's content or in a card-log entry's inputs used to reach the recursive
 * RFC 8785 canonicaliser and overflow the stack. The shared schemas bound depth and size first
 * (shared/api/json-bounds.ts), and any JSON body is bounded before a route sees it.
 */
import { randomUUID } from 'node:crypto';
import { startHarness, type Harness } from '../../test/api/harness';
import { newSpeedBook, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';

jest.setTimeout(60_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

/** `{"a":{"a":…{"a":1}…}}` with `levels` objects, written as text (JSON.stringify would recurse too). */
const nestedObject = (levels: number) => `${'{"a":'.repeat(levels)}1${'}'.repeat(levels)}`;
const send = (who: Session, method: 'post' | 'patch', path: string, body: string) =>
  who.agent[method](path).set('x-csrf-token', who.token).set('content-type', 'application/json').send(body);

describe('deeply nested JSON', () => {
  it('answers 400 naming the content of a new draft, and nothing is written', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    // 6,000 levels: stopped with the whole body's bound, still naming the field.
    const deep = await send(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`, `{"changeSummary":"deep","content":${nestedObject(6000)}}`).expect(400);
    expect(deep.body.error.fields).toEqual({ 'content.a.a.a': 'It nests more than 64 levels deep, deeper than this field accepts.' });
    // 40 levels: within the body's bound, over the content's.
    const res = await send(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`, `{"changeSummary":"deep","content":${nestedObject(40)}}`).expect(400);
    expect(res.body.error.fields).toEqual({ content: 'It nests more than 32 levels deep, deeper than this field accepts.' });
    const book = (await as.engineer.agent.get(`/api/speed-books/${speedBookId}`).expect(200)).body.speedBook;
    expect(book.revisions).toEqual([]);
  });

  it('answers 400 naming the content of a draft change', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const draft = await send(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`, '{"changeSummary":"shallow","content":{"schemaVersion":1}}').expect(201);
    const res = await send(as.engineer, 'patch', `/api/revisions/${draft.body.revision.id}`, `{"content":{"speeds":${'['.repeat(40)}${']'.repeat(40)}}}`).expect(400);
    expect(res.body.error.fields).toEqual({ content: 'It nests more than 32 levels deep, deeper than this field accepts.' });
  });

  it('answers 400 naming the inputs of a card-log entry and of a preview', async () => {
    const entry = (levels: number) => `{"id":"${randomUUID()}","airframeId":1,"revisionId":1,"inputs":${nestedObject(levels)},"digest":"${'0'.repeat(64)}","issuedAt":"2026-12-01T09:30:00.000Z"}`;
    const deep = await send(as.pilot, 'post', '/api/card-issues', `{"entries":[${entry(6000)}]}`).expect(400);
    expect(deep.body.error.fields).toEqual({ 'entries.0.inputs.a': 'It nests more than 64 levels deep, deeper than this field accepts.' });
    const res = await send(as.pilot, 'post', '/api/card-issues', `{"entries":[${entry(3)},${entry(12)}]}`).expect(400);
    expect(res.body.error.fields).toEqual({ 'entries.1.inputs': 'It nests more than 8 levels deep, deeper than this field accepts.' });
    const preview = await send(as.pilot, 'post', '/api/cards/preview', `{"revisionId":1,"inputs":${nestedObject(20)}}`).expect(400);
    expect(preview.body.error.fields).toEqual({ inputs: 'It nests more than 8 levels deep, deeper than this field accepts.' });
  });

  it('answers 400 for any body nested deeper than 64 levels, whatever the route', async () => {
    const res = await send(as.admin, 'patch', '/api/operator/settings', nestedObject(100_000)).expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_request', fields: { 'a.a.a.a': 'It nests more than 64 levels deep, deeper than this field accepts.' } });
    // Still serving.
    await as.admin.agent.get('/api/operator/settings').expect(200);
  });
});
