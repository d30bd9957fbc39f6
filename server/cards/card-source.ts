/**
 * Loads what `buildCard` needs from the database: the revision (content and hash) and the
 * airframe with its type, speed book and operator, all of the caller's operator. Used by the
 * preview and by the card log, which re-derives every reported card.
 */
import type { Transaction } from 'sequelize';
import type { CardContext, CardRevision } from '@shared/card/card';
import { contentSha256 } from '@shared/speed-book/canonical';
import { DomainError, notFound } from '../errors/domain-error';
import { AircraftType, Airframe, Operator, Revision, SpeedBook } from '../models';
import { EVER_PUBLISHED_STATUSES, maySeeRevision, OPEN_STATUSES, type Viewer } from '../revisions/revision-access';
import { statusWords } from '../revisions/revision-views';

export interface CardSource {
  revision: CardRevision;
  context: CardContext;
  /** The stored revision row (status, speed book). */
  row: Revision;
}

/** Which revisions a card may come from: a preview of the current one, or the log of any ever published. */
export type CardPurpose = 'preview' | 'issue';

/**
 * The revision and airframe for a card. 404 when either is not the operator's (or a draft the
 * role may not see); 422 when the airframe id is missing; 409 when the revision cannot carry a card for `purpose`; 422 when the
 * airframe is not of the revision's type or not in service.
 */
export async function loadCardSource(
  viewer: Viewer,
  revisionId: number,
  airframeId: unknown,
  purpose: CardPurpose,
  transaction?: Transaction,
): Promise<CardSource> {
  const row = await Revision.findOne({ where: { id: revisionId, operatorId: viewer.operatorId }, transaction });
  const open = row !== null && OPEN_STATUSES.includes(row.status);
  if (!row || (open && purpose === 'issue') || !maySeeRevision(viewer.role, row.status)) throw notFound('That revision');
  if (purpose === 'preview' && !open && row.status !== 'published') {
    throw new DomainError('conflict', 'revision_not_current', `Revision ${row.number} is ${statusWords(row.status)}; cards are prepared from the published revision.`);
  }
  if (purpose === 'issue' && !EVER_PUBLISHED_STATUSES.includes(row.status)) throw notFound('That revision');

  const book = await SpeedBook.findOne({ where: { id: row.speedBookId, operatorId: viewer.operatorId }, rejectOnEmpty: true, transaction });
  const type = await AircraftType.findOne({ where: { id: book.aircraftTypeId, operatorId: viewer.operatorId }, rejectOnEmpty: true, transaction });
  if (!(typeof airframeId === 'number' && Number.isInteger(airframeId) && airframeId > 0 && airframeId <= 4_294_967_295)) {
    throw refusedAirframe('Choose the airframe.');
  }
  const airframe = await Airframe.findOne({ where: { id: airframeId, operatorId: viewer.operatorId }, transaction });
  if (!airframe) throw notFound('That airframe');
  if (airframe.aircraftTypeId !== type.id) {
    throw refusedAirframe(`${airframe.registration} is not a ${type.name}; choose an airframe of the speed book’s type.`);
  }
  if (purpose === 'preview' && !airframe.active) throw refusedAirframe(`${airframe.registration} is not in service.`);
  const operator = await Operator.findByPk(viewer.operatorId, { rejectOnEmpty: true, transaction });

  const content: unknown = JSON.parse(row.content);
  return {
    row,
    revision: {
      id: row.id,
      number: row.number,
      publishedAt: row.publishedAt?.toISOString() ?? null,
      // A draft has no published hash yet: its preview is checked against its own content.
      contentSha256: row.contentSha256 ?? contentSha256(content),
      content,
    },
    context: {
      airframe: { id: airframe.id, registration: airframe.registration },
      aircraftType: { designator: type.designator, name: type.name },
      speedBook: { id: book.id, title: book.title },
      demo: operator.isDemo,
    },
  };
}

function refusedAirframe(message: string): DomainError {
  return new DomainError('refused', 'card_refused', message, { 'inputs.airframeId': message });
}
