import { webcrypto } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { revisionResponseSchema, signingKeyResponseSchema, speedBookListSchema, speedBookResponseSchema } from '@shared/api/revisions';
import { contentSha256 } from '@shared/speed-book/canonical';
import { demoPistonTrainerContent, demoPistonTrainerContentRevised } from '@shared/speed-book/demo-content';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import { mailTo, startHarness, type Harness } from '../../test/api/harness';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { apiTestAttachmentsDir } from '../../test/api/constants';
import { Attachment, AuditEvent, Revision } from '../models';
import { newSpeedBook, newTeam, publish, signInEveryone, type Session, type SessionsByRole } from '../../test/api/test-helpers';
import { verifyStatement } from './signing';

// Every step hashes or checks passwords or signs; on a busy two-core machine 5 s is short.
jest.setTimeout(30_000);

let harness: Harness;
let as: SessionsByRole;
beforeAll(async () => {
  harness = startHarness();
  as = await signInEveryone(harness.app);
}, 60_000);
afterAll(() => harness.close());

const write = (who: Session, method: 'post' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.token);

describe('the revision workflow', () => {
  it('goes draft → in review → published, supersedes the previous one, then withdraws', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const firstId = await publish(as.engineer, as.approver, speedBookId);

    // A new draft starts as a copy of the published content.
    const created = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ changeSummary: 'Correct VR and VX' }).expect(201);
    const draft = revisionResponseSchema.parse(created.body).revision;
    expect(draft).toMatchObject({ number: 2, status: 'draft', speedBookId, changeSummary: 'Correct VR and VX', contentSha256: null, signature: null, problems: {} });
    expect(draft.content).toEqual(demoPistonTrainerContent());

    const patched = await write(as.engineer, 'patch', `/api/revisions/${draft.id}`).send({ content: demoPistonTrainerContentRevised() }).expect(200);
    expect(patched.body.revision.content).toEqual(demoPistonTrainerContentRevised());

    const submitted = await write(as.engineer, 'post', `/api/revisions/${draft.id}/submit`).expect(200);
    expect(submitted.body.revision).toMatchObject({ status: 'in_review', submittedAt: expect.any(String) });

    const approved = await write(as.approver, 'post', `/api/revisions/${draft.id}/approve`).expect(200);
    const published = revisionResponseSchema.parse(approved.body).revision;
    expect(published).toMatchObject({ status: 'published', approverName: 'Capt. Ada Okonjo', authorName: 'Tobias Wren', contentSha256: contentSha256(demoPistonTrainerContentRevised()) });
    expect(published.publishedAt).toMatch(/\.000Z$/);

    const first = (await as.pilot.agent.get(`/api/revisions/${firstId}`).expect(200)).body.revision;
    expect(first).toMatchObject({ status: 'superseded', supersededAt: published.publishedAt });

    const books = speedBookListSchema.parse((await as.pilot.agent.get('/api/speed-books').expect(200)).body).speedBooks;
    expect(books.find((book) => book.id === speedBookId)?.currentRevision).toMatchObject({ id: draft.id, number: 2, status: 'published' });
    const book = speedBookResponseSchema.parse((await as.inspector.agent.get(`/api/speed-books/${speedBookId}`).expect(200)).body).speedBook;
    expect(book.revisions.map((r) => [r.number, r.status])).toEqual([
      [2, 'published'],
      [1, 'superseded'],
    ]);

    const withdrawn = await write(as.approver, 'post', `/api/revisions/${draft.id}/withdraw`).send({ reason: 'VR figure under query' }).expect(200);
    expect(withdrawn.body.revision).toMatchObject({ status: 'withdrawn', withdrawReason: 'VR figure under query', withdrawnAt: expect.any(String) });
    const after = (await as.pilot.agent.get('/api/speed-books').expect(200)).body.speedBooks.find((b: { id: number }) => b.id === speedBookId);
    expect(after.currentRevision).toBeNull();
  });

  it('tells the approvers when a revision is submitted and the pilots when it is published or withdrawn', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const title = (await as.engineer.agent.get(`/api/speed-books/${speedBookId}`).expect(200)).body.speedBook.title as string;
    const id = await publish(as.engineer, as.approver, speedBookId);
    const titled = (entry: { subject: string; text: string }) => `${entry.subject}\n${entry.text}`.includes(title);
    await mailTo('approver@demo.speedwright.example', titled);
    await mailTo('pilot@demo.speedwright.example', (entry) => titled(entry) && /publish/i.test(`${entry.subject} ${entry.text}`));
    await write(as.approver, 'post', `/api/revisions/${id}/withdraw`).send({ reason: 'Under query' }).expect(200);
    const withdrawn = await mailTo('pilot@demo.speedwright.example', (entry) => titled(entry) && /withdraw/i.test(`${entry.subject} ${entry.text}`));
    expect(withdrawn.text).toContain('Under query');
  });

  it('returns a revision in review to its author with a reason, and it can be edited again', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const draft = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: demoPistonTrainerContent(), changeSummary: 'First issue' }).expect(201);
    const id = draft.body.revision.id;
    await write(as.engineer, 'post', `/api/revisions/${id}/submit`).expect(200);
    await write(as.engineer, 'patch', `/api/revisions/${id}`).send({ changeSummary: 'x' }).expect(409);
    const returned = await write(as.approver, 'post', `/api/revisions/${id}/return`).send({ reason: 'VA looks high' }).expect(200);
    expect(returned.body.revision).toMatchObject({ status: 'draft', returnReason: 'VA looks high' });
    await write(as.engineer, 'patch', `/api/revisions/${id}`).send({ changeSummary: 'First issue, VA checked' }).expect(200);
  });

  it('lets any engineer of the operator edit a draft, not only its author', async () => {
    const [admin, engineer, colleague] = await newTeam(harness.app, ['admin', 'engineer', 'engineer']);
    const { speedBookId } = await newSpeedBook(admin, engineer);
    const draft = await write(engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: { notes: 'start' }, changeSummary: 'First issue' }).expect(201);
    await write(colleague, 'patch', `/api/revisions/${draft.body.revision.id}`).send({ content: { notes: 'more' } }).expect(200);
  });

  it('keeps incomplete drafts, lists their problems, and refuses to submit them with each field', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const content = demoPistonTrainerContent();
    content.limits.vfeKt['landing-flap'] = 40;
    delete (content.limits as { vneKt?: number }).vneKt;
    const draft = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content, changeSummary: 'First issue' }).expect(201);
    expect(draft.body.revision.problems).toMatchObject({ 'limits.vneKt': 'A piston type needs VNE.', 'limits.vfeKt.landing-flap': expect.stringMatching(/^VFE 40 kt is not above VS0/) });

    const res = await write(as.engineer, 'post', `/api/revisions/${draft.body.revision.id}/submit`).expect(422);
    expect(res.body.error.code).toBe('content_invalid');
    expect(res.body.error.fields).toMatchObject({ 'content.limits.vneKt': 'A piston type needs VNE.', 'content.limits.vfeKt.landing-flap': expect.any(String) });
    expect((await Revision.findByPk(draft.body.revision.id, { rejectOnEmpty: true })).status).toBe('draft');
  });

  it('refuses to submit content for another category of aircraft than the book’s type', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const content = demoPistonTrainerContent();
    content.aircraft.category = 'piston-twin';
    content.aircraft.engines = 2;
    Object.assign(content.limits, { vmcKt: 60, vyseKt: 80 });
    const draft = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content, changeSummary: 'Wrong type' }).expect(201);
    const res = await write(as.engineer, 'post', `/api/revisions/${draft.body.revision.id}/submit`).expect(422);
    expect(res.body.error.fields).toEqual({
      'content.aircraft.category': expect.stringMatching(/is piston-single, not piston-twin/),
      'content.aircraft.engines': expect.stringMatching(/has 1 engine/),
    });
  });

  it('asks for content when there is no published revision to copy', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const res = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ changeSummary: 'Copy' }).expect(422);
    expect(res.body.error.fields).toEqual({ content: 'Give the content: there is no published revision to start from.' });
  });

  it('keeps one open revision per speed book', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: {}, changeSummary: 'One' }).expect(201);
    const res = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: {}, changeSummary: 'Two' }).expect(409);
    expect(res.body.error).toMatchObject({ code: 'open_revision_exists', message: 'Revision 1 of this speed book is still a draft; finish or return it first.' });
  });

  it('refuses an approver their own revision, and returning it', async () => {
    const [admin, engineer, approver, colleague] = await newTeam(harness.app, ['admin', 'engineer', 'approver', 'approver']);
    const { speedBookId } = await newSpeedBook(admin, engineer);
    const draft = await write(approver, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: demoPistonTrainerContent(), changeSummary: 'By the approver' }).expect(201);
    const id = draft.body.revision.id;
    await write(approver, 'post', `/api/revisions/${id}/submit`).expect(200);
    const own = await write(approver, 'post', `/api/revisions/${id}/approve`).expect(403);
    expect(own.body.error.message).toBe('Nobody approves their own revision; another approver must.');
    await write(approver, 'post', `/api/revisions/${id}/return`).send({ reason: 'mine' }).expect(403);
    expect((await Revision.findByPk(id, { rejectOnEmpty: true })).status).toBe('in_review');
    await write(colleague, 'post', `/api/revisions/${id}/approve`).expect(200);
  });

  it('answers 400 field by field for bad bodies and 409 for steps out of order', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const bad = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: [1, 2], extra: true }).expect(400);
    expect(bad.body.error.fields).toEqual({ content: 'The content must be a JSON object.', changeSummary: 'Say in a sentence what this revision changes.', extra: 'This field is not expected here.' });
    const draft = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: demoPistonTrainerContent(), changeSummary: 'First' }).expect(201);
    const id = draft.body.revision.id;
    expect((await write(as.approver, 'post', `/api/revisions/${id}/approve`).expect(409)).body.error.message).toBe('Revision 1 is a draft; only a revision in review can be approved.');
    await write(as.approver, 'post', `/api/revisions/${id}/return`).send({ reason: 'x' }).expect(409);
    await write(as.approver, 'post', `/api/revisions/${id}/withdraw`).send({ reason: 'x' }).expect(409);
    expect((await write(as.approver, 'post', `/api/revisions/${id}/withdraw`).send({}).expect(400)).body.error.fields).toEqual({ reason: 'Give the reason.' });
    await write(as.engineer, 'patch', `/api/revisions/${id}`).send({}).expect(400);
  });

  it('hides drafts and reviews from pilots and inspectors', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const publishedId = await publish(as.engineer, as.approver, speedBookId);
    const draft = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ changeSummary: 'Next' }).expect(201);
    for (const reader of [as.pilot, as.inspector, as.admin]) {
      await reader.agent.get(`/api/revisions/${draft.body.revision.id}`).expect(404);
      await reader.agent.get(`/api/revisions/${publishedId}`).expect(200);
      const book = (await reader.agent.get(`/api/speed-books/${speedBookId}`).expect(200)).body.speedBook;
      expect(book.revisions.map((r: { id: number }) => r.id)).toEqual([publishedId]);
    }
    const book = (await as.engineer.agent.get(`/api/speed-books/${speedBookId}`).expect(200)).body.speedBook;
    expect(book.revisions.map((r: { status: string }) => r.status)).toEqual(['draft', 'published']);
  });
});

