import { randomBytes } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { attachmentListSchema, attachmentResponseSchema } from '@shared/api/attachments';
import type { RevisionStatus } from '@shared/api/revisions';
import { apiTestAttachmentsDir } from '../../test/api/constants';
import { csrfAgent, demoEmail, signIn, startHarness, type Harness } from '../../test/api/harness';
import { sessionOf } from '../../test/api/role-sessions';
import { AircraftType, Attachment, AuditEvent, Operator, Revision, SpeedBook, User } from '../models';

// Each check signs in afresh, and argon2id takes a moment per sign-in.
jest.setTimeout(30_000);

let harness: Harness;
beforeAll(() => {
  harness = startHarness();
});
afterAll(() => harness.close());

/** A small but well-formed PDF: header, one empty page, cross-reference table, trailer. */
const PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n' +
    '3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 200 200]>>endobj\nxref\n0 4\n0000000000 65535 f \n' +
    'trailer<</Size 4/Root 1 0 R>>\nstartxref\n0\n%%EOF\n',
  'latin1',
);
/** The PNG signature and an IHDR chunk of a 1×1 image (the rest does not matter to the check). */
const PNG = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]),
  Buffer.from('IHDR', 'latin1'),
  Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0, 0x1f, 0x15, 0xc4, 0x89]),
]);
const JPEG = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46, 0, 1, 0xff, 0xd9]);
/** The start of a Windows program ("MZ") under a PDF's name. */
const EXE = Buffer.concat([Buffer.from('MZ\x90\x00\x03\x00\x00\x00', 'latin1'), randomBytes(200)]);

async function operatorId(slug: string) {
  return (await Operator.findOne({ where: { slug }, rejectOnEmpty: true })).id;
}

/** A revision of a new speed book of its own, in the given status, written straight to the tables. */
async function revisionIn(status: RevisionStatus, slug = 'kestrel-fen'): Promise<Revision> {
  const opId = await operatorId(slug);
  const tag = randomBytes(3).toString('hex').toUpperCase();
  const type = await AircraftType.create({ operatorId: opId, designator: `A${tag}`, name: 'Attachment test type (invented)', category: 'piston-single', engines: 1, ceilingFt: 12000 });
  const book = await SpeedBook.create({ operatorId: opId, aircraftTypeId: type.id, title: `Attachment book ${tag}` });
  const author = await User.findOne({ where: { operatorId: opId }, rejectOnEmpty: true });
  return Revision.create({
    operatorId: opId,
    speedBookId: book.id,
    number: 1,
    status,
    content: '{}',
    changeSummary: 'For attachment tests',
    authorId: author.id,
    submittedAt: null,
    returnedAt: null,
    returnReason: null,
    approverId: null,
    publishedAt: status === 'published' ? new Date() : null,
    supersededAt: null,
    withdrawnAt: null,
    withdrawnById: null,
    withdrawReason: null,
    contentSha256: null,
    signature: null,
    signingKeyId: null,
  });
}

async function attach(role: Parameters<typeof demoEmail>[0], revisionId: number, body: Buffer, filename: string, contentType = 'application/pdf', domain = 'demo') {
  const { agent, token } = await sessionOf(harness.app, role, domain as 'demo' | 'second');
  return agent.post(`/api/revisions/${revisionId}/attachments`).set('x-csrf-token', token).attach('file', body, { filename, contentType });
}

