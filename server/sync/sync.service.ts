import { Op, QueryTypes } from 'sequelize';
import type { SyncResponse, SyncRevision } from '@shared/api/sync';
import type { Actor } from '../audit/actor';
import { aircraftTypeView, airframeView } from '../fleet/fleet.service';
import { AircraftType, Airframe, Operator, Revision, SpeedBook } from '../models';
import { approachPolicyOf } from '../operator/approach-policy';
import { publishedSigningKeys } from '../revisions/signing';
import { decodeCursor, encodeCursor } from './sync-cursor';
import { database } from '../transactions';

/** Only what a device may hold: never drafts or revisions in review. */
const SYNCED_STATUSES = ['published', 'superseded', 'withdrawn'] as const;

type SyncedTable = 'aircraft_types' | 'airframes' | 'revisions';

interface Changed {
  table: SyncedTable;
  id: number;
  change_seq: number;
}

/**
 * Ids and change numbers of the operator's synced rows changed after `since`, in ONE statement:
 * one read view, so the new cursor (the largest number answered) never passes a change that a
 * separate query on another table, run a moment earlier, did not see yet.
 */
async function changedRows(operatorId: number, since: number): Promise<Changed[]> {
  // A device refuses what it cannot verify, so a row without its signature is never sent.
  const signed = 'signature IS NOT NULL AND content_sha256 IS NOT NULL AND signing_key_id IS NOT NULL AND published_at IS NOT NULL';
  const statuses = SYNCED_STATUSES.map(() => '?').join(', ');
  return database().query<Changed>(
    `SELECT 'aircraft_types' AS \`table\`, id, change_seq FROM aircraft_types WHERE operator_id = ? AND change_seq > ?
     UNION ALL SELECT 'airframes', id, change_seq FROM airframes WHERE operator_id = ? AND change_seq > ?
     UNION ALL SELECT 'revisions', id, change_seq FROM revisions WHERE operator_id = ? AND change_seq > ? AND status IN (${statuses}) AND ${signed}
     ORDER BY change_seq`,
    { replacements: [operatorId, since, operatorId, since, operatorId, since, ...SYNCED_STATUSES], type: QueryTypes.SELECT, useMaster: true },
  );
}

/**
 * What changed for the actor's operator since `cursor` (everything without one). Every read here
 * goes to the primary (`useMaster`), also when DATABASE_READ_URLS names replicas: a replica that
 * lags would answer a cursor, or miss a row the cursor already counts.
 */
export async function syncSince(actor: Actor, cursor: string | undefined, signingKeySecret: string): Promise<SyncResponse> {
  const since = decodeCursor(cursor);
  const { operatorId } = actor;
  const [changed, operator, keysFirstRead] = await Promise.all([
    changedRows(operatorId, since),
    Operator.findByPk(operatorId, { rejectOnEmpty: true, useMaster: true }),
    publishedSigningKeys(operatorId, signingKeySecret, actor),
  ]);
  const high = Math.max(since, ...changed.map((row) => Number(row.change_seq)));
  const ofTable = (table: SyncedTable) => changed.filter((row) => row.table === table);
  const [types, frames, revs] = [ofTable('aircraft_types'), ofTable('airframes'), ofTable('revisions')];

  const idsOf = (rows: Changed[]) => rows.map((row) => row.id);
  const [aircraftTypes, airframes, revisions] = await Promise.all([
    types.length ? AircraftType.findAll({ where: { operatorId, id: { [Op.in]: idsOf(types) } }, order: [['id', 'ASC']], useMaster: true }) : [],
    frames.length ? Airframe.findAll({ where: { operatorId, id: { [Op.in]: idsOf(frames) } }, order: [['id', 'ASC']], useMaster: true }) : [],
    revs.length ? Revision.findAll({ where: { operatorId, id: { [Op.in]: idsOf(revs) }, status: [...SYNCED_STATUSES], signature: { [Op.ne]: null } }, order: [['id', 'ASC']], useMaster: true }) : [],
  ]);
  // A rotation and a publication may commit between the reads above: a key is committed before any
  // revision naming it, so reading the keys again then gives every key the sent revisions name.
  const known = new Set(keysFirstRead.all.map((one) => one.id));
  const keys = revisions.some((revision) => !known.has(revision.signingKeyId!)) ? await publishedSigningKeys(operatorId, signingKeySecret, actor) : keysFirstRead;
  const key = keys.active;
  const books = revisions.length ? await SpeedBook.findAll({ where: { operatorId, id: { [Op.in]: [...new Set(revisions.map((r) => r.speedBookId))] } }, useMaster: true }) : [];
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