describe('discarding a draft', () => {
  const PDF = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n');

  it('removes the draft and its source pages, audited, and lets a new draft start; nothing else can be discarded', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const publishedId = await publish(as.engineer, as.approver, speedBookId);
    const created = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ changeSummary: 'Abandoned idea' }).expect(201);
    const draftId = created.body.revision.id as number;
    const page = await as.engineer.agent.post(`/api/revisions/${draftId}/attachments`).set('x-csrf-token', as.engineer.token).attach('file', PDF, { filename: 'p12.pdf', contentType: 'application/pdf' }).expect(201);
    const stored = await Attachment.findByPk(page.body.attachment.id, { rejectOnEmpty: true });
    const file = join(apiTestAttachmentsDir(), String(stored.operatorId), stored.storageName);
    expect(existsSync(file)).toBe(true);

    // A pilot may not, another operator's engineer finds nothing, a published revision stays.
    await as.pilot.agent.delete(`/api/revisions/${draftId}`).set('x-csrf-token', as.pilot.token).expect(403);
    const [stranger] = await newTeam(harness.app, ['engineer']);
    await stranger!.agent.delete(`/api/revisions/${draftId}`).set('x-csrf-token', stranger!.token).expect(404);
    const kept = await as.engineer.agent.delete(`/api/revisions/${publishedId}`).set('x-csrf-token', as.engineer.token).expect(409);
    expect(kept.body.error.message).toBe('Revision 1 is published; only a draft can be discarded.');

    await as.engineer.agent.delete(`/api/revisions/${draftId}`).set('x-csrf-token', as.engineer.token).expect(204);
    await as.engineer.agent.get(`/api/revisions/${draftId}`).expect(404);
    expect(await Attachment.findByPk(stored.id)).toBeNull();
    expect(existsSync(file)).toBe(false);
    const event = await AuditEvent.findOne({ where: { action: 'revision.discarded', entityId: String(draftId) }, rejectOnEmpty: true });
    expect(JSON.parse(event.details as unknown as string)).toMatchObject({ number: 2, changeSummary: 'Abandoned idea', sourcePages: 1 });

    // The book is free for a new draft again, under the same number.
    const next = await write(as.engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ changeSummary: 'Second try' }).expect(201);
    expect(next.body.revision).toMatchObject({ number: 2, status: 'draft' });
    await write(as.engineer, 'post', `/api/revisions/${next.body.revision.id}/submit`).expect(200);
    await as.engineer.agent.delete(`/api/revisions/${next.body.revision.id}`).set('x-csrf-token', as.engineer.token).expect(409);
  });
});

