/**
 * The device session: the person the server last confirmed, kept so the app opens offline
 * after a reload, and what signing out removes from the device.
 */
import type { SessionUser } from '@shared/api/auth';
import type { CachedSessionRecord, SpeedwrightDeviceDatabase } from '../storage/device-database';

/** Keeps the person the server just confirmed, so the app opens offline after a reload. */
export async function rememberSession(db: SpeedwrightDeviceDatabase, user: SessionUser, now = new Date(), sessionExpiresAt?: string): Promise<void> {
  await db.sessions.put({ userId: user.id, operatorId: user.operatorId, user, confirmedAt: now.toISOString(), ...(sessionExpiresAt ? { sessionExpiresAt } : {}) });
}

/** Forgets one person's cached session (the server said they are not signed in). */
export async function forgetSession(db: SpeedwrightDeviceDatabase, userId: number): Promise<void> {
  await db.sessions.delete(userId);
}

/** Forgets every cached session (the server said nobody is signed in on this browser). */
export async function forgetAllSessions(db: SpeedwrightDeviceDatabase): Promise<void> {
  await db.sessions.clear();
}

/**
 * The person to open the app as when the server cannot be reached: the most recently confirmed
 * cached session whose operator's data is on this device (a completed sync). Null otherwise.
 *
 * A session past its absolute end (`sessionExpiresAt`, 12 hours after sign-in) still opens
 * offline, so the cards on the device keep working within the currency limit; the first answer
 * of the server then is a 401, which forgets it and asks for the password (`offlineSessionEnded`
 * lets the app say so meanwhile).
 */
export async function cachedSessionForOffline(db: SpeedwrightDeviceDatabase): Promise<SessionUser | null> {
  const sessions = (await db.sessions.toArray()).sort((a, b) => b.confirmedAt.localeCompare(a.confirmedAt));
  for (const session of sessions) {
    const state = await db.syncState.get(session.operatorId);
    if (state?.lastSyncedAt) return session.user;
  }
  return null;
}

/** Whether the cached sign-in's absolute lifetime has run out (sign in again when next online). */
export function offlineSessionEnded(record: Pick<CachedSessionRecord, 'sessionExpiresAt'> | undefined, now = new Date()): boolean {
  return record?.sessionExpiresAt !== undefined && Date.parse(record.sessionExpiresAt) <= now.getTime();
}

/**
 * Removes `operatorId`'s data from the device: its types, airframes, revisions, operator record,
 * sync state, cached sessions and card log (entries of that operator, and entries from before
 * version 2 of the store issued by one of `issuerIds` or by a person cached for that operator).
 */
export async function removeOperatorData(db: SpeedwrightDeviceDatabase, operatorId: number, issuerIds: readonly number[] = []): Promise<void> {
  await db.transaction('rw', [db.operators, db.aircraftTypes, db.airframes, db.revisions, db.signingKeys, db.syncState, db.sessions, db.cardLog], async () => {
    const people = new Set([...issuerIds, ...(await db.sessions.where('operatorId').equals(operatorId).primaryKeys())]);
    await db.aircraftTypes.where('operatorId').equals(operatorId).delete();
    await db.airframes.where('operatorId').equals(operatorId).delete();
    await db.revisions.where('operatorId').equals(operatorId).delete();
    await db.signingKeys.where('operatorId').equals(operatorId).delete();
    await db.operators.delete(operatorId);
    await db.syncState.delete(operatorId);
    await db.sessions.where('operatorId').equals(operatorId).delete();
    await db.cardLog.filter((entry) => entry.operatorId === operatorId || (entry.operatorId === undefined && people.has(entry.issuedById))).delete();
  });
}
