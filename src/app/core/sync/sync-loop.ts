/**
 * When syncs run, in plain RxJS (no Angular): each trigger starts a sync unless one is running;
 * a failed sync schedules a retry after an exponentially growing delay, and a success (or any
 * later trigger that succeeds) cancels the pending retry and resets the count.
 */
import { EMPTY, Observable, Subject, asyncScheduler, catchError, concat, defer, exhaustMap, from, ignoreElements, map, merge, of, switchMap, tap, timer, type ObservableInput, type SchedulerLike } from 'rxjs';
import { nextRetryDelayMs } from './data-currency';

export type SyncLoopEvent<T> =
  | { readonly kind: 'started' }
  | { readonly kind: 'succeeded'; readonly result: T }
  | { readonly kind: 'failed'; readonly error: unknown; readonly failures: number; readonly retryInMs: number };

export interface SyncLoopOptions {
  /** Delay before the n-th retry (default `nextRetryDelayMs`). */
  readonly retryDelayMs?: (failures: number) => number;
  readonly scheduler?: SchedulerLike;
  /** Each value forgets the failures so far (coming online: the next failure waits the shortest delay again). */
  readonly resetBackoff?: Observable<unknown>;
}

/**
 * Runs `run` on every value of `triggers` (at sign-in, coming online, a timer, a button) and
 * on its own retries. Subscribe to start; unsubscribe to stop (pending retries go with it).
 */
export function syncLoop<T>(triggers: Observable<unknown>, run: () => ObservableInput<T>, options: SyncLoopOptions = {}): Observable<SyncLoopEvent<T>> {
  const retryDelay = options.retryDelayMs ?? nextRetryDelayMs;
  const scheduler = options.scheduler ?? asyncScheduler;
  return defer(() => {
    let failures = 0;
    // A number schedules a retry after that many ms; null cancels the pending one.
    const retries = new Subject<number | null>();
    const retryTicks = retries.pipe(switchMap((delay) => (delay === null ? EMPTY : timer(delay, scheduler))));
    const resets = (options.resetBackoff ?? EMPTY).pipe(
      tap(() => (failures = 0)),
      ignoreElements(),
    );
    return merge(triggers, retryTicks, resets).pipe(
      exhaustMap(() =>
        concat(
          of<SyncLoopEvent<T>>({ kind: 'started' }),
          defer(() => from(run())).pipe(
            map((result): SyncLoopEvent<T> => {
              failures = 0;
              retries.next(null);
              return { kind: 'succeeded', result };
            }),
            catchError((error: unknown) => {
              failures += 1;
              const retryInMs = retryDelay(failures);
              retries.next(retryInMs);
              return of<SyncLoopEvent<T>>({ kind: 'failed', error, failures, retryInMs });
            }),
          ),
        ),
      ),
    );
  });
}
