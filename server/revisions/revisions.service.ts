/**
 * The life of a revision: draft → in review → published → superseded or withdrawn (and back
 * from review to draft when returned). Every change locks the rows it reads with
 * SELECT … FOR UPDATE (the speed book first, then the revision, always in that order) and writes
 * its audit event in the same transaction.
 */
import type { Transaction } from 'sequelize';
import type { RevisionView } from '@shared/api/revisions';
import { canonicalJson, contentSha256 } from '@shared/speed-book/canonical';
import { diffContent, type ContentChange } from '@shared/speed-book/diff';
import { revisionContentProblems, revisionContentSchema, type RevisionContent } from '@shared/speed-book/revision-content';
import { sweepEnvelope } from '@shared/card/coverage';
import type { CoverageReport } from '@shared/card/coverage-report';
import { signedRevisionStatement } from '@shared/speed-book/signature';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { forbidden, DomainError, notFound } from '../errors/domain-error';
import { notifyRevisionPublished, notifyRevisionSubmitted, notifyRevisionWithdrawn } from '../mail/notifications';
import type { AttachmentStore } from '../attachments/attachments.service';
import { AircraftType, Attachment, Revision, SpeedBook } from '../models';
import { contributorsInWords, recordContribution, refuseContributor, revisionContributors } from './revision-contributors';
import { EVER_PUBLISHED_STATUSES, OPEN_STATUSES, visibleRevision, type Viewer } from './revision-access';
import { peopleNames, revisionDetail, statusWords } from './revision-views';
import { activeSigningKey, signStatement } from './signing';
import { transact } from '../transactions';


/** The revision as stored (timestamps in whole seconds), the same as any later GET shows it. */
async function detail(operatorId: number, revision: Revision): Promise<RevisionView> {
  await revision.reload();
  return revisionDetail(revision, await peopleNames(operatorId, [revision]), await revisionContributors(operatorId, revision.id));
}

function audit(actor: Actor, action: string, revision: Revision, details: Record<string, unknown>, transaction: Transaction) {
  return recordAudit(
    { operatorId: actor.operatorId, actorId: actor.userId, action, entityType: 'revision', entityId: revision.id, details: { speedBookId: revision.speedBookId, number: revision.number, ...details }, origin: actor.origin },
    transaction,
  );
}

/**
 * Mail goes out once the change commits, and only when the actor's changes announce themselves
 * (`Actor.sendsMail`): the demo seed runs these services before any app, and sends nothing.
 */
function mailing(actor: Actor, transaction: Transaction) {
  return actor.sendsMail ? { transaction, actorId: actor.userId } : undefined;
}

function wrongStatus(revision: Revision, needed: string): DomainError {
  return new DomainError('conflict', 'wrong_status', `Revision ${revision.number} is ${statusWords(revision.status)}; ${needed}.`);
}

