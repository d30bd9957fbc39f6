import { Op, QueryTypes } from 'sequelize';
import type { SyncResponse, SyncRevision } from '../../shared/api/sync';
import type { Actor } from '../audit/actor';
import { aircraftTypeView, airframeView } from '../fleet/fleet.service';
import { AircraftType, Airframe, Operator, Revision, SpeedBook } from '../models';
import { approachPolicyOf } from '../operator/approach-policy';
import { publishedSigningKeys } from '../revisions/signing';
import { decodeCursor, encodeCursor } from './sync-cursor';
import { database } from '../transactions';

/** Only what a device may hold: never drafts or revisions in review. */
const SYNCED_STATUSES = ['published', 'superseded', 'withdrawn'] as const;

interface Changed {
  id: number;
  change_seq: number;
}

/** Ids and change numbers of the operator's rows of `table` changed after `since`. */
async function changedRows(table: 'aircraft_types' | 'airframes' | 'revisions', operatorId: number, since: number): Promise<Changed[]> {
  // A device refuses what it cannot verify, so a row without its signature is never sent.
  const statusFilter =
    table === 'revisions'
      ? `AND status IN (${SYNCED_STATUSES.map(() => '?').join(', ')}) AND signature IS NOT NULL AND content_sha256 IS NOT NULL AND signing_key_id IS NOT NULL AND published_at IS NOT NULL`
      : '';
  return database().query<Changed>(`SELECT id, change_seq FROM ${table} WHERE operator_id = ? AND change_seq > ? ${statusFilter} ORDER BY change_seq`, {
    replacements: [operatorId, since, ...(table === 'revisions' ? SYNCED_STATUSES : [])],
    type: QueryTypes.SELECT,
  });
}

/** What changed for the actor's operator since `cursor` (everything without one). */
export async function syncSince(actor: Actor, cursor: string | undefined, signingKeySecret: string): Promise<SyncResponse> {
  const since = decodeCursor(cursor);
  const { operatorId } = actor;
  const [types, frames, revs, operator, keysFirstRead] = await Promise.all([
    changedRows('aircraft_types', operatorId, since),
    changedRows('airframes', operatorId, since),
    changedRows('revisions', operatorId, since),
    Operator.findByPk(operatorId, { rejectOnEmpty: true }),
    publishedSigningKeys(operatorId, signingKeySecret, actor),
  ]);
  const high = Math.max(since, ...[...types, ...frames, ...revs].map((row) => Number(row.change_seq)));

  const idsOf = (rows: Changed[]) => rows.map((row) => row.id);
  const [aircraftTypes, airframes, revisions] = await Promise.all([
    types.length ? AircraftType.findAll({ where: { operatorId, id: { [Op.in]: idsOf(types) } }, order: [['id', 'ASC']] }) : [],
    frames.length ? Airframe.findAll({ where: { operatorId, id: { [Op.in]: idsOf(frames) } }, order: [['id', 'ASC']] }) : [],
    revs.length ? Revision.findAll({ where: { operatorId, id: { [Op.in]: idsOf(revs) }, status: [...SYNCED_STATUSES], signature: { [Op.ne]: null } }, order: [['id', 'ASC']] }) : [],
  ]);
  // A rotation and a publication may commit between the reads above: a key is committed before any
  // revision naming it, so reading the keys again then gives every key the sent revisions name.
  const known = new Set(keysFirstRead.all.map((one) => one.id));
  const keys = revisions.some((revision) => !known.has(revision.signingKeyId!)) ? await publishedSigningKeys(operatorId, signingKeySecret, actor) : keysFirstRead;
  const key = keys.active;
  const books = revisions.length ? await SpeedBook.findAll({ where: { operatorId, id: { [Op.in]: [...new Set(revisions.map((r) => r.speedBookId))] } } }) : [];
  const bookById = new Map(books.map((book) => [book.id, book]));

  return {
    cursor: encodeCursor(high),
    operator: {
      id: operator.id,
      name: operator.name,
      isDemo: operator.isDemo,
      publicKey: key.publicKey,
      signingKeyId: key.id,
      // Every key, every time (a handful of rows): a device that missed a rotation still learns the key its revisions name.
      signingKeys: keys.all.map((one) => ({ id: one.id, publicKey: one.publicKey, createdAt: one.createdAt.toISOString(), retiredAt: one.retiredAt?.toISOString() ?? null })),
      currencyLimitDays: operator.currencyLimitDays,
      approachAdditivePolicy: approachPolicyOf(operator),
    },
    aircraftTypes: aircraftTypes.map(aircraftTypeView),
    airframes: airframes.map(airframeView),
    revisions: revisions.map((revision) => syncRevisionView(revision, bookById.get(revision.speedBookId)!)),
  };
}

function syncRevisionView(revision: Revision, book: SpeedBook): SyncRevision {
  return {
    id: revision.id,
    speedBookId: revision.speedBookId,
    speedBookTitle: book.title,
    aircraftTypeId: book.aircraftTypeId,
    number: revision.number,
    status: revision.status as SyncRevision['status'],
    publishedAt: revision.publishedAt!.toISOString(),
    supersededAt: revision.supersededAt?.toISOString() ?? null,
    withdrawnAt: revision.withdrawnAt?.toISOString() ?? null,
    content: JSON.parse(revision.content) as Record<string, unknown>,
    contentSha256: revision.contentSha256!,
    signature: revision.signature!,
    signingKeyId: revision.signingKeyId!,
  };
}
