import { DOCUMENT } from '@angular/common';
import { Injectable, inject } from '@angular/core';
import { Observable, forkJoin, map } from 'rxjs';
import { airframeListSchema, aircraftTypeListSchema, type AircraftTypeView, type AirframeView } from '../../../shared/api/fleet';
import {
  revisionResponseSchema,
  speedBookListSchema,
  speedBookResponseSchema,
  type RevisionSummary,
  type RevisionView,
  type SpeedBookSummary,
} from '../../../shared/api/revisions';
import type { CardContext, CardInputs, CardRevision } from '../../../shared/card';
import { cardPreviewResponseSchema } from '../../../shared/card/card-api';
import { contentSha256 } from '../../../shared/speed-book/canonical';
import { ApiClient } from '../core/api/api-client';

export const CARD_PATHS = {
  airframes: '/api/airframes',
  aircraftTypes: '/api/aircraft-types',
  speedBooks: '/api/speed-books',
  speedBook: (id: number) => `/api/speed-books/${id}`,
  revision: (id: number) => `/api/revisions/${id}`,
  preview: '/api/cards/preview',
  cardIssues: '/api/card-issues',
} as const;

/** An airframe in service with its type and the type's speed book (null when it has none yet). */
export interface AirframeChoice {
  readonly airframe: AirframeView;
  readonly type: AircraftTypeView;
  readonly book: SpeedBookSummary | null;
}


/** What a card is built from, fetched once; the card itself is computed on the device. */
@Injectable({ providedIn: 'root' })
export class CardSources {
  private readonly api = inject(ApiClient);
  private readonly window = inject(DOCUMENT).defaultView;

  /** Airframes in service, by registration, each with its type and speed book. */
  airframeChoices(): Observable<AirframeChoice[]> {
    return forkJoin({
      airframes: this.api.get(CARD_PATHS.airframes, airframeListSchema),
      types: this.api.get(CARD_PATHS.aircraftTypes, aircraftTypeListSchema),
      books: this.api.get(CARD_PATHS.speedBooks, speedBookListSchema),
    }).pipe(
      map(({ airframes, types, books }) => {
        const typeById = new Map(types.aircraftTypes.map((type) => [type.id, type]));
        return airframes.airframes
          .filter((airframe) => airframe.active && typeById.has(airframe.aircraftTypeId))
          .map((airframe) => ({
            airframe,
            type: typeById.get(airframe.aircraftTypeId)!,
            book: books.speedBooks.find((book) => book.aircraftTypeId === airframe.aircraftTypeId) ?? null,
          }))
          .sort((a, b) => a.airframe.registration.localeCompare(b.airframe.registration));
      }),
    );
  }

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
export function cardRevisionOf(view: RevisionView): CardRevision {
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
