import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, forkJoin, map, of, switchMap, throwError, timeout } from 'rxjs';
import * as z from 'zod';
import { attachmentListSchema, attachmentResponseSchema, type AttachmentView } from '@shared/api/attachments';
import { aircraftTypeListSchema, type AircraftTypeView } from '@shared/api/fleet';
import {
  revisionDiffSchema,
  revisionResponseSchema,
  speedBookListSchema,
  speedBookResponseSchema,
  type RevisionSummary,
  type RevisionView,
  type SpeedBookSummary,
} from '@shared/api/revisions';
import { speedTableUploadSchema, type SpeedTableUploadResponse } from '@shared/api/uploads';
import { ApiClient } from '../core/api/api-client';
import { ApiRequestError } from '../core/api/api-request-error';
import { parseResponse } from '../core/api/parse-response';
import { SWEEP_TIMEOUT_MS, coverageRefusalOr } from '../coverage/coverage-refusal';

export type SpeedBook = z.infer<typeof speedBookResponseSchema>['speedBook'];
export type RevisionDiff = z.infer<typeof revisionDiffSchema>;

/** A revision together with the speed book it belongs to, for lists across books. */
export interface BookRevision {
  readonly book: SpeedBook;
  readonly revision: RevisionSummary;
}

/** Uploads can take longer than a plain answer on a slow line. */
const UPLOAD_TIMEOUT_MS = 60_000;

export const REVISION_PATHS = {
  speedBooks: '/api/speed-books',
  speedBook: (id: number) => `/api/speed-books/${id}`,
  newRevision: (bookId: number) => `/api/speed-books/${bookId}/revisions`,
  revision: (id: number) => `/api/revisions/${id}`,
  step: (id: number, step: 'submit' | 'approve' | 'return' | 'withdraw') => `/api/revisions/${id}/${step}`,
  diff: (id: number, againstId: number) => `/api/revisions/${id}/diff?against=${againstId}`,
  aircraftTypes: '/api/aircraft-types',
  speedTableUpload: '/api/uploads/speed-table',
  attachments: (revisionId: number) => `/api/revisions/${revisionId}/attachments`,
  attachment: (id: number) => `/api/attachments/${id}`,
} as const;

const revision = map((body: z.infer<typeof revisionResponseSchema>) => body.revision);

/** Speed books and their revisions as the API serves them, every answer parsed with the shared schemas. */
@Injectable({ providedIn: 'root' })
export class RevisionsApi {
  private readonly api = inject(ApiClient);
  private readonly http = inject(HttpClient);

  speedBooks(): Observable<SpeedBookSummary[]> {
    return this.api.get(REVISION_PATHS.speedBooks, speedBookListSchema).pipe(map((body) => body.speedBooks));
  }

  speedBook(id: number): Observable<SpeedBook> {
    return this.api.get(REVISION_PATHS.speedBook(id), speedBookResponseSchema).pipe(map((body) => body.speedBook));
  }

  /** Every speed book with its revisions, for lists of drafts and reviews across books. */
  allSpeedBooks(): Observable<SpeedBook[]> {
    return this.speedBooks().pipe(switchMap((books) => (books.length ? forkJoin(books.map((book) => this.speedBook(book.id))) : of([]))));
  }

  /** Revisions of any speed book whose status is one of `statuses`, newest change first. */
  revisionsWithStatus(statuses: readonly RevisionSummary['status'][]): Observable<BookRevision[]> {
    return this.allSpeedBooks().pipe(
      map((books) =>
        books
          .flatMap((book) => book.revisions.filter((r) => statuses.includes(r.status)).map((r) => ({ book, revision: r })))
          .sort((a, b) => b.revision.updatedAt.localeCompare(a.revision.updatedAt)),
      ),
    );
  }

  aircraftTypes(): Observable<AircraftTypeView[]> {
    return this.api.get(REVISION_PATHS.aircraftTypes, aircraftTypeListSchema).pipe(map((body) => body.aircraftTypes));
  }

