import { auditPageSchema } from '@shared/api/audit';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { startHarness, type Harness } from '../../test/api/harness';
import { User } from '../models';
import { newSpeedBook, publish, signInEveryone, type SessionsByRole } from '../../test/api/test-helpers';

// Every step hashes or checks passwords or signs; on a busy two-core machine 5 s is short.
jest.setTimeout(30_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

describe('GET /api/audit', () => {
  it('records every step of a revision with who did it, from where', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const draft = await as.engineer.agent
      .post(`/api/speed-books/${speedBookId}/revisions`)
      .set('x-csrf-token', as.engineer.token)
      .set('user-agent', 'ramp-tablet-audit-test')
      .send({ content: demoPistonTrainerContent(), changeSummary: 'First issue' })
      .expect(201);
    const id = draft.body.revision.id as number;
    await as.engineer.agent.post(`/api/revisions/${id}/submit`).set('x-csrf-token', as.engineer.token).expect(200);
    await as.approver.agent.post(`/api/revisions/${id}/approve`).set('x-csrf-token', as.approver.token).expect(200);
    const res = await as.inspector.agent.get(`/api/audit?entityType=revision&entityId=${id}`).expect(200);
    const { events } = auditPageSchema.parse(res.body);
    expect(events.map((e) => [e.action, e.actorName])).toEqual([
      ['revision.approved', 'Capt. Ada Okonjo'],
      ['revision.submitted', 'Tobias Wren'],
      ['revision.created', 'Tobias Wren'],
    ]);
    expect(events[0].details).toMatchObject({ speedBookId, number: 1, contentSha256: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(events[0].ip).toMatch(/127\.0\.0\.1|::1|::ffff:127\.0\.0\.1/);
    expect(events[2].userAgent).toBe('ramp-tablet-audit-test');

    const book = await as.approver.agent.get(`/api/audit?entityType=speed-book&entityId=${speedBookId}`).expect(200);
    expect(book.body.events.map((e: { action: string }) => e.action)).toEqual(['speed-book.created']);
  });

  it('filters by actor, action and time, and pages with a cursor', async () => {
    const approver = await User.findOne({ where: { email: 'approver@demo.speedwright.example' }, rejectOnEmpty: true });
    const start = new Date(Date.now() - 1000).toISOString();
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    await publish(as.engineer, as.approver, speedBookId);
    await publish(as.engineer, as.approver, speedBookId);
    await publish(as.engineer, as.approver, speedBookId);

    const byApprover = auditPageSchema.parse((await as.admin.agent.get(`/api/audit?actorId=${approver.id}&action=revision.approved&from=${start}`).expect(200)).body);
    expect(byApprover.events.length).toBeGreaterThanOrEqual(3);
    expect(byApprover.events.every((e) => e.actorId === approver.id && e.action === 'revision.approved')).toBe(true);

    const seen: number[] = [];
    let cursor: string | null = null;
    do {
      const query: string = `/api/audit?entityType=revision&from=${start}&limit=2${cursor ? `&cursor=${cursor}` : ''}`;
      const page = auditPageSchema.parse((await as.inspector.agent.get(query).expect(200)).body);
      expect(page.events.length).toBeLessThanOrEqual(2);
      seen.push(...page.events.map((e) => e.id));
      cursor = page.nextCursor;
    } while (cursor);
    // Three revisions × created, submitted, approved; two superseded: at least 11, newest first, no repeats.
    expect(seen.length).toBeGreaterThanOrEqual(11);
    expect(new Set(seen).size).toBe(seen.length);
    expect([...seen].sort((a, b) => b - a)).toEqual(seen);

    const future = auditPageSchema.parse((await as.inspector.agent.get('/api/audit?from=2999-01-01T00:00:00Z').expect(200)).body);
    expect(future).toEqual({ events: [], nextCursor: null });
    const past = auditPageSchema.parse((await as.inspector.agent.get(`/api/audit?to=${start}&action=revision.submitted&limit=200`).expect(200)).body);
    expect(past.events.every((e) => e.createdAt <= start)).toBe(true);
  });

  it('shows each operator only its own events', async () => {
    await as.secondAdmin.agent.post('/api/aircraft-types').set('x-csrf-token', as.secondAdmin.token).send({ designator: 'LKS9', name: 'Second operator type', category: 'turboprop', engines: 1, ceilingFt: 25000 }).expect(201);
    const second = auditPageSchema.parse((await as.secondAdmin.agent.get('/api/audit?limit=200').expect(200)).body);
    expect(second.events.some((e) => e.action === 'aircraft-type.created' && e.details?.['designator'] === 'LKS9')).toBe(true);
    expect(second.events.some((e) => e.entityType === 'revision')).toBe(false);
    const demo = auditPageSchema.parse((await as.admin.agent.get('/api/audit?entityType=aircraft-type&limit=200').expect(200)).body);
    expect(demo.events.some((e) => e.details?.['designator'] === 'LKS9')).toBe(false);
  });

  it('records the making of an operator’s signing key once, however many ask for it at once', async () => {
    const [a, b] = await Promise.all([as.secondPilot.agent.get('/api/operator/signing-key').expect(200), as.secondAdmin.agent.get('/api/operator/signing-key').expect(200)]);
    expect(a.body.signingKey).toEqual(b.body.signingKey);
    const made = auditPageSchema.parse((await as.secondAdmin.agent.get('/api/audit?action=signing-key.created').expect(200)).body);
    expect(made.events).toHaveLength(1);
    expect(made.events[0]).toMatchObject({ entityType: 'signing-key', entityId: String(a.body.signingKey.id), details: { algorithm: 'Ed25519', publicKey: a.body.signingKey.publicKey } });
  });

  it('names a bad filter field by field', async () => {
    const res = await as.admin.agent.get('/api/audit?limit=0&from=yesterday&cursor=abc&colour=red').expect(400);
    expect(res.body.error.fields).toEqual({
      limit: 'limit is at least 1.',
      from: 'from is an ISO 8601 date and time, such as 2026-12-01T00:00:00Z.',
      cursor: 'cursor is a record id (digits).',
      colour: 'This field is not expected here.',
    });
  });

  it('is for administrators, approvers and inspectors only', async () => {
    await as.pilot.agent.get('/api/audit').expect(403);
    await as.engineer.agent.get('/api/audit').expect(403);
  });
});
