/**
 * The public card check: what a card code says to anyone holding the card. One indexed query
 * per answer (the unique `card_issues.code`), a prepared statement, no session and no model
 * instances on the path, so it stays fast under load. It gives only what the card itself prints (see
 * shared/card-check/verify-api.ts for what is public and why).
 */
import type { VerifyResponse, VerifySource } from '@shared/card-check/verify-api';
import type { RevisionStatus } from '@shared/api/revisions';
import type { ReadPool } from './read-pool';

const STATUS: Partial<Record<RevisionStatus, 'current' | 'superseded' | 'withdrawn'>> = {
  published: 'current',
  superseded: 'superseded',
  withdrawn: 'withdrawn',
};

interface VerifyRow {
  issued_at: string;
  number: number;
  published_at: string | null;
  status: RevisionStatus;
  registration: string;
}

/**
 * A DATETIME column as ISO 8601 UTC with milliseconds, formatted by the database: the columns
 * hold UTC (server/database.ts), and text skips a Date round trip on a route that must be fast.
 */
const isoOf = (column: string) => `CONCAT(DATE_FORMAT(${column}, '%Y-%m-%dT%H:%i:%s.'), LPAD(FLOOR(MICROSECOND(${column}) / 1000), 3, '0'), 'Z')`;

export const VERIFY_SQL = `
  SELECT ${isoOf('ci.issued_at')} AS issued_at, r.number, ${isoOf('r.published_at')} AS published_at, r.status, a.registration
  FROM card_issues ci
  JOIN revisions r ON r.id = ci.revision_id AND r.operator_id = ci.operator_id
  JOIN airframes a ON a.id = ci.airframe_id AND a.operator_id = ci.operator_id
  WHERE ci.code = ?
  LIMIT 1`;

/** The status of the card with `code` (a valid stored-form code). */
export async function verifyCardCode(reads: ReadPool, code: string): Promise<VerifyResponse> {
  const row = await reads.firstRow<VerifyRow>( VERIFY_SQL, [code]);
  const status = row && STATUS[row.status];
  // A card is only ever logged from a published revision; anything else is not a card we vouch for.
  if (!row || !status || !row.published_at) return { status: 'unknown' };
  return {
    status,
    revision: { number: row.number, publishedAt: row.published_at },
    registration: row.registration,
    issuedAt: row.issued_at,
  };
}

interface SourceRow {
  digest: string;
  revision_id: number;
  number: number;
  published_at: Date | null;
  content_sha256: string | null;
  content: string;
  status: RevisionStatus;
  airframe_id: number;
  registration: string;
  designator: string;
  type_name: string;
  speed_book_id: number;
  title: string;
  is_demo: number | boolean;
  operator_id: number;
  signature: string | null;
  signing_key_id: number | null;
  public_key: string | null;
  key_retired_at: Date | null;
}

const SOURCE_SQL = `
  SELECT ci.digest, r.id AS revision_id, r.number, r.published_at, r.content_sha256, r.content, r.status,
         a.id AS airframe_id, a.registration, t.designator, t.name AS type_name,
         b.id AS speed_book_id, b.title, o.is_demo,
         ci.operator_id, r.signature, r.signing_key_id, k.public_key, k.retired_at AS key_retired_at
  FROM card_issues ci
  JOIN revisions r ON r.id = ci.revision_id AND r.operator_id = ci.operator_id
  JOIN airframes a ON a.id = ci.airframe_id AND a.operator_id = ci.operator_id
  JOIN speed_books b ON b.id = r.speed_book_id AND b.operator_id = ci.operator_id
  JOIN aircraft_types t ON t.id = b.aircraft_type_id AND t.operator_id = ci.operator_id
  JOIN operators o ON o.id = ci.operator_id
  LEFT JOIN signing_keys k ON k.id = r.signing_key_id AND k.operator_id = ci.operator_id
  WHERE ci.code = ?
  LIMIT 1`;

/** What the card with `code` was built from; undefined for an unknown code (or a revision without its signature, which no card rests on). */
export async function cardSourceOf(reads: ReadPool, code: string): Promise<VerifySource | undefined> {
  const row = await reads.firstRow<SourceRow>( SOURCE_SQL, [code]);
  if (!row || !STATUS[row.status] || !row.published_at || !row.content_sha256 || !row.signature || row.signing_key_id === null || !row.public_key) return undefined;
  return {
    digest: row.digest,
    revision: {
      id: row.revision_id,
      number: row.number,
      publishedAt: row.published_at.toISOString(),
      contentSha256: row.content_sha256,
      content: JSON.parse(row.content) as unknown,
    },
    context: {
      airframe: { id: row.airframe_id, registration: row.registration },
      aircraftType: { designator: row.designator, name: row.type_name },
      speedBook: { id: row.speed_book_id, title: row.title },
      demo: Boolean(row.is_demo),
    },
    signature: {
      algorithm: 'Ed25519',
      operatorId: row.operator_id,
      keyId: row.signing_key_id,
      publicKey: row.public_key,
      keyRetiredAt: row.key_retired_at ? new Date(row.key_retired_at).toISOString() : null,
      value: row.signature,
    },
  };
}
