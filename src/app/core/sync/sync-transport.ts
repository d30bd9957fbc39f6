/**
 * The device's two HTTP calls of a sync, whose sync it is, and the one failure a sync throws.
 * The app's transport uses ApiClient (sync-service.ts); Node tests use
 * test/api/device-sync-transport.ts (a supertest agent). A transport throws an error with a
 * numeric `status` (0: no answer) and a `message` sentence when a call fails.
 */
import type { SyncResponse } from '@shared/api/sync';
import type { CardIssueEntry, CardIssueResult } from '@shared/card/card-api';
import type { OutboxOutcome } from './sync-outbox';

export interface SyncTransport {
  /** `GET /api/sync?cursor=` (no cursor: everything). */
  fetchChanges(cursor: string | null): Promise<SyncResponse>;
  /** `POST /api/card-issues` with at most `MAX_CARD_ISSUES_PER_BATCH` entries; the server's results. */
  sendCardIssues(entries: CardIssueEntry[]): Promise<CardIssueResult[]>;
}

/** Whose sync it is: the signed-in person and their operator. */
export interface SyncPerson {
  readonly userId: number;
  readonly operatorId: number;
}

/** A sync that did not complete, with the sentence to show and the HTTP status (0: no answer). */
export class SyncFailure extends Error {
  constructor(
    message: string,
    readonly status: number,
    /** What the outbox step did before the failure (nothing when it failed itself). */
    readonly outbox: OutboxOutcome | null,
  ) {
    super(message);
    this.name = 'SyncFailure';
  }
}

/** The status and sentence of whatever a transport threw. */
export function describeFailure(error: unknown): { status: number; message: string } {
  if (error && typeof error === 'object') {
    const { status, message } = error as { status?: unknown; message?: unknown };
    if (typeof status === 'number' && typeof message === 'string' && message) return { status, message };
    if (typeof message === 'string' && message) return { status: 0, message };
  }
  return { status: 0, message: "Speedwright cannot reach the server. Check the device's connection and try again." };
}