describe('attachments', () => {
  it('keeps a PDF with its name, type, size and SHA-256, lists it and serves it back', async () => {
    const revision = await revisionIn('draft');
    const res = await attach('engineer', revision.id, PDF, 'AFM section 5 – stall speeds.pdf');
    expect(res.status).toBe(201);
    const { attachment } = attachmentResponseSchema.parse(res.body);
    expect(attachment).toMatchObject({
      revisionId: revision.id,
      originalName: 'AFM section 5 – stall speeds.pdf',
      contentType: 'application/pdf',
      sizeBytes: PDF.length,
      sha256: (await import('node:crypto')).createHash('sha256').update(PDF).digest('hex'),
      uploadedBy: { displayName: 'Tobias Wren' },
      url: `/api/attachments/${attachment.id}`,
    });

    const stored = await Attachment.findByPk(attachment.id, { rejectOnEmpty: true });
    const folder = join(apiTestAttachmentsDir(), String(revision.operatorId));
    expect(stored.storageName).toMatch(/^[0-9a-f]{32}$/);
    expect(readdirSync(folder)).toContain(stored.storageName);

    const { agent } = await signIn(harness.app, demoEmail('approver'));
    const list = attachmentListSchema.parse((await agent.get(`/api/revisions/${revision.id}/attachments`).expect(200)).body);
    expect(list.attachments.map((a) => a.id)).toEqual([attachment.id]);

    const file = await agent.get(attachment.url).buffer(true).parse((response, callback) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => callback(null, Buffer.concat(chunks)));
    });
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toBe(`inline; filename="AFM section 5 _ stall speeds.pdf"; filename*=UTF-8''${encodeURIComponent('AFM section 5 – stall speeds.pdf')}`);
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(file.body as Buffer, PDF)).toBe(0);
    expect(await AuditEvent.count({ where: { action: 'attachment.added', entityId: String(attachment.id) } })).toBe(1);
  });

  it('accepts PNG and JPEG by their content, whatever the name', async () => {
    const revision = await revisionIn('in_review');
    const png = await attach('approver', revision.id, PNG, 'page.bin', 'application/octet-stream');
    expect(png.status).toBe(201);
    expect(png.body.attachment.contentType).toBe('image/png');
    const jpeg = await attach('engineer', revision.id, JPEG, 'scan', 'application/octet-stream');
    expect(jpeg.body.attachment.contentType).toBe('image/jpeg');
  });

  it.each([
    ['a program renamed to .pdf', EXE, 'speeds.pdf'],
    ['a text file renamed to .pdf', Buffer.from('VS1 52 kt, VR 55 kt\n'), 'speeds.pdf'],
    ['a PDF header without the end of a PDF', Buffer.from('%PDF-1.7\nnot really a pdf at all'), 'cut-off.pdf'],
  ])('refuses %s with 415 and a sentence, keeping nothing', async (_what, body, name) => {
    const revision = await revisionIn('draft');
    const before = existsSync(join(apiTestAttachmentsDir(), String(revision.operatorId))) ? readdirSync(join(apiTestAttachmentsDir(), String(revision.operatorId))).length : 0;
    const res = await attach('engineer', revision.id, body, name, 'application/pdf');
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_file_type', message: 'Attach a PDF, PNG or JPEG file. This file is none of those, whatever its name says.' });
    expect(await Attachment.count({ where: { revisionId: revision.id } })).toBe(0);
    const after = existsSync(join(apiTestAttachmentsDir(), String(revision.operatorId))) ? readdirSync(join(apiTestAttachmentsDir(), String(revision.operatorId))).length : 0;
    expect(after).toBe(before);
  });

  it('answers 413 above 10 MB', async () => {
    const revision = await revisionIn('draft');
    const big = Buffer.concat([PDF, Buffer.alloc(10 * 1024 * 1024)]);
    const res = await attach('engineer', revision.id, big, 'big.pdf');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'file_too_large', message: expect.stringMatching(/10 MB/) });
    expect(await Attachment.count({ where: { revisionId: revision.id } })).toBe(0);
  });

  it('adds only to drafts and revisions in review, and removes only from drafts', async () => {
    const published = await revisionIn('published');
    const refused = await attach('engineer', published.id, PDF, 'late.pdf');
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe('Source pages can be added only while the revision is a draft or in review; revision 1 is published.');

    const review = await revisionIn('in_review');
    const added = await attach('engineer', review.id, PDF, 'review.pdf');
    expect(added.status).toBe(201);
    const { agent, token } = await signIn(harness.app, demoEmail('engineer'));
    const kept = await agent.delete(`/api/attachments/${added.body.attachment.id}`).set('x-csrf-token', token);
    expect(kept.status).toBe(409);
    expect(kept.body.error.message).toMatch(/removed only while the revision is a draft; revision 1 is in review/);

    const draft = await revisionIn('draft');
    const removable = await attach('engineer', draft.id, PDF, 'draft.pdf');
    const stored = await Attachment.findByPk(removable.body.attachment.id, { rejectOnEmpty: true });
    await agent.delete(`/api/attachments/${stored.id}`).set('x-csrf-token', token).expect(204);
    expect(await Attachment.findByPk(stored.id)).toBeNull();
    expect(existsSync(join(apiTestAttachmentsDir(), String(stored.operatorId), stored.storageName))).toBe(false);
    await agent.get(`/api/attachments/${stored.id}`).expect(404);
    expect(await AuditEvent.count({ where: { action: 'attachment.removed', entityId: String(stored.id) } })).toBe(1);
  });

  it('answers 404 for another operator’s revision and attachment', async () => {
    const ours = await revisionIn('draft');
    const added = await attach('engineer', ours.id, PDF, 'ours.pdf');
    const theirs = await revisionIn('draft', 'second-demo');
    const second = await signIn(harness.app, demoEmail('admin', 'second'));
    // The second operator has no engineer, so the demo engineer reaches across instead.
    const engineer = await signIn(harness.app, demoEmail('engineer'));
    const intoTheirs = await engineer.agent.post(`/api/revisions/${theirs.id}/attachments`).set('x-csrf-token', engineer.token).attach('file', PDF, 'x.pdf');
    expect(intoTheirs.status).toBe(404);
    expect(intoTheirs.body.error.message).toBe('That revision does not exist.');
    await engineer.agent.get(`/api/revisions/${theirs.id}/attachments`).expect(404);

    const pilotTwo = await sessionOf(harness.app, 'pilot', 'second');
    const published = await revisionIn('published');
    const onPublished = await Attachment.create({ ...added.body.attachment, id: undefined, revisionId: published.id, operatorId: published.operatorId, storageName: randomBytes(16).toString('hex'), uploadedById: null });
    for (const session of [second, pilotTwo]) {
      const file = await session.agent.get(`/api/attachments/${added.body.attachment.id}`);
      expect(file.status).toBe(404);
      expect(file.body.error.message).toBe('That attachment does not exist.');
      await session.agent.get(`/api/attachments/${onPublished.id}`).expect(404);
    }
    const removal = await second.agent.delete(`/api/attachments/${added.body.attachment.id}`).set('x-csrf-token', second.token);
    expect(removal.status).toBe(403);
    expect(await Attachment.findByPk(added.body.attachment.id)).not.toBeNull();
  });

  it('shows drafts’ pages only to those who see drafts; published pages to every reader', async () => {
    const draft = await revisionIn('draft');
    const added = await attach('engineer', draft.id, PDF, 'draft.pdf');
    for (const role of ['pilot', 'inspector'] as const) {
      const { agent } = await sessionOf(harness.app, role);
      await agent.get(`/api/revisions/${draft.id}/attachments`).expect(404);
      await agent.get(`/api/attachments/${added.body.attachment.id}`).expect(404);
    }
    const review = await revisionIn('in_review');
    const kept = await attach('engineer', review.id, PDF, 'source.pdf');
    await review.update({ status: 'published', publishedAt: new Date() });
    for (const role of ['pilot', 'inspector', 'admin'] as const) {
      const { agent } = await sessionOf(harness.app, role);
      await agent.get(`/api/revisions/${review.id}/attachments`).expect(200);
      const served = await agent.get(`/api/attachments/${kept.body.attachment.id}`);
      expect(served.status).toBe(200);
    }
  });

  it('answers writes by role: 403 to pilot, admin, inspector; 201 to engineer and approver; 401 signed out', async () => {
    const revision = await revisionIn('draft');
    for (const role of ['pilot', 'admin', 'inspector'] as const) {
      const res = await attach(role, revision.id, PDF, 'x.pdf');
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect((await attach('admin', revision.id, PDF, 'x.pdf', 'application/pdf', 'second')).status).toBe(403);
    expect((await attach('pilot', revision.id, PDF, 'x.pdf', 'application/pdf', 'second')).status).toBe(403);
    for (const role of ['engineer', 'approver'] as const) expect((await attach(role, revision.id, PDF, `${role}.pdf`)).status).toBe(201);

    const id = (await Attachment.findOne({ where: { revisionId: revision.id }, rejectOnEmpty: true })).id;
    for (const role of ['pilot', 'admin', 'inspector'] as const) {
      const { agent, token } = await sessionOf(harness.app, role);
      expect((await agent.delete(`/api/attachments/${id}`).set('x-csrf-token', token)).status).toBe(403);
    }
    const { agent, token } = await csrfAgent(harness.app);
    expect((await agent.post(`/api/revisions/${revision.id}/attachments`).set('x-csrf-token', token).attach('file', PDF, 'x.pdf')).status).toBe(401);
    expect((await agent.get(`/api/revisions/${revision.id}/attachments`)).status).toBe(401);
    expect((await agent.get(`/api/attachments/${id}`)).status).toBe(401);
    expect((await agent.delete(`/api/attachments/${id}`).set('x-csrf-token', token)).status).toBe(401);
    expect((await request(harness.app).get('/api/attachments/not-a-number')).status).toBe(401);
  });
});
