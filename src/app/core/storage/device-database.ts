/**
 * The device's IndexedDB database `speedwright` (Dexie): what Speedwright keeps on a tablet so
 * it works with no network. No Angular here, so Node tests (fake-indexeddb) open it too.
 *
 * Every synced record carries its `operatorId`, so signing out removes exactly that operator's
 * data (`removeOperatorData` in core/sync/device-sync.ts).
 */
import Dexie, { type EntityTable } from 'dexie';
import type { SessionUser } from '@shared/api/auth';
import type { AircraftTypeView, AirframeView } from '@shared/api/fleet';
import type { SyncRevision } from '@shared/api/sync';
import type { ApproachAdditivePolicy } from '@shared/card/approach-policy';

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
  /**
   * The issuer's operator. Entries written before version 2 of the store have none; they are
   * matched to an operator through `issuedById` and the cached sessions.
   */
  readonly operatorId?: number;
  readonly registration: string;
  readonly revisionNumber: number;
  /** The server's sentence when it refused the entry (never retried as is). */
  readonly refusal: string | null;
  /** The card code the server gave the entry when it recorded it (stored form); absent until then. */
  readonly code?: string;
}

/** The operator as the last sync described it: its public key verifies every stored revision. */
export interface OperatorRecord {
  readonly id: number;
  readonly name: string;
  readonly isDemo: boolean;
  /** Raw 32-byte Ed25519 public key, standard base64. */
  readonly publicKey: string;
  readonly signingKeyId: number;
  /** How old (days since the last successful sync) the device's data may be before cards are refused. */
  readonly currencyLimitDays: number;
  /**
   * The operator's approach additive policy as the last sync gave it; every card with a wind
   * carries it in its inputs. Null on a device upgraded from store version 2 or 3 until its next
   * sync (a card with a wind is refused until then: the additive is never guessed).
   */
  readonly approachAdditivePolicy: ApproachAdditivePolicy | null;
}

/**
 * One of an operator's public signing keys as the device learned it at a sync: the active one
 * and those a rotation retired. A revision is verified with the key its `signingKeyId` names.
 */
export interface SigningKeyRecord {
  /** The server's key id (what a revision's `signingKeyId` names). */
  readonly id: number;
  readonly operatorId: number;
  /** Raw 32-byte Ed25519 public key, standard base64. */
  readonly publicKey: string;
  /** ISO 8601 UTC; absent for a key carried over from a store older than version 3. */
  readonly createdAt?: string;
  /** When a rotation retired it (ISO 8601 UTC); null while it is the active key. */
  readonly retiredAt: string | null;
}

export type AircraftTypeRecord = AircraftTypeView & { readonly operatorId: number };
export type AirframeRecord = AirframeView & { readonly operatorId: number };

/** A published, superseded or withdrawn revision whose hash and signature this device checked. */
export type RevisionRecord = SyncRevision & {
  readonly operatorId: number;
  /** When this device verified the hash and signature (ISO 8601 UTC). */
  readonly verifiedAt: string;
};

/** A revision the device refused to store, with the sentence shown to the person. */
export interface RefusedRevision {
  readonly revisionId: number;
  readonly speedBookTitle: string;
  readonly number: number;
  readonly sentence: string;
}

/** Where the device stands with one operator's sync. */
export interface SyncStateRecord {
  readonly operatorId: number;
  /** The server's cursor of the last applied answer; null before the first sync. */
  readonly cursor: string | null;
  /** End of the last sync that completed (ISO 8601 UTC): the "data as of" time. */
  readonly lastSyncedAt: string | null;
  /** Start of the last attempt, successful or not. */
  readonly lastAttemptAt: string | null;
  /** The sentence of the last failed attempt; null after a success. */
  readonly lastProblem: string | null;
  /** Revisions refused by the last sync that brought any (kept until a later sync stores them). */
  readonly refused: readonly RefusedRevision[];
}

/** The signed-in person as the server last confirmed them, so the app opens offline after a reload. */
export interface CachedSessionRecord {
  readonly userId: number;
  readonly operatorId: number;
  readonly user: SessionUser;
  /** When the server last confirmed this session (ISO 8601 UTC). */
  readonly confirmedAt: string;
  /** When the sign-in ends whatever happens (12 hours after it; ISO 8601 UTC); absent before it was kept. */
  readonly sessionExpiresAt?: string;
}

/** A small setting of this device (key → JSON value). */
export interface PreferenceRecord {
  readonly key: string;
  readonly value: unknown;
}

/** Bumped with every change of the tables below; Dexie upgrades a device's store in place. */
export const DEVICE_SCHEMA_VERSION = 4;

export class SpeedwrightDeviceDatabase extends Dexie {
  /** Cards issued here, keyed by entry id; the outbox is the entries with `sentAt` null. */
  readonly cardLog!: EntityTable<CardLogRecord, 'id'>;
  readonly operators!: EntityTable<OperatorRecord, 'id'>;
  readonly aircraftTypes!: EntityTable<AircraftTypeRecord, 'id'>;
  readonly airframes!: EntityTable<AirframeRecord, 'id'>;
  readonly revisions!: EntityTable<RevisionRecord, 'id'>;
  readonly signingKeys!: EntityTable<SigningKeyRecord, 'id'>;
  readonly syncState!: EntityTable<SyncStateRecord, 'operatorId'>;
  readonly sessions!: EntityTable<CachedSessionRecord, 'userId'>;
  readonly preferences!: EntityTable<PreferenceRecord, 'key'>;

  constructor(name = 'speedwright') {
    super(name);
    this.version(1).stores({
      cardLog: 'id, issuedAt',
    });
    // Version 2 adds the synced data; the card log keeps every entry, indexed by issuer too.
    this.version(2).stores({
      cardLog: 'id, issuedAt, issuedById, operatorId',
      operators: 'id',
      aircraftTypes: 'id, operatorId',
      airframes: 'id, operatorId',
      revisions: 'id, operatorId, speedBookId, aircraftTypeId',
      syncState: 'operatorId',
      sessions: 'userId, operatorId',
      preferences: 'key',
    });
    // Version 3 keeps every public key of the operator (signing-key rotation); the one key a
    // version 2 store knew, the operator's, becomes its first row, so nothing is re-fetched.
    this.version(3)
      .stores({ signingKeys: 'id, operatorId' })
      .upgrade(async (tx) => {
        const operators = await tx.table<OperatorRecord, number>('operators').toArray();
        const carried: SigningKeyRecord[] = operators.map((operator) => ({ id: operator.signingKeyId, operatorId: operator.id, publicKey: operator.publicKey, retiredAt: null }));
        if (carried.length) await tx.table<SigningKeyRecord, number>('signingKeys').bulkPut(carried);
      });
    // Version 4 keeps the operator's approach additive policy (issue 16); the tables are as they
    // were. An operator stored before it has none until the next sync writes it.
    this.version(DEVICE_SCHEMA_VERSION)
      .stores({})
      .upgrade((transaction) =>
        transaction
          .table<OperatorRecord, number>('operators')
          .toCollection()
          .modify((operator) => {
            if (!('approachAdditivePolicy' in operator)) (operator as { approachAdditivePolicy: ApproachAdditivePolicy | null }).approachAdditivePolicy = null;
          }),
      );
  }
}
