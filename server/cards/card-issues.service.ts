/**
 * The card log. Devices report the cards they issued (often hours later, after an offline
 * day); the server re-derives each card with `buildCard` from the reported inputs and its own
 * copy of the revision and records the entry only when the digests agree.
 *
 * Reporting is idempotent by the device's entry id: the first report of an entry is stored
 * with the hash of what was reported; any later report with the same id and the same entry
 * answers exactly as the first did and stores nothing; the same id with a different entry is a
 * conflict. Concurrent first reports race on the primary key; the losers read the winner's row.
 */
import { Op, UniqueConstraintError, type WhereOptions } from 'sequelize';
import { can } from '@shared/auth/roles';
import { generateCardCode } from '@shared/card-check/card-code';
import { buildCard } from '@shared/card/build-card';
import { CardRefusedError, type CardInputs } from '@shared/card/card';
import type { CardIssueEntry, CardIssueQuery, CardIssueResult, CardIssueView } from '@shared/card/card-api';
import { canonicalJson, sha256Hex } from '@shared/speed-book/canonical';
import type { Actor } from '../audit/actor';
import { recordAudit } from '../audit/audit.service';
import { DomainError, notFound } from '../errors/domain-error';
import { Airframe, CardIssue, Revision, User } from '../models';
import { loadCardSource } from './card-source';
import { transact } from '../transactions';


/** Records each entry of a batch in order; one result per entry, in the same order. */
export async function recordCardIssues(actor: Actor, entries: CardIssueEntry[]): Promise<CardIssueResult[]> {
  const results: CardIssueResult[] = [];
  for (const entry of entries) results.push(await recordCardIssue(actor, entry));
  return results;
}

/** What identifies a report: the entry as sent (issuedAt normalised to UTC) and who sent it. */
function entryHash(actor: Actor, entry: CardIssueEntry): string {
  return sha256Hex(
    canonicalJson({
      operatorId: actor.operatorId,
      issuedById: actor.userId,
      airframeId: entry.airframeId,
      revisionId: entry.revisionId,
      inputs: entry.inputs,
      digest: entry.digest,
      issuedAt: new Date(entry.issuedAt).toISOString(),
    }),
  );
}

const recorded = (row: CardIssue): CardIssueResult => ({
  id: row.id,
  outcome: 'recorded',
  status: 201,
  code: row.code,
  digest: row.digest,
  receivedAt: row.receivedAt.toISOString(),
});

function conflict(id: string): CardIssueResult {
  return {
    id,
    outcome: 'conflict',
    status: 409,
    error: { code: 'entry_id_taken', message: 'A different card log entry was already reported with this id; give each issued card its own id.' },
  };
}

function answerForExisting(row: CardIssue, hash: string, actor: Actor): CardIssueResult {
  return row.operatorId === actor.operatorId && row.entrySha256 === hash ? recorded(row) : conflict(row.id);
}

/** Reads on the primary (a transaction), so a row another request just wrote is seen. */
const findOnPrimary = (id: string) => transact((transaction) => CardIssue.findByPk(id, { transaction }));

const DEADLOCK = 1213;
const isDeadlock = (error: unknown) => (error as { parent?: { errno?: number } })?.parent?.errno === DEADLOCK;

/**
 * Records one card log entry (re-derived, idempotent by its id) and answers as the batch
 * report does for it. The card code is drawn here on the first report and kept for every replay.
 */
