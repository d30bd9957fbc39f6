import { DomainError } from '../errors/domain-error';

/**
 * The sync cursor: `base64url("v1." + change number)`, opaque to devices.
 *
 * Why a change counter and not `updated_at`: the columns are DATETIME with whole seconds, so
 * a high-water mark of `updated_at` cannot tell two writes in one second apart. With `>` a
 * row written later in the same second as the cursor is lost; with `>=` every row of that
 * second comes back on every call, so "nothing changed" never answers empty; an id tie-break
 * still loses a row that is written twice in one second (published, then withdrawn). Instead
 * every insert or update of aircraft_types, airframes and revisions takes the next value of
 * one database sequence (triggers of migration 20261202-0601), stored as `change_seq`. A
 * sync answers the rows with `change_seq` above the cursor, and the new cursor is the largest
 * number it answered, so a row changed after the answer always has a larger number.
 *
 * Known limit: the number is taken at write time, not at commit; a transaction that commits
 * after a later one that a sync already saw could be skipped. Every write here is a short
 * transaction, and a full sync (no cursor) always repairs a device.
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
