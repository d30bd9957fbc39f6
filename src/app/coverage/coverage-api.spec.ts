import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import { smallCoverageReport } from '@shared/api/testing/coverage-fixtures';
import { demoPistonTrainerContent } from '@shared/speed-book/demo-content';
import { ApiRequestError } from '../core/api/api-request-error';
import { COVERAGE_PATHS, CoverageApi } from './coverage-api';
import { CoverageRefusal } from './coverage-refusal';

describe('CoverageApi', () => {
  let api: CoverageApi;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(CoverageApi);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('reads the report of a stored revision', async () => {
    const answer = firstValueFrom(api.revisionCoverage(12));
    const request = backend.expectOne(COVERAGE_PATHS.ofRevision(12));
    expect(request.request.method).toBe('GET');
    request.flush({ report: smallCoverageReport() });
    const report = await answer;
    expect(report.counts).toEqual({ points: 26, issued: 24, refused: 1, ruleBroken: 1 });
    expect(report.sheets.map((s) => s.configurationLabel)).toEqual(['Flaps 15', 'Flaps 40']);
  });

  it('sends the editor’s content and reads its report', async () => {
    const content = demoPistonTrainerContent() as unknown as Record<string, unknown>;
    const answer = firstValueFrom(api.contentCoverage(content));
    const request = backend.expectOne(COVERAGE_PATHS.ofContent);
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ content });
    request.flush({ report: smallCoverageReport() });
    expect((await answer).passes).toBe(false);
  });

  it('gives the field problems when the content does not parse', async () => {
    const answer = firstValueFrom(api.contentCoverage({ schemaVersion: 1 }));
    backend
      .expectOne(COVERAGE_PATHS.ofContent)
      .flush({ error: { code: 'validation_failed', message: 'Check the fields marked.', fields: { 'content.aircraft': 'Give the aircraft.' } } }, { status: 422, statusText: 'Unprocessable Content' });
    const error = await answer.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiRequestError);
    expect(error).not.toBeInstanceOf(CoverageRefusal);
    expect((error as ApiRequestError).fields).toEqual({ 'content.aircraft': 'Give the aircraft.' });
  });

  it('refuses a report that is not the agreed shape', async () => {
    const answer = firstValueFrom(api.revisionCoverage(12));
    const report = smallCoverageReport();
    report.sheets[0]!.cells.pop();
    backend.expectOne(COVERAGE_PATHS.ofRevision(12)).flush({ report });
    await expect(answer).rejects.toMatchObject({ code: 'malformed_response' });
  });

  it('says so when the server cannot be reached', async () => {
    const answer = firstValueFrom(api.revisionCoverage(12));
    backend.expectOne(COVERAGE_PATHS.ofRevision(12)).error(new ProgressEvent('error'), { status: 0 });
    await expect(answer).rejects.toMatchObject({ status: 0, code: 'network_unreachable' });
  });
});