export async function recordCardIssue(actor: Actor, entry: CardIssueEntry): Promise<CardIssueResult> {
  const hash = entryHash(actor, entry);
  const existing = await findOnPrimary(entry.id);
  if (existing?.operatorId === actor.operatorId) return answerForExisting(existing, hash, actor);

  // An id another operator holds is answered like a new one (the same refusal for a card that
  // does not re-derive), so the answer does not tell that the id exists elsewhere; only a valid
  // card under that id, which nobody but its holder knows, meets the conflict.
  const refusal = await rederive(actor, entry);
  if (refusal) return refusal.result;
  if (existing) return answerForExisting(existing, hash, actor);

  const receivedAt = new Date();
  let code = generateCardCode();
  for (let attempt = 1; ; attempt++) {
    try {
      const row = await transact(async (transaction) => {
        const created = await CardIssue.create(
          {
            id: entry.id,
            code,
            operatorId: actor.operatorId,
            issuedById: actor.userId,
            airframeId: entry.airframeId,
            revisionId: entry.revisionId,
            inputs: canonicalJson(entry.inputs),
            digest: entry.digest,
            entrySha256: hash,
            issuedAt: new Date(entry.issuedAt),
            receivedAt,
          },
          { transaction },
        );
        await recordAudit(
          {
            operatorId: actor.operatorId,
            actorId: actor.userId,
            action: 'card.issued',
            entityType: 'card-issue',
            entityId: entry.id,
            details: { code, airframeId: entry.airframeId, revisionId: entry.revisionId, digest: entry.digest, issuedAt: created.issuedAt.toISOString() },
            origin: actor.origin,
          },
          transaction,
        );
        return created;
      });
      return recorded(row);
    } catch (error) {
      if (error instanceof UniqueConstraintError) {
        const winner = await findOnPrimary(entry.id);
        if (winner) return answerForExisting(winner, hash, actor);
        // Not the id: the code was drawn before (about one in 10¹⁰ per card); draw again.
        if (attempt < 5) {
          code = generateCardCode();
          continue;
        }
      }
      if (isDeadlock(error) && attempt < 3) continue;
      throw error;
    }
  }
}

/**
 * Records a card the server itself issues (the engineers' batch PDF) or a device reported, and
 * gives its card code; the same code for every call with the same entry. Anything but
 * `recorded` throws the entry's error as a DomainError (409 for another entry under this id,
 * 404 or 422 when the card cannot be re-derived to the digest).
 */
/** The domain error of a refused or conflicting entry, by the status the batch answer gives it. */
const KIND_OF_STATUS = { 404: 'not-found', 409: 'conflict', 422: 'refused' } as const;

/** An entry the log did not record, as `issueCardCode` throws it: the batch answer's result, status included. */
export class CardIssueRefusedError extends DomainError {
  constructor(
    /** The entry's status in a batch answer (`CardIssueResult.status`). */
    readonly status: keyof typeof KIND_OF_STATUS,
    error: { code: string; message: string; fields?: Record<string, string> },
  ) {
    super(KIND_OF_STATUS[status], error.code, error.message, error.fields);
  }
}

export async function issueCardCode(actor: Actor, entry: CardIssueEntry): Promise<string> {
  const result = await recordCardIssue(actor, { ...entry, id: entry.id.toLowerCase() });
  if (result.outcome === 'recorded') return result.code;
  throw new CardIssueRefusedError(result.status, result.error);
}

/** The refusal of an entry whose card cannot be re-derived to the reported digest; undefined when it can. */
async function rederive(actor: Actor, entry: CardIssueEntry): Promise<{ result: CardIssueResult } | undefined> {
  const refused = (status: 404 | 422, error: Extract<CardIssueResult, { outcome: 'refused' | 'conflict' }>['error']) => ({
    result: { id: entry.id, outcome: 'refused' as const, status, error },
  });
  let source;
  try {
    source = await loadCardSource(actor, entry.revisionId, entry.airframeId, 'issue');
  } catch (error) {
    if (!(error instanceof DomainError)) throw error;
    const status = error.kind === 'not-found' ? 404 : 422;
    return refused(status, { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) });
  }
  let digest: string;
  try {
    digest = buildCard(source.revision, entry.inputs as CardInputs, source.context).digest;
  } catch (error) {
    if (!(error instanceof CardRefusedError)) throw error;
    const field = error.field === 'revision' ? 'revisionId' : `inputs.${error.field}`;
    return refused(422, { code: 'card_refused', message: error.message, fields: { [field]: error.message }, refusal: { code: error.code, field: error.field } });
  }
  if (digest !== entry.digest) {
    return refused(422, {
      code: 'digest_mismatch',
      message: 'The card re-derived from these inputs and the revision differs from the card reported; it was not recorded.',
      fields: { digest: `The re-derived card's digest is ${digest}.` },
    });
  }
  return undefined;
}