async function lockBook(operatorId: number, speedBookId: number, transaction: Transaction): Promise<SpeedBook> {
  const book = await SpeedBook.findOne({ where: { id: speedBookId, operatorId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!book) throw notFound('That speed book');
  return book;
}

async function lockRevision(operatorId: number, id: number, transaction: Transaction): Promise<Revision> {
  const revision = await Revision.findOne({ where: { id, operatorId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!revision) throw notFound('That revision');
  return revision;
}

/** Locks the revision's speed book and then the revision (the one lock order of this module). */
async function lockBookAndRevision(operatorId: number, id: number, transaction: Transaction): Promise<{ book: SpeedBook; revision: Revision }> {
  const located = await Revision.findOne({ where: { id, operatorId }, attributes: ['speedBookId'], transaction });
  if (!located) throw notFound('That revision');
  const book = await lockBook(operatorId, located.speedBookId, transaction);
  return { book, revision: await lockRevision(operatorId, id, transaction) };
}

export async function getRevision(viewer: Viewer, id: number): Promise<RevisionView> {
  return detail(viewer.operatorId, await visibleRevision(viewer, id));
}

export interface NewRevision {
  content?: Record<string, unknown>;
  changeSummary: string;
}

/** A new draft: the given content, or a copy of the latest content that was published. */
export async function createRevision(actor: Actor, speedBookId: number, input: NewRevision): Promise<RevisionView> {
  const revision = await transact(async (transaction) => {
    const book = await lockBook(actor.operatorId, speedBookId, transaction);
    const open = await Revision.findOne({ where: { speedBookId: book.id, status: OPEN_STATUSES }, transaction });
    if (open) {
      throw new DomainError('conflict', 'open_revision_exists', `Revision ${open.number} of this speed book is still ${statusWords(open.status)}; finish or return it first.`);
    }
    let content = input.content;
    let copiedFrom: number | undefined;
    if (content === undefined) {
      const latest = await Revision.findOne({ where: { speedBookId: book.id, status: EVER_PUBLISHED_STATUSES }, order: [['number', 'DESC']], transaction });
      if (!latest) {
        throw new DomainError('refused', 'no_content', 'This speed book has no published revision to copy; give the content.', {
          content: 'Give the content: there is no published revision to start from.',
        });
      }
      content = JSON.parse(latest.content) as Record<string, unknown>;
      copiedFrom = latest.id;
    }
    const highest = (await Revision.max<number | null, Revision>('number', { where: { speedBookId: book.id }, transaction })) ?? 0;
    const created = await Revision.create(
      {
        operatorId: actor.operatorId,
        speedBookId: book.id,
        number: highest + 1,
        status: 'draft',
        content: canonicalJson(content),
        changeSummary: input.changeSummary,
        authorId: actor.userId,
        submittedAt: null,
        returnedAt: null,
        returnReason: null,
        approverId: null,
        publishedAt: null,
        supersededAt: null,
        withdrawnAt: null,
        withdrawnById: null,
        withdrawReason: null,
        contentSha256: null,
        signature: null,
        signingKeyId: null,
      },
      { transaction },
    );
    await recordContribution(actor, created.id, 'created', transaction);
    await audit(actor, 'revision.created', created, { changeSummary: input.changeSummary, ...(copiedFrom ? { copiedFromRevisionId: copiedFrom } : {}) }, transaction);
    return created;
  });
  return detail(actor.operatorId, revision);
}

export interface RevisionChange {
  content?: Record<string, unknown>;
  changeSummary?: string;
}

/** Changes a draft (content replaced whole); anything but a draft answers 409. */
export async function updateRevision(actor: Actor, id: number, input: RevisionChange): Promise<RevisionView> {
  const revision = await transact(async (transaction) => {
    const revision = await lockRevision(actor.operatorId, id, transaction);
    if (revision.status !== 'draft') throw wrongStatus(revision, 'only a draft can be changed');
    const before = JSON.parse(revision.content) as unknown;
    const changes: Partial<Pick<Revision, 'content' | 'changeSummary'>> = {};
    if (input.content !== undefined) changes.content = canonicalJson(input.content);
    if (input.changeSummary !== undefined) changes.changeSummary = input.changeSummary;
    await revision.update(changes, { transaction });
    await recordContribution(actor, revision.id, 'edited', transaction);
    await audit(
      actor,
      'revision.updated',
      revision,
      { contentChanges: input.content === undefined ? 0 : diffContent(before, input.content).length, ...(input.changeSummary !== undefined ? { changeSummary: input.changeSummary } : {}) },
      transaction,
    );
    return revision;
  });
  return detail(actor.operatorId, revision);
}

/**
 * Discards a draft nobody will submit: the revision and its source pages go, in one
 * transaction, audited with its number and summary; the pages' files are removed after the
 * commit. Anything but a draft answers 409 (what was submitted or published stays on record).
 */
export async function discardDraft(actor: Actor, id: number, store: AttachmentStore): Promise<void> {
  const pages = await transact(async (transaction) => {
    const { revision } = await lockBookAndRevision(actor.operatorId, id, transaction);
    if (revision.status !== 'draft') throw wrongStatus(revision, 'only a draft can be discarded');
    const attachments = await Attachment.findAll({ where: { revisionId: revision.id, operatorId: actor.operatorId }, transaction });
    await Attachment.destroy({ where: { revisionId: revision.id, operatorId: actor.operatorId }, transaction });
    await revision.destroy({ transaction });
    await audit(actor, 'revision.discarded', revision, { changeSummary: revision.changeSummary, sourcePages: attachments.length }, transaction);
    return attachments;
  });
  await store.removeFiles(pages);
}

/** The content's problems, and whether it describes the speed book's own type, as 422 fields. */
async function contentProblems(revision: Revision, book: SpeedBook, transaction: Transaction): Promise<Record<string, string>> {
  const content = JSON.parse(revision.content) as unknown;
  const fields: Record<string, string> = {};
  for (const [path, sentence] of Object.entries(revisionContentProblems(content))) fields[`content.${path}`] = sentence;
  const parsed = revisionContentSchema.safeParse(content);
  if (parsed.success) {
    const type = await AircraftType.findOne({ where: { id: book.aircraftTypeId, operatorId: book.operatorId }, transaction, rejectOnEmpty: true });
    if (parsed.data.aircraft.category !== type.category) fields['content.aircraft.category'] = `This speed book’s type ${type.designator} is ${type.category}, not ${parsed.data.aircraft.category}.`;
    if (parsed.data.aircraft.engines !== type.engines) fields['content.aircraft.engines'] = `This speed book’s type ${type.designator} has ${type.engines} engine(s).`;
  }
  return fields;
}

// ---------------------------------------------------------------------------------------------
// The envelope proof (shared/card/coverage.ts): the same computation the card runs.

/** Content parsed as revision content, or a 422 with every field problem under `content.…`. */
function parsedContent(content: unknown, message: string): RevisionContent {
  const parsed = revisionContentSchema.safeParse(content);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string> = {};
  for (const [path, sentence] of Object.entries(revisionContentProblems(content))) fields[`content.${path}`] = sentence;
  throw new DomainError('refused', 'content_invalid', message, fields);
}

/** The coverage report of a revision anyone who may read it may see. */
export async function revisionCoverage(viewer: Viewer, id: number): Promise<CoverageReport> {
  const revision = await visibleRevision(viewer, id);
  return sweepEnvelope(parsedContent(JSON.parse(revision.content), 'The revision’s content is not complete yet; the envelope can be swept once these fields are right.'));
}

/** The coverage report of content not saved yet (the editor's live picture). */
export function contentCoverage(content: unknown): CoverageReport {
  return sweepEnvelope(parsedContent(content, 'The content is not complete yet; the envelope can be swept once these fields are right.'));
}

/**
 * Refuses submit and publish unless the content declares its envelope and the sweep passes:
 * no point inside the envelope refused, and every broken ordering rule with the flight
 * manual's reason recorded. The 422 carries the report (`error.report`).
 */
function requireCoverage(content: unknown, step: 'submitted' | 'published'): void {
  const parsed = revisionContentSchema.parse(content);
  if (!parsed.envelope) {
    throw new DomainError('refused', 'content_invalid', `The revision cannot be ${step} until it declares its envelope.`, {
      'content.envelope': 'Declare the takeoff and landing pressure-altitude and temperature ranges this book covers.',
    });
  }
  const report = sweepEnvelope(parsed);
  if (report.passes) return;
  const unexcepted = report.rules.filter((rule) => !rule.exception);
  const parts = [
    report.counts.refused ? `${report.counts.refused} of ${report.counts.points} points inside the envelope give no card` : '',
    unexcepted.length ? `${unexcepted.map((rule) => rule.title).join(', ')} ${unexcepted.length === 1 ? 'is' : 'are'} broken without a recorded exception` : '',
  ].filter(Boolean);
  throw new DomainError(
    'refused',
    'coverage_failed',
    `The revision cannot be ${step}: ${parts.join('; ')}. Narrow the envelope, correct the tables, or record the flight manual's reason for an exception.`,
    undefined,
    { report },
  );
}

/** Draft → in review, only when the content is complete and consistent and covers its envelope. */
export async function submitRevision(actor: Actor, id: number): Promise<RevisionView> {
  const revision = await transact(async (transaction) => {
    const { book, revision } = await lockBookAndRevision(actor.operatorId, id, transaction);
    if (revision.status !== 'draft') throw wrongStatus(revision, 'only a draft can be submitted');
    const fields = await contentProblems(revision, book, transaction);
    if (Object.keys(fields).length) throw new DomainError('refused', 'content_invalid', 'The revision cannot be submitted until these fields are right.', fields);
    requireCoverage(JSON.parse(revision.content), 'submitted');
    await revision.update({ status: 'in_review', submittedAt: new Date() }, { transaction });
    await recordContribution(actor, revision.id, 'submitted', transaction);
    await audit(actor, 'revision.submitted', revision, {}, transaction);
    const mail = mailing(actor, transaction);
    if (mail) await notifyRevisionSubmitted(revision, actor.operatorId, mail);
    return revision;
  });
  return detail(actor.operatorId, revision);
}

/**
 * In review → published: signs the revision (see shared/speed-book/signature.ts for exactly
 * what) and supersedes the speed book's published revision, all in one transaction. With the
 * book row locked first, a second approval racing this one waits, then finds the revision
 * published and answers 409.
 */
export async function approveRevision(actor: Actor, id: number, signingKeySecret: string): Promise<RevisionView> {
  const revision = await transact(async (transaction) => {
    const { book, revision } = await lockBookAndRevision(actor.operatorId, id, transaction);
    if (revision.authorId === actor.userId) throw forbidden('Nobody approves their own revision; another approver must.');
    await refuseContributor(actor, revision, transaction);
    if (revision.status !== 'in_review') throw wrongStatus(revision, 'only a revision in review can be approved');
    const fields = await contentProblems(revision, book, transaction);
    if (Object.keys(fields).length) throw new DomainError('refused', 'content_invalid', 'The revision’s content is not valid; return it to its author.', fields);
    requireCoverage(JSON.parse(revision.content), 'published');

    const key = await activeSigningKey(actor.operatorId, signingKeySecret, transaction, actor);
    // Whole seconds: what is signed must survive the round trip through a DATETIME column.
    const publishedAt = new Date(Math.floor(Date.now() / 1000) * 1000);
    const content = revisionContentSchema.parse(JSON.parse(revision.content));
    const canonical = canonicalJson(content);
    const sha256 = contentSha256(content);
    const statement = signedRevisionStatement({
      operatorId: actor.operatorId,
      speedBookId: book.id,
      revisionId: revision.id,
      number: revision.number,
      contentSha256: sha256,
      publishedAt: publishedAt.toISOString(),
    });

    const previous = await Revision.findAll({ where: { speedBookId: book.id, operatorId: actor.operatorId, status: 'published' }, transaction, lock: transaction.LOCK.UPDATE });
    for (const old of previous) {
      await old.update({ status: 'superseded', supersededAt: publishedAt }, { transaction });
      await audit(actor, 'revision.superseded', old, { supersededByRevisionId: revision.id }, transaction);
    }
    await revision.update(
      { status: 'published', content: canonical, approverId: actor.userId, publishedAt, contentSha256: sha256, signature: signStatement(key, signingKeySecret, statement), signingKeyId: key.id },
      { transaction },
    );
    const contributors = contributorsInWords(await revisionContributors(actor.operatorId, revision.id, transaction));
    await audit(actor, 'revision.approved', revision, { contentSha256: sha256, signingKeyId: key.id, supersededRevisionIds: previous.map((old) => old.id), contributors }, transaction);
    const mail = mailing(actor, transaction);
    if (mail) await notifyRevisionPublished({ ...revision.get(), speedBookTitle: book.title }, actor.operatorId, mail);
    return revision;
  });
  return detail(actor.operatorId, revision);
}

/** In review → draft, with the approver's reason; not for one's own revision. */
export async function returnRevision(actor: Actor, id: number, reason: string): Promise<RevisionView> {
  const revision = await transact(async (transaction) => {
    const { revision } = await lockBookAndRevision(actor.operatorId, id, transaction);
    if (revision.authorId === actor.userId) throw forbidden('Nobody returns their own revision; another approver must.');
    if (revision.status !== 'in_review') throw wrongStatus(revision, 'only a revision in review can be returned');
    await revision.update({ status: 'draft', returnedAt: new Date(), returnReason: reason }, { transaction });
    await audit(actor, 'revision.returned', revision, { reason }, transaction);
    return revision;
  });
  return detail(actor.operatorId, revision);
}

/** Published → withdrawn: pilots may no longer use it; the speed book then has no current revision. */
export async function withdrawRevision(actor: Actor, id: number, reason: string): Promise<RevisionView> {
  const revision = await transact(async (transaction) => {
    const { revision } = await lockBookAndRevision(actor.operatorId, id, transaction);
    if (revision.status !== 'published') throw wrongStatus(revision, 'only the published revision can be withdrawn');
    await revision.update({ status: 'withdrawn', withdrawnAt: new Date(), withdrawnById: actor.userId, withdrawReason: reason }, { transaction });
    await audit(actor, 'revision.withdrawn', revision, { reason }, transaction);
    const mail = mailing(actor, transaction);
    if (mail) await notifyRevisionWithdrawn(revision, actor.operatorId, reason, mail);
    return revision;
  });
  return detail(actor.operatorId, revision);
}

/** What changes from revision `againstId` to revision `id` (both must be visible to the viewer). */
export async function diffRevisions(viewer: Viewer, id: number, againstId: number): Promise<{ revisionId: number; againstId: number; changes: ContentChange[] }> {
  const revision = await visibleRevision(viewer, id);
  const against = await visibleRevision(viewer, againstId).catch((error: unknown) => {
    if (error instanceof DomainError && error.kind === 'not-found') throw new DomainError('not-found', 'not_found', 'The revision to compare with does not exist.');
    throw error;
  });
  return { revisionId: revision.id, againstId: against.id, changes: diffContent(JSON.parse(against.content), JSON.parse(revision.content)) };
}
