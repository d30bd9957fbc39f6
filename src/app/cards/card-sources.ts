import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { airframeListSchema, type AircraftTypeView, type AirframeView } from '@shared/api/fleet';
import { revisionResponseSchema, speedBookResponseSchema, type RevisionSummary, type RevisionView } from '@shared/api/revisions';
import type { CardContext, CardRevision } from '@shared/card';
import { contentSha256 } from '@shared/speed-book/canonical';
import { ApiClient } from '../core/api/api-client';
import type { RevisionRecord } from '../core/storage/device-database';
import type { DeviceSnapshot } from '../core/sync/sync-service';

/** A stored revision as the card page takes it. */
export function revisionSourceOf(record: RevisionRecord): CardRevisionSource {
  return { id: record.id, number: record.number, status: record.status, publishedAt: record.publishedAt, speedBookId: record.speedBookId, contentSha256: record.contentSha256, content: record.content };
}

export const CARD_PATHS = {
  airframes: '/api/airframes',
  aircraftTypes: '/api/aircraft-types',
  speedBooks: '/api/speed-books',
  speedBook: (id: number) => `/api/speed-books/${id}`,
  revision: (id: number) => `/api/revisions/${id}`,
  preview: '/api/cards/preview',
  cardIssues: '/api/card-issues',
} as const;

/** A speed book as the device knows it: from the revisions it synced. */
export interface DeviceBook {
  readonly id: number;
  readonly title: string;
  /** The book's published revision on this device; null when it has none (all superseded or withdrawn). */
  readonly currentRevision: RevisionRecord | null;
}

/** An airframe in service with its type and the type's speed book (null when the device has none). */
export interface AirframeChoice {
  readonly airframe: AirframeView;
  readonly type: AircraftTypeView;
  readonly book: DeviceBook | null;
}

/** What a card is built from: the revision, published (from the device) or a draft an engineer previews (from the API). */
export interface CardRevisionSource {
  readonly id: number;
  readonly number: number;
  readonly status: string;
  readonly publishedAt: string | null;
  readonly speedBookId: number;
  readonly contentSha256: string | null;
  readonly content: Record<string, unknown>;
}

/**
 * The airframes in service on this device, by registration, each with its type and the type's
 * speed book, from the synced data only: this works with no network.
 */
export function airframeChoicesOf(snapshot: DeviceSnapshot | null): AirframeChoice[] {
  if (!snapshot) return [];
  const typeById = new Map(snapshot.aircraftTypes.map((type) => [type.id, type]));
  const books = new Map<number, { id: number; title: string; aircraftTypeId: number; revisions: RevisionRecord[] }>();
  for (const revision of snapshot.revisions) {
    const book = books.get(revision.speedBookId) ?? { id: revision.speedBookId, title: revision.speedBookTitle, aircraftTypeId: revision.aircraftTypeId, revisions: [] };
    book.revisions.push(revision);
    books.set(book.id, book);
  }
  const bookOfType = (typeId: number): DeviceBook | null => {
    const book = [...books.values()].find((candidate) => candidate.aircraftTypeId === typeId);
    if (!book) return null;
    const published = book.revisions.filter((revision) => revision.status === 'published').sort((a, b) => b.number - a.number);
    const newest = [...book.revisions].sort((a, b) => b.number - a.number)[0];
    return { id: book.id, title: newest?.speedBookTitle ?? book.title, currentRevision: published[0] ?? null };
  };
  return snapshot.airframes
    .filter((airframe) => airframe.active && typeById.has(airframe.aircraftTypeId))
    .map((airframe) => ({ airframe, type: typeById.get(airframe.aircraftTypeId)!, book: bookOfType(airframe.aircraftTypeId) }))
    .sort((a, b) => a.airframe.registration.localeCompare(b.airframe.registration));
}

/** Drafts and revisions in review (engineers' preview) still come from the API. */
@Injectable({ providedIn: 'root' })
export class CardSources {
  private readonly api = inject(ApiClient);

  /** Every airframe of the operator, in service or not (the card log's filter). */
  airframes(): Observable<AirframeView[]> {
    return this.api.get(CARD_PATHS.airframes, airframeListSchema).pipe(map((body) => [...body.airframes].sort((a, b) => a.registration.localeCompare(b.registration))));
  }

  /** The revisions an engineer may preview: drafts and revisions in review of the book, newest first. */
  openRevisions(bookId: number): Observable<RevisionSummary[]> {
    return this.api
      .get(CARD_PATHS.speedBook(bookId), speedBookResponseSchema)
      .pipe(map(({ speedBook }) => speedBook.revisions.filter((revision) => revision.status === 'draft' || revision.status === 'in_review')));
  }

  /** The revisions of the book that were ever published (published, superseded, withdrawn), newest first. */
  publishedRevisions(bookId: number): Observable<RevisionSummary[]> {
    return this.api
      .get(CARD_PATHS.speedBook(bookId), speedBookResponseSchema)
      .pipe(map(({ speedBook }) => speedBook.revisions.filter((revision) => revision.status === 'published' || revision.status === 'superseded' || revision.status === 'withdrawn')));
  }

  revision(id: number): Observable<RevisionView> {
    return this.api.get(CARD_PATHS.revision(id), revisionResponseSchema).pipe(map((body) => body.revision));
  }
}

/** The revision as `buildCard` takes it; a draft is checked against its own content's hash, as the server does. */
export function cardRevisionOf(view: CardRevisionSource): CardRevision {
  return {
    id: view.id,
    number: view.number,
    publishedAt: view.publishedAt,
    contentSha256: view.contentSha256 ?? contentSha256(view.content),
    content: view.content,
  };
}

export function cardContextOf(choice: AirframeChoice, demo: boolean): CardContext {
  return {
    airframe: { id: choice.airframe.id, registration: choice.airframe.registration },
    aircraftType: { designator: choice.type.designator, name: choice.type.name },
    speedBook: { id: choice.book!.id, title: choice.book!.title },
    demo,
  };
}
