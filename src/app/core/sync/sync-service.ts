import { DOCUMENT } from '@angular/common';
import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { EMPTY, Subject, delay, distinctUntilChanged, filter, firstValueFrom, fromEvent, interval, map, merge, of, share, switchMap } from 'rxjs';
import type { SessionUser } from '@shared/api/auth';
import { syncResponseSchema } from '@shared/api/sync';
import { cardIssueBatchResponseSchema } from '@shared/card/card-api';
import { ApiClient } from '../api/api-client';
import { ApiRequestError } from '../api/api-request-error';
import { AuthService } from '../auth/auth-service';
import { DeviceStore } from '../storage/device-store';
import type { AircraftTypeRecord, AirframeRecord, OperatorRecord, RevisionRecord, SyncStateRecord } from '../storage/device-database';
import {
  SyncFailure,
  dataCurrency,
  flushOutbox,
  removeOperatorData,
  revisionNotices,
  runSync,
  type DataCurrency,
  type OutboxOutcome,
  type RevisionNotice,
  type SyncResult,
  type SyncTransport,
} from './device-sync';
import { syncLoop } from './sync-loop';

export const SYNC_PATH = '/api/sync';
export const CARD_ISSUES_PATH = '/api/card-issues';
/** How long after the browser's "online" event the sync starts. */
export const ONLINE_SETTLE_MS = 1500;
/** A sync every five minutes while signed in (and the page is open). */
export const SYNC_INTERVAL_MS = 5 * 60_000;

/** What the device holds for the signed-in person's operator. */
export interface DeviceSnapshot {
  readonly operator: OperatorRecord | null;
  readonly state: SyncStateRecord | null;
  readonly aircraftTypes: readonly AircraftTypeRecord[];
  readonly airframes: readonly AirframeRecord[];
  readonly revisions: readonly RevisionRecord[];
}

export type SyncPhase = 'idle' | 'syncing' | 'succeeded' | 'failed';

export interface SyncStatus {
  readonly phase: SyncPhase;
  /** The sentence of the last failure; null otherwise. */
  readonly problem: string | null;
  /** ISO 8601 of the next automatic retry after a failure. */
  readonly retryAt: string | null;
  /** A sentence about the last successful sync (what was sent and stored). */
  readonly summary: string | null;
}

/** The two calls of a sync through the app's ApiClient (CSRF, timeouts, error sentences). */
export function apiSyncTransport(api: ApiClient): SyncTransport {
  return {
    fetchChanges: (cursor) => firstValueFrom(api.get(cursor ? `${SYNC_PATH}?cursor=${encodeURIComponent(cursor)}` : SYNC_PATH, syncResponseSchema)),
    sendCardIssues: async (entries) => (await firstValueFrom(api.post(CARD_ISSUES_PATH, { entries }, cardIssueBatchResponseSchema))).results,
  };
}

function summaryOf(result: SyncResult): string {
  const parts: string[] = [];
  if (result.outbox.recorded) parts.push(`${result.outbox.recorded} ${result.outbox.recorded === 1 ? 'card' : 'cards'} sent to the card log`);
  const changes = result.applied.revisionsStored + result.applied.airframesStored + result.applied.typesStored;
  parts.push(changes === 0 ? 'nothing new' : `${changes} ${changes === 1 ? 'record' : 'records'} updated`);
  return `Synced: ${parts.join(', ')}.`;
}

/**
 * Keeps the device's data of the signed-in person's operator current: a sync at sign-in (and
 * page load), on coming online, every `SYNC_INTERVAL_MS` and on `syncNow()`, with exponential
 * back-off after a failure (sync-loop.ts). The work itself is device-sync.ts.
 */
@Injectable({ providedIn: 'root' })
export class SyncService {
  private readonly api = inject(ApiClient);
  private readonly auth = inject(AuthService);
  private readonly store = inject(DeviceStore);
  private readonly window = inject(DOCUMENT).defaultView;
  private readonly destroyRef = inject(DestroyRef);
  private readonly transport = apiSyncTransport(this.api);
  private readonly manual = new Subject<void>();
  private readonly currentStatus = signal<SyncStatus>({ phase: 'idle', problem: null, retryAt: null, summary: null });
  private readonly currentSnapshot = signal<DeviceSnapshot | null>(null);
  private readonly currentNotices = signal<readonly RevisionNotice[]>([]);
  private readonly clock = signal(new Date());
  private readonly readCount = signal(0);

  readonly status = this.currentStatus.asReadonly();
  /** The device's data for the signed-in person's operator; null until read (or signed out). */
  readonly snapshot = this.currentSnapshot.asReadonly();
  /** Counts each re-read of the device store (after every sync attempt): lists of device data follow it. */
  readonly dataVersion = this.readCount.asReadonly();
  /** The person's cards that rest on a superseded or withdrawn revision. */
  readonly notices = this.currentNotices.asReadonly();
  /** Whether cards may be built from the device's data now, and why not. */
  readonly currency = computed<DataCurrency | null>(() => {
    const snapshot = this.currentSnapshot();
    if (!snapshot) return null;
    return dataCurrency(snapshot.state, snapshot.operator?.currencyLimitDays, this.clock());
  });

