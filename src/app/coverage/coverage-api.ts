import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, throwError, timeout } from 'rxjs';
import type { CoverageReport } from '@shared/card/coverage-report';
import { coverageResponseSchema } from '@shared/api/coverage';
import { ApiRequestError } from '../core/api/api-request-error';
import { parseResponse } from '../core/api/parse-response';
import { SWEEP_TIMEOUT_MS } from './coverage-refusal';

export const COVERAGE_PATHS = {
  ofRevision: (id: number) => `/api/revisions/${id}/coverage`,
  ofContent: '/api/revisions/coverage',
} as const;

/**
 * The envelope proof of speed books as the API serves it: the report of a stored revision and of
 * the editor's unsaved content. Submit and approve, which refuse with the same report, are
 * `RevisionsApi`'s (read through `coverageRefusalOr`).
 */
@Injectable({ providedIn: 'root' })
export class CoverageApi {
  private readonly http = inject(HttpClient);

  /** `GET /api/revisions/:id/coverage`. */
  revisionCoverage(revisionId: number): Observable<CoverageReport> {
    return this.report(this.http.get<unknown>(COVERAGE_PATHS.ofRevision(revisionId)));
  }

  /** `POST /api/revisions/coverage`: a 422 names the fields that keep the content from parsing. */
  contentCoverage(content: Record<string, unknown>): Observable<CoverageReport> {
    return this.report(this.http.post<unknown>(COVERAGE_PATHS.ofContent, { content }));
  }

  private report(request: Observable<unknown>): Observable<CoverageReport> {
    return request.pipe(
      timeout({ first: SWEEP_TIMEOUT_MS }),
      parseResponse(coverageResponseSchema),
      map((body) => body.report),
      catchError((error: unknown) => throwError(() => ApiRequestError.from(error))),
    );
  }
}
