import { UniqueConstraintError } from 'sequelize';
import type { SpeedBookSummary } from '@shared/api/revisions';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError, notFound } from '../errors/domain-error';
import { AircraftType, Revision, SpeedBook } from '../models';
import { visibleStatusFilter, type Viewer } from '../revisions/revision-access';
import { peopleNames, revisionSummary } from '../revisions/revision-views';
import { transact } from '../transactions';

function summary(book: SpeedBook, current: Revision | undefined, names: Map<number, string>): SpeedBookSummary {
  return { id: book.id, title: book.title, aircraftTypeId: book.aircraftTypeId, currentRevision: current ? revisionSummary(current, names) : null };
}

/** The operator's speed books, each with its published revision (or null). */
export async function listSpeedBooks(viewer: Viewer): Promise<SpeedBookSummary[]> {
  const books = await SpeedBook.findAll({ where: { operatorId: viewer.operatorId }, order: [['title', 'ASC']] });
  const published = await Revision.findAll({ where: { operatorId: viewer.operatorId, status: 'published' } });
  const names = await peopleNames(viewer.operatorId, published);
  const byBook = new Map(published.map((revision) => [revision.speedBookId, revision]));
  return books.map((book) => summary(book, byBook.get(book.id), names));
}

/** One speed book with its revisions, newest first; only the published ones for readers. */
export async function getSpeedBook(viewer: Viewer, id: number) {
  const book = await SpeedBook.findOne({ where: { id, operatorId: viewer.operatorId } });
  if (!book) throw notFound('That speed book');
  const revisions = await Revision.findAll({
    where: { speedBookId: book.id, operatorId: viewer.operatorId, ...visibleStatusFilter(viewer.role) },
    order: [['number', 'DESC']],
  });
  const names = await peopleNames(viewer.operatorId, revisions);
  return {
    ...summary(book, revisions.find((revision) => revision.status === 'published'), names),
    revisions: revisions.map((revision) => revisionSummary(revision, names)),
    createdAt: book.createdAt.toISOString(),
    updatedAt: book.updatedAt.toISOString(),
  };
}

/** A new, empty speed book for one of the operator's types (one per type). */
export async function createSpeedBook(actor: Actor, input: { aircraftTypeId: number; title: string }) {
  const type = await AircraftType.findOne({ where: { id: input.aircraftTypeId, operatorId: actor.operatorId } });
  if (!type) throw new DomainError('refused', 'unknown_reference', 'That aircraft type does not exist.', { aircraftTypeId: 'Choose one of your aircraft types.' });
  try {
    const book = await transact(async (transaction) => {
      const book = await SpeedBook.create({ operatorId: actor.operatorId, aircraftTypeId: type.id, title: input.title }, { transaction });
      await recordAudit(
        { operatorId: actor.operatorId, actorId: actor.userId, action: 'speed-book.created', entityType: 'speed-book', entityId: book.id, details: { ...input }, origin: actor.origin },
        transaction,
      );
      return book;
    });
    return getSpeedBook(actor, book.id);
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new DomainError('conflict', 'duplicate', `${type.designator} already has a speed book.`, { aircraftTypeId: 'This type already has its speed book.' });
    }
    throw error;
  }
}
