import { DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { Observable, Subscription, finalize } from 'rxjs';
import { ApiRequestError } from './api-request-error';

/** What a request's failure shows: the sentence, or null for none (the handler showed it elsewhere). */
export type FailureHandler = (error: ApiRequestError) => string | null;

/**
 * The one loading-state helper of the client: a busy flag and a problem sentence around the
 * requests of a page, store or dialog, each ended with its owner (`takeUntilDestroyed`). It
 * replaces the hand-written `subscribe` + busy-flag pairs: `run` clears the problem, sets busy,
 * and on failure shows the server's sentence (`ApiRequestError.message`) unless `failed` says
 * otherwise. Create it in an injection context with `requestState()`.
 */
export class RequestState {
  private readonly busySignal = signal(false);
  private readonly problemSignal = signal<string | null>(null);
  /** True while a request runs. */
  readonly busy = this.busySignal.asReadonly();
  /** The sentence of the last failure; null after a success or a new request. */
  readonly problem = this.problemSignal.asReadonly();

  private latest: Subscription | null = null;

  constructor(private readonly destroyRef: DestroyRef) {}

  /** Runs `request`; `succeeded` takes its value; `failed` picks the sentence to show. */
  run<T>(request: Observable<T>, succeeded: (value: T) => void, failed: FailureHandler = (error) => error.message): void {
    this.subscribe(request, succeeded, failed);
  }

  /**
   * Like `run`, but first drops the answer of the request `runLatest` started before, if it
   * still runs: only the newest request of a page (a filter typed on) may fill it.
   */
  runLatest<T>(request: Observable<T>, succeeded: (value: T) => void, failed: FailureHandler = (error) => error.message): void {
    this.latest?.unsubscribe();
    this.latest = this.subscribe(request, succeeded, failed);
  }

  private subscribe<T>(request: Observable<T>, succeeded: (value: T) => void, failed: FailureHandler): Subscription {
    this.busySignal.set(true);
    this.problemSignal.set(null);
    return request
      .pipe(
        finalize(() => this.busySignal.set(false)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: succeeded,
        // Whatever failed (a refusal, a timeout, a navigation the request led to) is read as one.
        error: (error: unknown) => this.problemSignal.set(failed(ApiRequestError.from(error))),
      });
  }

  /** Shows a sentence of the caller's own (or none). */
  showProblem(sentence: string | null): void {
    this.problemSignal.set(sentence);
  }
}

/** A `RequestState` ended with the component, store or dialog that creates it. */
export function requestState(): RequestState {
  return new RequestState(inject(DestroyRef));
}
