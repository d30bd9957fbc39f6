import { HttpClient, HttpErrorResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, throwError, timeout } from 'rxjs';
import type { CoverageReport } from '../../../shared/card/coverage-report';
import { coverageFailedSchema, coverageResponseSchema } from '../../../shared/api/coverage';
import { revisionResponseSchema, type RevisionView } from '../../../shared/api/revisions';
import { ApiRequestError } from '../core/api/api-request-error';
import { parseResponse } from '../core/api/parse-response';

export const COVERAGE_PATHS = {
  ofRevision: (id: number) => `/api/revisions/${id}/coverage`,
  ofContent: '/api/revisions/coverage',
  submit: (id: number) => `/api/revisions/${id}/submit`,
  approve: (id: number) => `/api/revisions/${id}/approve`,
} as const;

/** A sweep of the demo jet takes about two seconds on a loaded server; the line may be slow too. */
const SWEEP_TIMEOUT_MS = 30_000;

/** Submit refused because the envelope proof failed: the server's sentence and its report. */
export class CoverageRefusal extends ApiRequestError {
  constructor(
    message: string,
    readonly report: CoverageReport,
  ) {
    super(422, 'coverage_failed', message, {}, true);
    this.name = 'CoverageRefusal';
  }
}

/**
 * The envelope proof of speed books as the API serves it: the report of a stored revision, of
 * the editor's unsaved content, and submit and approve with their 422 `coverage_failed` read
 * into a `CoverageRefusal` carrying the report (every other failure stays an ApiRequestError).
 */
@Injectable({ providedIn: 'root' })
export class CoverageApi {
  private readonly http = inject(HttpClient);

  /** `GET /api/revisions/:id/coverage`. */
  revisionCoverage(revisionId: number): Observable<CoverageReport> {
    return this.http.get<unknown>(COVERAGE_PATHS.ofRevision(revisionId)).pipe(
      timeout({ first: SWEEP_TIMEOUT_MS }),
      parseResponse(coverageResponseSchema),
      map((body) => body.report),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  /** `POST /api/revisions/coverage`: a 422 names the fields that keep the content from parsing. */
  contentCoverage(content: Record<string, unknown>): Observable<CoverageReport> {
    return this.http.post<unknown>(COVERAGE_PATHS.ofContent, { content }).pipe(
      timeout({ first: SWEEP_TIMEOUT_MS }),
      parseResponse(coverageResponseSchema),
      map((body) => body.report),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }

  /** `POST /api/revisions/:id/submit`; fails with a `CoverageRefusal` when the envelope proof fails. */
  submit(revisionId: number): Observable<RevisionView> {
    return this.step(COVERAGE_PATHS.submit(revisionId));
  }

  /** `POST /api/revisions/:id/approve`: publishing checks the envelope again, and refuses the same way. */
  approve(revisionId: number): Observable<RevisionView> {
    return this.step(COVERAGE_PATHS.approve(revisionId));
  }

  private step(url: string): Observable<RevisionView> {
    return this.http.post<unknown>(url, {}).pipe(
      timeout({ first: SWEEP_TIMEOUT_MS }),
      parseResponse(revisionResponseSchema),
      map((body) => body.revision),
      catchError((error: unknown) => throwError(() => coverageRefusal(error) ?? ApiRequestError.from(error))),
    );
  }
}

function coverageRefusal(error: unknown): CoverageRefusal | null {
  if (!(error instanceof HttpErrorResponse) || error.status !== 422) return null;
  const body = coverageFailedSchema.safeParse(error.error);
  return body.success ? new CoverageRefusal(body.data.message, body.data.report) : null;
}