  constructor() {
    this.start();
  }

  /** Sync now (the button); a sync already running is not doubled. */
  syncNow(): void {
    this.manual.next();
  }

  /** Re-reads the device's data for the signed-in person (after a card was issued, say). */
  async reload(): Promise<void> {
    await this.read(this.auth.user());
  }

  /** Sends the signed-in person's waiting cards now, without the rest of a sync. */
  async sendOutbox(): Promise<OutboxOutcome> {
    const user = this.auth.user();
    if (!user) return { recorded: 0, waiting: 0, refused: 0, problem: null, failed: false, failureStatus: null, failureMessage: null };
    try {
      return await flushOutbox(this.store.db, this.transport, { userId: user.id, operatorId: user.operatorId });
    } catch {
      return { recorded: 0, waiting: 0, refused: 0, problem: 'This device could not read its card log. Check the browser allows site storage.', failed: true, failureStatus: 0, failureMessage: null };
    } finally {
      await this.read(user);
    }
  }

  /** Every waiting entry of `operatorId` on this device (anyone's): what signing out would discard. */
  async waitingOfOperator(user: SessionUser): Promise<number> {
    try {
      const entries = await this.store.db.cardLog.toArray();
      return entries.filter((entry) => entry.sentAt === null && entry.refusal === null && (entry.operatorId === user.operatorId || (entry.operatorId === undefined && entry.issuedById === user.id))).length;
    } catch {
      return 0;
    }
  }

  /** Signing out: the operator's data leaves the device. */
  async removeOperatorData(user: SessionUser): Promise<void> {
    try {
      await removeOperatorData(this.store.db, user.operatorId, [user.id]);
    } finally {
      this.currentSnapshot.set(null);
      this.currentNotices.set([]);
      this.currentStatus.set({ phase: 'idle', problem: null, retryAt: null, summary: null });
    }
  }

  private start(): void {
    interval(60_000)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.clock.set(new Date()));
    const cameOnline = this.window ? fromEvent(this.window, 'online').pipe(map(() => undefined), share()) : EMPTY;
    // The browser says "online" a moment before requests get through (the service worker and
    // the network stack catch up), so the sync waits a little after the event.
    const online = cameOnline.pipe(delay(ONLINE_SETTLE_MS));
    toObservable(this.auth.user)
      .pipe(
        distinctUntilChanged((a, b) => a?.id === b?.id && a?.operatorId === b?.operatorId),
        switchMap((user) => {
          void this.read(user);
          if (!user) return EMPTY;
          const triggers = merge(of(undefined), online, interval(SYNC_INTERVAL_MS), this.manual);
          return syncLoop(triggers, () => this.attempt(user), { resetBackoff: cameOnline });
        }),
        filter(() => this.auth.user() !== null),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((event) => {
        if (event.kind === 'started') {
          this.currentStatus.update((status) => ({ ...status, phase: 'syncing' }));
        } else if (event.kind === 'succeeded') {
          this.currentStatus.set({ phase: 'succeeded', problem: null, retryAt: null, summary: summaryOf(event.result) });
          this.auth.confirmedByServer();
        } else {
          const message = event.error instanceof SyncFailure || event.error instanceof ApiRequestError ? event.error.message : 'The sync did not complete.';
          this.currentStatus.set({ phase: 'failed', problem: message, retryAt: new Date(Date.now() + event.retryInMs).toISOString(), summary: null });
        }
      });
  }

  private async attempt(user: SessionUser): Promise<SyncResult> {
    this.clock.set(new Date());
    try {
      return await runSync(this.store.db, this.transport, { userId: user.id, operatorId: user.operatorId });
    } finally {
      this.clock.set(new Date());
      await this.read(user);
    }
  }

  private async read(user: SessionUser | null): Promise<void> {
    if (!user) {
      this.currentSnapshot.set(null);
      this.currentNotices.set([]);
      return;
    }
    const db = this.store.db;
    try {
      const [operator, state, aircraftTypes, airframes, revisions, notices] = await Promise.all([
        db.operators.get(user.operatorId),
        db.syncState.get(user.operatorId),
        db.aircraftTypes.where('operatorId').equals(user.operatorId).toArray(),
        db.airframes.where('operatorId').equals(user.operatorId).toArray(),
        db.revisions.where('operatorId').equals(user.operatorId).toArray(),
        revisionNotices(db, user.operatorId, user.id),
      ]);
      if (this.auth.user()?.id !== user.id) return;
      this.currentSnapshot.set({ operator: operator ?? null, state: state ?? null, aircraftTypes, airframes, revisions });
      this.currentNotices.set(notices);
      this.readCount.update((n) => n + 1);
    } catch {
      this.currentSnapshot.set({ operator: null, state: null, aircraftTypes: [], airframes: [], revisions: [] });
      this.currentNotices.set([]);
    }
  }
}