// ---------------------------------------------------------------------------------------------
// Reading the log

export interface LogReader {
  operatorId: number;
  userId: number;
  role: Actor['role'];
}

/** Readers with `read-card-log` see the operator's whole log; pilots see the cards they issued. */
function visibleTo(reader: LogReader): WhereOptions<CardIssue> {
  return can(reader.role, 'read-card-log') ? { operatorId: reader.operatorId } : { operatorId: reader.operatorId, issuedById: reader.userId };
}

const INCLUDE = [
  { model: Airframe, as: 'airframe', attributes: ['id', 'registration'] },
  { model: Revision, as: 'revision', attributes: ['id', 'number', 'speedBookId'] },
  { model: User, as: 'issuedBy', attributes: ['id', 'displayName'] },
];

type LoadedIssue = CardIssue & { airframe?: Airframe; revision?: Revision; issuedBy?: User };

function view(row: LoadedIssue): CardIssueView {
  return {
    id: row.id,
    code: row.code,
    airframe: { id: row.airframeId, registration: row.airframe?.registration ?? '' },
    revision: { id: row.revisionId, number: row.revision?.number ?? 0, speedBookId: row.revision?.speedBookId ?? 0 },
    issuedBy: { id: row.issuedById, name: row.issuedBy?.displayName ?? '' },
    inputs: JSON.parse(row.inputs) as Record<string, unknown>,
    digest: row.digest,
    issuedAt: row.issuedAt.toISOString(),
    receivedAt: row.receivedAt.toISOString(),
  };
}

/** The cursor after `row`: its issue time in ms, then its id (the list's order). */
const cursorOf = (row: CardIssue) => `${String(row.issuedAt.getTime()).padStart(13, '0')}~${row.id}`;

/** One page of the log, newest issue first; `nextCursor` continues with earlier cards. */
export async function listCardIssues(reader: LogReader, query: CardIssueQuery): Promise<{ entries: CardIssueView[]; nextCursor: string | null }> {
  const and: WhereOptions<CardIssue>[] = [visibleTo(reader)];
  if (query.airframeId) and.push({ airframeId: Number(query.airframeId) });
  if (query.revisionId) and.push({ revisionId: Number(query.revisionId) });
  if (query.from) and.push({ issuedAt: { [Op.gte]: new Date(query.from) } });
  if (query.to) and.push({ issuedAt: { [Op.lte]: new Date(query.to) } });
  if (query.cursor) {
    const [ms, id] = query.cursor.split('~');
    const at = new Date(Number(ms));
    and.push({ [Op.or]: [{ issuedAt: { [Op.lt]: at } }, { issuedAt: at, id: { [Op.lt]: id } }] });
  }
  const rows = (await CardIssue.findAll({
    where: { [Op.and]: and },
    include: INCLUDE,
    order: [
      ['issuedAt', 'DESC'],
      ['id', 'DESC'],
    ],
    limit: query.limit + 1,
  })) as LoadedIssue[];
  const page = rows.slice(0, query.limit);
  return { entries: page.map(view), nextCursor: rows.length > query.limit ? cursorOf(page[page.length - 1]) : null };
}

/** One entry of the log; 404 when it is another operator's, or another pilot's for a pilot. */
export async function getCardIssue(reader: LogReader, id: string): Promise<CardIssueView> {
  const row = (await CardIssue.findOne({ where: { [Op.and]: [visibleTo(reader), { id }] }, include: INCLUDE })) as LoadedIssue | null;
  if (!row) throw notFound('That card log entry');
  return view(row);
}
