/**
 * The device's side of sync, free of Angular so a Node test drives it with fake-indexeddb
 * against the real server. The Angular `SyncService` (sync-service.ts) only schedules these.
 *
 * Entry points:
 * - `runSync(db, transport, who, options)`: one whole sync — send the person's waiting card-log
 *   entries (`flushOutbox`), then fetch what changed since the stored cursor and apply it
 *   (`applySync`). Throws `SyncFailure` when the server cannot be reached or refuses; the
 *   outbox and the stored data are then as they were (entries the server answered for are
 *   marked, the rest wait).
 * - `flushOutbox(db, transport, who)`: sends `who`'s waiting entries in batches of
 *   `MAX_CARD_ISSUES_PER_BATCH`; marks each from the server's answer (recorded → `sentAt`,
 *   refused or conflict → `refusal` with the server's sentence) and keeps every entry the
 *   server did not answer for. A failed request leaves the outbox as it was. Idempotent by
 *   entry id on the server, so sending again after a lost answer doubles nothing.
 * - `applySync(db, operatorId, response, options)`: verifies each revision
 *   (revision-verification.ts), stores the operator, types, airframes and verified revisions
 *   in one transaction and moves the cursor; a refused revision is not stored, is reported in
 *   `refused`, and holds the cursor so the next sync asks for it again.
 * - `removeOperatorData(db, operatorId, issuerIds)`: what signing out does to the device.
 * - `dataCurrency`, `revisionNotices`, `waitingEntries`, `rememberSession`,
 *   `cachedSessionForOffline`, `nextRetryDelayMs`: the reads and small rules around them.
 *
 * This file is the barrel: sync-transport.ts (the two calls, `SyncFailure`), sync-outbox.ts,
 * sync-apply.ts (`applySync`, `runSync`), data-currency.ts (currency, notices, back-off) and
 * device-session.ts (cached session, sign-out); importers may keep using this barrel.
 */
export * from './sync-transport';
export * from './sync-outbox';
export * from './sync-apply';
export * from './data-currency';
export * from './device-session';
/** Kept here for importers of the old name; the formatter lives in core/format. */
export { utcMinutes } from '../format/display-format';
