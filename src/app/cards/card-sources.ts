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

const DEMO_KEY_PREFIX = 'speedwright.operator-demo.';

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

  revision(id: number): Observable<RevisionView> {
    return this.api.get(CARD_PATHS.revision(id), revisionResponseSchema).pipe(map((body) => body.revision));
  }

  /**
   * Asks the server once whether the operator is a demo operator (the card says so, and the
   * flag is part of the digest the server checks). The session does not carry it, so the
   * server's own preview of the device's first card answers it.
   */
  askDemo(revisionId: number, inputs: CardInputs): Observable<boolean> {
    return this.api.post(CARD_PATHS.preview, { revisionId, inputs }, cardPreviewResponseSchema).pipe(map(({ card }) => card.demo));
  }

  /** The last answer of `askDemo` for the operator on this device, or null before the first. */
  rememberedDemo(operatorId: number): boolean | null {
    try {
      const stored = this.window?.localStorage.getItem(DEMO_KEY_PREFIX + operatorId);
      return stored === 'true' ? true : stored === 'false' ? false : null;
    } catch {
      return null;
    }
  }

  rememberDemo(operatorId: number, demo: boolean): void {
    try {
      this.window?.localStorage.setItem(DEMO_KEY_PREFIX + operatorId, String(demo));
    } catch {
      // Asked again on the next visit.
    }
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