describe('a published revision', () => {
  it('does not change by any route', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const id = await publish(as.engineer, as.approver, speedBookId);
    const before = await Revision.findByPk(id, { rejectOnEmpty: true });

    const attempts: [Session, 'post' | 'patch', string, object?][] = [
      [as.engineer, 'patch', `/api/revisions/${id}`, { content: demoPistonTrainerContentRevised() }],
      [as.approver, 'patch', `/api/revisions/${id}`, { changeSummary: 'rewritten' }],
      [as.engineer, 'post', `/api/revisions/${id}/submit`],
      [as.approver, 'post', `/api/revisions/${id}/approve`],
      [as.approver, 'post', `/api/revisions/${id}/return`, { reason: 'again' }],
    ];
    for (const [who, method, path, body] of attempts) {
      const res = await write(who, method, path).send(body ?? {});
      expect([path, res.status]).toEqual([path, 409]);
    }
    for (const [who, path] of [[as.pilot, `/api/revisions/${id}`], [as.admin, `/api/revisions/${id}`], [as.inspector, `/api/revisions/${id}/approve`]] as const) {
      expect((await write(who, path.endsWith('approve') ? 'post' : 'patch', path).send({ changeSummary: 'x' })).status).toBe(403);
    }
    const after = await Revision.findByPk(id, { rejectOnEmpty: true });
    expect(after.toJSON()).toEqual(before.toJSON());

    // Withdrawing changes its status only; what was signed stays as it was.
    await write(as.approver, 'post', `/api/revisions/${id}/withdraw`).send({ reason: 'test' }).expect(200);
    const withdrawn = await Revision.findByPk(id, { rejectOnEmpty: true });
    for (const field of ['content', 'contentSha256', 'signature', 'signingKeyId', 'publishedAt', 'approverId', 'number', 'changeSummary'] as const) {
      expect([field, withdrawn[field]]).toEqual([field, before[field]]);
    }
    await write(as.approver, 'post', `/api/revisions/${id}/withdraw`).send({ reason: 'again' }).expect(409);
  });

  it('cannot be changed through the model either', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const revision = await Revision.findByPk(await publish(as.engineer, as.approver, speedBookId), { rejectOnEmpty: true });
    await expect(revision.update({ content: '{}' })).rejects.toThrow('A published revision cannot change: content.');
    await expect(Revision.update({ content: '{}' }, { where: { id: revision.id } })).rejects.toThrow(/one at a time/);
    await expect(revision.destroy()).rejects.toThrow('Only a draft is ever deleted.');
    await expect(Revision.destroy({ where: { id: revision.id } })).rejects.toThrow(/one at a time/);
  });
});

