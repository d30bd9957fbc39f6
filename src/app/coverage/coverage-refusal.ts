import { HttpErrorResponse } from '@angular/common/http';
import { coverageFailedSchema } from '@shared/api/coverage';
import type { CoverageReport } from '@shared/card/coverage-report';
import { ApiRequestError } from '../core/api/api-request-error';

/**
 * How long a request that runs the envelope sweep may take (coverage, submit, approve): a sweep of
 * the demo jet takes about two seconds on a loaded server; the line may be slow too.
 */
export const SWEEP_TIMEOUT_MS = 30_000;

/** Submit or approve refused because the envelope proof failed: the server's sentence and its report. */
export class CoverageRefusal extends ApiRequestError {
  constructor(
    message: string,
    readonly report: CoverageReport,
  ) {
    super(422, 'coverage_failed', message, {}, true);
    this.name = 'CoverageRefusal';
  }
}

/** The failure of a submit or approve request: a 422 `coverage_failed` as a `CoverageRefusal` with its report, anything else as the server said it. */
export function coverageRefusalOr(error: unknown): ApiRequestError {
  if (error instanceof HttpErrorResponse && error.status === 422) {
    const body = coverageFailedSchema.safeParse(error.error);
    if (body.success) return new CoverageRefusal(body.data.message, body.data.report);
  }
  return ApiRequestError.from(error);
}
