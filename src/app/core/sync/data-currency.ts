/**
 * Whether the device's data may carry cards (the operator's currency limit), which of the
 * person's cards rest on a revision since superseded or withdrawn, and the back-off between
 * failed syncs.
 */
import type { CardLogRecord, RevisionRecord, SpeedwrightDeviceDatabase, SyncStateRecord } from '../storage/device-database';
import { utcMinutes } from '../format/display-format';

export const DAY_MS = 24 * 60 * 60 * 1000;

export interface DataCurrency {
  /** ISO 8601 UTC of the last successful sync; null when the device has none. */
  readonly asOf: string | null;
  /** Whole days since then (rounded down). */
  readonly ageDays: number | null;
  readonly limitDays: number | null;
  /** Whether cards may be built from the device's data. */
  readonly current: boolean;
  /** Why not, in a sentence; null when current. */
  readonly refusal: string | null;
}

/**
 * Whether the device's data is young enough for cards: the last successful sync must be at
 * most the operator's currency limit (days) old.
 */
export function dataCurrency(state: SyncStateRecord | undefined | null, limitDays: number | null | undefined, now: Date): DataCurrency {
  const asOf = state?.lastSyncedAt ?? null;
  if (asOf === null || limitDays === null || limitDays === undefined) {
    return { asOf, ageDays: null, limitDays: limitDays ?? null, current: false, refusal: 'This device holds no synced data of your operator yet. Sync once with a network connection to prepare cards.' };
  }
  const ageMs = now.getTime() - new Date(asOf).getTime();
  const ageDays = Math.max(0, Math.floor(ageMs / DAY_MS));
  if (ageMs > limitDays * DAY_MS) {
    const age = ageDays === 1 ? '1 day' : `${ageDays} days`;
    const limit = limitDays === 1 ? '1 day' : `${limitDays} days`;
    return {
      asOf,
      ageDays,
      limitDays,
      current: false,
      refusal: `No card can be prepared: the data on this device is from ${utcMinutes(asOf)}, ${age} old, and your operator allows cards from data at most ${limit} old. Sync with a network connection to prepare cards again.`,
    };
  }
  return { asOf, ageDays, limitDays, current: true, refusal: null };
}

export interface RevisionNotice {
  readonly entry: CardLogRecord;
  readonly revision: RevisionRecord;
  readonly status: 'superseded' | 'withdrawn';
  /** ISO 8601 UTC when it was superseded or withdrawn. */
  readonly since: string | null;
  /** The book's published revision now on the device, if any. */
  readonly current: RevisionRecord | null;
  readonly sentence: string;
}

/** `issuedById`'s cards on this device that rest on a revision now superseded or withdrawn, newest first. */
export async function revisionNotices(db: SpeedwrightDeviceDatabase, operatorId: number, issuedById: number): Promise<RevisionNotice[]> {
  const entries = await db.cardLog.where('issuedById').equals(issuedById).toArray();
  const revisions = await db.revisions.where('operatorId').equals(operatorId).toArray();
  const byId = new Map(revisions.map((revision) => [revision.id, revision]));
  const notices: RevisionNotice[] = [];
  for (const entry of entries.sort((a, b) => b.issuedAt.localeCompare(a.issuedAt))) {
    const revision = byId.get(entry.revisionId);
    if (!revision || revision.status === 'published') continue;
    const status = revision.status;
    const current = revisions.find((other) => other.speedBookId === revision.speedBookId && other.status === 'published') ?? null;
    const since = status === 'superseded' ? revision.supersededAt : revision.withdrawnAt;
    const when = since ? ` on ${utcMinutes(since)}` : '';
    const sentence =
      status === 'superseded'
        ? `Your card for ${entry.registration} (issued ${utcMinutes(entry.issuedAt)}) rests on revision ${revision.number} of ${revision.speedBookTitle}, superseded${when}${current ? ` by revision ${current.number}` : ''}. Prepare a new card before you use its figures.`
        : `Your card for ${entry.registration} (issued ${utcMinutes(entry.issuedAt)}) rests on revision ${revision.number} of ${revision.speedBookTitle}, withdrawn${when}. Do not use its figures${current ? `; prepare a new card from revision ${current.number}` : ''}.`;
    notices.push({ entry, revision, status, since, current, sentence });
  }
  return notices;
}

/** The delay before the `failures`-th retry: 15 s doubling to at most 15 min. */
export function nextRetryDelayMs(failures: number, baseMs = 15_000, maxMs = 15 * 60_000): number {
  if (failures <= 0) return 0;
  return Math.min(maxMs, baseMs * 2 ** Math.min(failures - 1, 30));
}