describe('the signature', () => {
  it('verifies with the operator’s public key and fails when any byte of the content changes', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const id = await publish(as.engineer, as.approver, speedBookId);
    const revision = revisionResponseSchema.parse((await as.pilot.agent.get(`/api/revisions/${id}`).expect(200)).body).revision;
    const key = signingKeyResponseSchema.parse((await as.pilot.agent.get('/api/operator/signing-key').expect(200)).body).signingKey;
    expect(Buffer.from(key.publicKey, 'base64')).toHaveLength(32);
    expect(revision.signingKeyId).toBe(key.id);
    expect(Buffer.from(revision.signature!, 'base64')).toHaveLength(64);

    const operatorId = (await as.pilot.agent.get('/api/auth/me').expect(200)).body.user.operatorId as number;
    const statement = (content: unknown) =>
      signedRevisionStatement({
        operatorId,
        speedBookId,
        revisionId: id,
        number: revision.number,
        contentSha256: contentSha256(content),
        publishedAt: revision.publishedAt!,
      });
    expect(verifyStatement(key.publicKey, statement(revision.content), revision.signature!)).toBe(true);
    // As a device does it: WebCrypto, the raw public key, the statement's UTF-8 bytes.
    const deviceKey = await webcrypto.subtle.importKey('raw', Buffer.from(key.publicKey, 'base64'), { name: 'Ed25519' }, false, ['verify']);
    expect(await webcrypto.subtle.verify({ name: 'Ed25519' }, deviceKey, Buffer.from(revision.signature!, 'base64'), new TextEncoder().encode(statement(revision.content)))).toBe(true);

    // Every figure matters: one knot more on one speed, or one changed letter in the notes.
    const faster = structuredClone(revision.content) as ReturnType<typeof demoPistonTrainerContent>;
    if (faster.speeds[2].kind === 'scaled') faster.speeds[2].referenceKt += 1;
    expect(verifyStatement(key.publicKey, statement(faster), revision.signature!)).toBe(false);
    const renamed = { ...revision.content, notes: String(revision.content['notes']).replace('I', 'i') };
    expect(verifyStatement(key.publicKey, statement(renamed), revision.signature!)).toBe(false);

    // A flipped bit in the signature, or another operator's key, fails too.
    const signature = Buffer.from(revision.signature!, 'base64');
    signature[10] ^= 1;
    expect(verifyStatement(key.publicKey, statement(revision.content), signature.toString('base64'))).toBe(false);
    const otherKey = signingKeyResponseSchema.parse((await as.secondPilot.agent.get('/api/operator/signing-key').expect(200)).body).signingKey;
    expect(otherKey.publicKey).not.toBe(key.publicKey);
    expect(verifyStatement(otherKey.publicKey, statement(revision.content), revision.signature!)).toBe(false);
  });

  it('keeps the private key encrypted at rest', async () => {
    const rows = await harness.sequelize.query<{ encrypted_private_key: string; public_key: string }>('SELECT encrypted_private_key, public_key FROM signing_keys', {
      type: QueryTypes.SELECT,
    });
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      expect(row.encrypted_private_key).toMatch(/^v1\.[A-Za-z0-9+/=]+\.[A-Za-z0-9+/=]+\.[A-Za-z0-9+/=]+\.[A-Za-z0-9+/=]+$/);
      expect(row.encrypted_private_key).not.toMatch(/PRIVATE KEY/);
    }
  });
});

