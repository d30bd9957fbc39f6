import { Injectable, Injector, inject } from '@angular/core';
import type { CardContext, CardRevision } from '@shared/card/card';
import type { RevisionRecord, SpeedwrightDeviceDatabase } from '../core/storage/device-database';

/** What this device holds, from its last sync, about the revision a card names. */
export interface OfflineCheck {
  /** End of the last completed sync (ISO 8601 UTC); null if the device never synced. */
  readonly lastSyncedAt: string | null;
  /** The revision's number and its status as of that sync. */
  readonly revision: { readonly number: number; readonly publishedAt: string; readonly status: RevisionRecord['status'] };
  /** A later revision of the same speed book the device already knows (then the card is superseded). */
  readonly newer: { readonly number: number; readonly publishedAt: string; readonly status: RevisionRecord['status'] } | null;
  /** What `buildCard` needs, or null when the device lacks the airframe or its type. */
  readonly source: { readonly revision: CardRevision; readonly context: CardContext } | null;
}

/** Reads the device store (synced by core/sync) for the offline card check. */
export interface OfflineCheckReader {
  /** Null when the device holds no revision `revisionId` of `operatorId`. */
  read(operatorId: number, revisionId: number, airframeId: number): Promise<OfflineCheck | null>;
}

/** The offline card check against the device's IndexedDB store. */
export async function readOfflineCheck(db: SpeedwrightDeviceDatabase, operatorId: number, revisionId: number, airframeId: number): Promise<OfflineCheck | null> {
  const revision = await db.revisions.get(revisionId);
  if (!revision || revision.operatorId !== operatorId) return null;
  const [state, operator, airframe, later] = await Promise.all([
    db.syncState.get(operatorId),
    db.operators.get(operatorId),
    db.airframes.get(airframeId),
    db.revisions.where('speedBookId').equals(revision.speedBookId).filter((other) => other.number > revision.number).toArray(),
  ]);
  const type = airframe && airframe.operatorId === operatorId ? await db.aircraftTypes.get(airframe.aircraftTypeId) : undefined;
  const newest = later.sort((a, b) => b.number - a.number)[0];
  const brief = (record: RevisionRecord) => ({ number: record.number, publishedAt: record.publishedAt, status: record.status });
  return {
    lastSyncedAt: state?.lastSyncedAt ?? null,
    revision: brief(revision),
    newer: newest ? brief(newest) : null,
    source:
      airframe && type && operator
        ? {
            revision: { id: revision.id, number: revision.number, publishedAt: revision.publishedAt, contentSha256: revision.contentSha256, content: revision.content },
            context: {
              airframe: { id: airframe.id, registration: airframe.registration },
              aircraftType: { designator: type.designator, name: type.name },
              speedBook: { id: revision.speedBookId, title: revision.speedBookTitle },
              demo: operator.isDemo,
            },
          }
        : null,
  };
}

/**
 * The device store (Dexie) is loaded when first read: a stranger's online check, the common
 * case on a phone, never needs it, so it stays out of the check page's first download.
 */
@Injectable({ providedIn: 'root' })
export class OfflineCheckData implements OfflineCheckReader {
  private readonly injector = inject(Injector);

  async read(operatorId: number, revisionId: number, airframeId: number): Promise<OfflineCheck | null> {
    try {
      const { DeviceStore } = await import('../core/storage/device-store');
      return await readOfflineCheck(this.injector.get(DeviceStore).db, operatorId, revisionId, airframeId);
    } catch {
      return null;
    }
  }
}