  createSpeedBook(input: { aircraftTypeId: number; title: string }): Observable<SpeedBook> {
    return this.api.post(REVISION_PATHS.speedBooks, input, speedBookResponseSchema).pipe(map((body) => body.speedBook));
  }

  revision(id: number): Observable<RevisionView> {
    return this.api.get(REVISION_PATHS.revision(id), revisionResponseSchema).pipe(revision);
  }

  startDraft(bookId: number, input: { changeSummary: string; content?: Record<string, unknown> }): Observable<RevisionView> {
    return this.api.post(REVISION_PATHS.newRevision(bookId), input, revisionResponseSchema).pipe(revision);
  }

  updateDraft(id: number, change: { content?: Record<string, unknown>; changeSummary?: string }): Observable<RevisionView> {
    return this.api.patch(REVISION_PATHS.revision(id), change, revisionResponseSchema).pipe(revision);
  }

  /** Sends a draft to review; fails with a `CoverageRefusal` when the envelope proof fails. */
  submit(id: number): Observable<RevisionView> {
    return this.sweepingStep(REVISION_PATHS.step(id, 'submit'));
  }

  /** Publishes and signs; publishing runs the envelope proof again and refuses the same way. */
  approve(id: number): Observable<RevisionView> {
    return this.sweepingStep(REVISION_PATHS.step(id, 'approve'));
  }

  returnToAuthor(id: number, reason: string): Observable<RevisionView> {
    return this.api.post(REVISION_PATHS.step(id, 'return'), { reason }, revisionResponseSchema).pipe(revision);
  }

  withdraw(id: number, reason: string): Observable<RevisionView> {
    return this.api.post(REVISION_PATHS.step(id, 'withdraw'), { reason }, revisionResponseSchema).pipe(revision);
  }

  diff(id: number, againstId: number): Observable<RevisionDiff> {
    return this.api.get(REVISION_PATHS.diff(id, againstId), revisionDiffSchema);
  }

  /** Parses a CSV on the server for a preview; nothing is stored. */
  uploadSpeedTable(file: File): Observable<SpeedTableUploadResponse> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.answered(this.http.post<unknown>(REVISION_PATHS.speedTableUpload, form), speedTableUploadSchema, UPLOAD_TIMEOUT_MS);
  }

  attachments(revisionId: number): Observable<AttachmentView[]> {
    return this.api.get(REVISION_PATHS.attachments(revisionId), attachmentListSchema).pipe(map((body) => body.attachments));
  }

  /** A flight-manual source page (PDF, PNG or JPEG) for the approver to compare with. */
  attach(revisionId: number, file: File): Observable<AttachmentView> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.answered(this.http.post<unknown>(REVISION_PATHS.attachments(revisionId), form), attachmentResponseSchema, UPLOAD_TIMEOUT_MS).pipe(
      map((body) => body.attachment),
    );
  }

  removeAttachment(id: number): Observable<void> {
    return this.http.delete(REVISION_PATHS.attachment(id), { responseType: 'text' }).pipe(
      timeout({ first: UPLOAD_TIMEOUT_MS }),
      map(() => undefined),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  /** Deletes a draft and its source pages (the server refuses anything but a draft). */
  discardDraft(id: number): Observable<void> {
    return this.http.delete(REVISION_PATHS.revision(id), { responseType: 'text' }).pipe(
      timeout({ first: UPLOAD_TIMEOUT_MS }),
      map(() => undefined),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  /** A step that runs the envelope sweep on the server: its time, and its 422 read as a `CoverageRefusal`. */
  private sweepingStep(url: string): Observable<RevisionView> {
    return this.http.post<unknown>(url, {}).pipe(
      timeout({ first: SWEEP_TIMEOUT_MS }),
      parseResponse(revisionResponseSchema),
      revision,
      catchError((error: unknown) => throwError(() => coverageRefusalOr(error))),
    );
  }

  private answered<S extends z.ZodType>(request: Observable<unknown>, schema: S, timeoutMs: number): Observable<z.output<S>> {
    return request.pipe(
      timeout({ first: timeoutMs }),
      parseResponse(schema),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }
}