describe('two approvals at once', () => {
  it('publish once; the other answers 409', async () => {
    // The demo operator has one approver; this race needs two, in an operator of its own.
    const [admin, engineer, approver, second] = await newTeam(harness.app, ['admin', 'engineer', 'approver', 'approver']);
    const { speedBookId } = await newSpeedBook(admin, engineer);
    const earlier = await publish(engineer, approver, speedBookId);
    const draft = await write(engineer, 'post', `/api/speed-books/${speedBookId}/revisions`).send({ content: demoPistonTrainerContentRevised(), changeSummary: 'Race' }).expect(201);
    const id = draft.body.revision.id;
    await write(engineer, 'post', `/api/revisions/${id}/submit`).expect(200);

    const results = await Promise.all([write(approver, 'post', `/api/revisions/${id}/approve`), write(second, 'post', `/api/revisions/${id}/approve`)]);
    expect(results.map((res) => res.status).sort()).toEqual([200, 409]);
    expect(await Revision.count({ where: { speedBookId, status: 'published' } })).toBe(1);
    expect((await Revision.findByPk(earlier, { rejectOnEmpty: true })).status).toBe('superseded');
    expect(await AuditEvent.count({ where: { entityType: 'revision', entityId: String(id), action: 'revision.approved' } })).toBe(1);
    expect(await AuditEvent.count({ where: { entityType: 'revision', entityId: String(earlier), action: 'revision.superseded' } })).toBe(1);
  });
});

