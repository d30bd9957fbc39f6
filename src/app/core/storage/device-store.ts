import { Injectable } from '@angular/core';
import Dexie, { type EntityTable } from 'dexie';

/**
 * One card issued on this device, as kept until (and after) the server has it. The first six
 * fields are exactly what `POST /api/card-issues` takes; the rest is for this device's list.
 */
export interface CardLogRecord {
  /** A random UUID, chosen on the device; the server is idempotent by it. */
  readonly id: string;
  readonly airframeId: number;
  readonly revisionId: number;
  /** `CardInputs`, canonical units. */
  readonly inputs: Record<string, unknown>;
  readonly digest: string;
  /** ISO 8601 UTC. */
  readonly issuedAt: string;
  /** When the server recorded it (ISO 8601 UTC); null while it waits on this device. */
  readonly sentAt: string | null;
  /** Who issued it: the server records the sender as the issuer, so only they may send it. */
  readonly issuedById: number;
  readonly registration: string;
  readonly revisionNumber: number;
  /** The server's sentence when it refused the entry (never retried as is). */
  readonly refusal: string | null;
}

/** Bumped with every change of the tables below; Dexie upgrades a device's store in place. */
const SCHEMA_VERSION = 1;

/**
 * The device's IndexedDB database `speedwright`: what Speedwright keeps on a tablet so it works
 * with no network. One table per kind of record; each later table (synced revisions, the
 * offline outbox) is added here with `this.version(n).stores({...})` and a higher version, so
 * every device upgrades the same way.
 */
export class SpeedwrightDeviceDatabase extends Dexie {
  /** Cards issued here, keyed by entry id; indexed by issue time for the newest-first list. */
  readonly cardLog!: EntityTable<CardLogRecord, 'id'>;

  constructor(name = 'speedwright') {
    super(name);
    this.version(SCHEMA_VERSION).stores({
      cardLog: 'id, issuedAt',
    });
  }
}

/** The device store, one per app; tests replace it with a fresh database of another name. */
@Injectable({ providedIn: 'root' })
export class DeviceStore {
  readonly db = new SpeedwrightDeviceDatabase();
}
