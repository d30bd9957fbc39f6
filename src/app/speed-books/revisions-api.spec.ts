import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { smallCoverageReport } from '@shared/api/testing/coverage-fixtures';
import { CoverageRefusal } from '../coverage/coverage-refusal';
import { REVISION_PATHS, RevisionsApi } from './revisions-api';
import { revisionView } from './testing/revision-fixtures';

describe('RevisionsApi submit and approve', () => {
  let api: RevisionsApi;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(RevisionsApi);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('submits and answers the revision now in review', async () => {
    const answer = firstValueFrom(api.submit(12));
    const request = backend.expectOne(REVISION_PATHS.step(12, 'submit'));
    expect(request.request.method).toBe('POST');
    request.flush({ revision: revisionView({}, { id: 12, status: 'in_review' }) });
    expect((await answer).status).toBe('in_review');
  });

  it('reads a 422 coverage_failed into a CoverageRefusal with the report', async () => {
    const answer = firstValueFrom(api.submit(12));
    backend
      .expectOne(REVISION_PATHS.step(12, 'submit'))
      .flush({ error: { code: 'coverage_failed', message: 'The book gives no card at 1 point of its envelope.', report: smallCoverageReport() } }, { status: 422, statusText: 'Unprocessable Content' });
    const error = await answer.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(CoverageRefusal);
    expect((error as CoverageRefusal).message).toBe('The book gives no card at 1 point of its envelope.');
    expect((error as CoverageRefusal).report.counts.refused).toBe(1);
  });

  it('keeps any other refusal of submit as the server said it', async () => {
    const answer = firstValueFrom(api.submit(12));
    backend
      .expectOne(REVISION_PATHS.step(12, 'submit'))
      .flush({ error: { code: 'conflict', message: 'Only a draft can be submitted.' } }, { status: 409, statusText: 'Conflict' });
    const error = await answer.catch((e: unknown) => e);
    expect(error).not.toBeInstanceOf(CoverageRefusal);
    expect(error).toMatchObject({ status: 409, message: 'Only a draft can be submitted.' });
  });

  it('reads a 422 coverage_failed of approve (publish re-checks) the same way', async () => {
    const answer = firstValueFrom(api.approve(12));
    const request = backend.expectOne(REVISION_PATHS.step(12, 'approve'));
    expect(request.request.method).toBe('POST');
    request.flush({ error: { code: 'coverage_failed', message: 'Publishing refused: 1 point gives no card.', report: smallCoverageReport() } }, { status: 422, statusText: 'Unprocessable Content' });
    const error = await answer.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(CoverageRefusal);
    expect((error as CoverageRefusal).message).toBe('Publishing refused: 1 point gives no card.');
  });
});