describe('GET /api/revisions/:id/diff', () => {
  it('lists the field-by-field changes against another revision', async () => {
    const { speedBookId } = await newSpeedBook(as.admin, as.engineer);
    const first = await publish(as.engineer, as.approver, speedBookId);
    const second = await publish(as.engineer, as.approver, speedBookId, demoPistonTrainerContentRevised());
    const res = await as.inspector.agent.get(`/api/revisions/${second}/diff?against=${first}`).expect(200);
    expect(res.body.revisionId).toBe(second);
    expect(res.body.againstId).toBe(first);
    expect(res.body.changes).toContainEqual({ path: 'speeds[VR@takeoff-flap].referenceKt', before: 55, after: 56, kind: 'changed' });
    expect(res.body.changes).toContainEqual({ path: 'limits.vfeKt.landing-flap', before: 85, after: 87, kind: 'changed' });
    expect(res.body.changes.map((c: { path: string }) => c.path)).toContain('speeds[VAPP@takeoff-flap]');

    await as.inspector.agent.get(`/api/revisions/${second}/diff?against=${second}`).expect(200, { revisionId: second, againstId: second, changes: [] });
    expect((await as.inspector.agent.get(`/api/revisions/${second}/diff`).expect(400)).body.error.fields).toEqual({ against: 'Give the revision to compare with as ?against=<id>.' });
    await as.inspector.agent.get(`/api/revisions/${second}/diff?against=999999`).expect(404);
    await as.secondAdmin.agent.get(`/api/revisions/${second}/diff?against=${first}`).expect(404);
  });
});
