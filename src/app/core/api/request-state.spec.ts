import { Injector, runInInjectionContext } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, throwError } from 'rxjs';
import { ApiRequestError } from './api-request-error';
import { requestState } from './request-state';

describe('RequestState', () => {
  const state = () => runInInjectionContext(TestBed.inject(Injector), () => requestState());

  it('is busy while a request runs and shows the server’s sentence when it fails', () => {
    const request = state();
    const answer = new Subject<number>();
    const got: number[] = [];
    request.run(answer, (value) => got.push(value));
    expect(request.busy()).toBe(true);
    answer.next(7);
    answer.complete();
    expect(request.busy()).toBe(false);
    expect(got).toEqual([7]);

    request.run(throwError(() => new ApiRequestError(503, 'unavailable', 'The server is not answering.', {})), () => undefined);
    expect(request.busy()).toBe(false);
    expect(request.problem()).toBe('The server is not answering.');
  });

  it('runLatest drops the answer of the request it superseded', () => {
    const request = state();
    const first = new Subject<string>();
    const second = new Subject<string>();
    const got: string[] = [];
    request.runLatest(first, (value) => got.push(value));
    request.runLatest(second, (value) => got.push(value));
    first.next('stale');
    expect(request.busy()).toBe(true);
    second.next('fresh');
    second.complete();
    expect(got).toEqual(['fresh']);
    expect(request.busy()).toBe(false);
  });
});
