import { DomainError } from '../errors/domain-error';

/**
 * The sync cursor: `base64url("v1." + change number)`, opaque to devices.
 *
 * Why a change counter and not `updated_at`: the columns are DATETIME with whole seconds, so
 * a high-water mark of `updated_at` cannot tell two writes in one second apart. With `>` a
 * row written later in the same second as the cursor is lost; with `>=` every row of that
 * second comes back on every call, so "nothing changed" never answers empty; an id tie-break
 * still loses a row that is written twice in one second (published, then withdrawn). Instead
 * every insert or update of aircraft_types, airframes and revisions takes the next number of
 * its operator's row in `sync_counters` (triggers of migration 20261205-0903), stored as
 * `change_seq`. A sync answers the rows with `change_seq` above the cursor, and the new cursor is
 * the largest number it answered.
 *
 * Commit order: the counter row is bumped inside the writing transaction and stays locked until
 * it ends, so a second writer of the same operator waits; on a Galera cluster two nodes bumping it
 * at once conflict at certification and one retries (`transact`). Numbers are therefore
 * committed in the order they are given, and a reader that sees number n sees every smaller
 * one: no committed change is ever skipped, however long its transaction was (the earlier
 * sequence handed numbers out at write time and could). A device reading a node that has not
 * yet applied the latest changes only receives them on its next sync; it never loses them.
 */
const PREFIX = 'v1.';

export function encodeCursor(changeSeq: number): string {
  return Buffer.from(`${PREFIX}${changeSeq}`, 'utf8').toString('base64url');
}

/** The change number of `cursor` (0 without one); 400 with a field message when it is not ours. */
export function decodeCursor(cursor: string | undefined): number {
  if (cursor === undefined || cursor === '') return 0;
  const bad = () => new DomainError('invalid', 'invalid_request', 'Some fields of the request are not right.', { cursor: 'The cursor is not one this server gave out; sync again without one.' });
  if (!/^[A-Za-z0-9_-]+$/.test(cursor)) throw bad();
  const text = Buffer.from(cursor, 'base64url').toString('utf8');
  const match = /^v1\.(0|[1-9]\d{0,15})$/.exec(text);
  if (!match) throw bad();
  const value = Number(match[1]);
  if (!Number.isSafeInteger(value)) throw bad();
  return value;
}
