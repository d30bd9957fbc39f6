import { DestroyRef, Injectable, InjectionToken, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { EMPTY, Subject, catchError, debounceTime, switchMap, tap } from 'rxjs';
import type { CoverageReport } from '@shared/card/coverage-report';
import { ApiRequestError } from '../core/api/api-request-error';
import { CoverageApi } from '../coverage/coverage-api';

/** How long the editor waits after the last keystroke before sweeping the content again. */
export const LIVE_COVERAGE_DEBOUNCE_MS = new InjectionToken<number>('LIVE_COVERAGE_DEBOUNCE_MS', { factory: () => 800 });

/** What the live picture can say about the content being edited. */
export type LiveCoverageState =
  | { kind: 'waiting' }
  | { kind: 'unparsed'; problems: number }
  | { kind: 'checking' }
  | { kind: 'ready' }
  | { kind: 'server-refused'; message: string }
  | { kind: 'unreachable'; message: string }
  | { kind: 'submit-refused'; message: string };

type Request = { content: Record<string, unknown>; problems: number };

/**
 * The editor's live envelope proof: the content is swept on the server (`POST
 * /api/revisions/coverage`) a moment after the engineer stops typing, only once it parses
 * (otherwise the picture says what it waits for), and a newer edit cancels the sweep in flight.
 * When the server cannot be reached the last report stays, marked as older than the content.
 * Provided by the editor component, so it lives and dies with the page.
 */
@Injectable()
export class LiveCoverage {
  private readonly api = inject(CoverageApi);
  private readonly debounceMs = inject(LIVE_COVERAGE_DEBOUNCE_MS);
  private readonly requests = new Subject<Request>();

  readonly report = signal<CoverageReport | null>(null);
  readonly state = signal<LiveCoverageState>({ kind: 'waiting' });
  /** True when the report shown was made from content that has changed since. */
  readonly stale = signal(false);
  /** Ids of the rules the current report finds broken, for the exception picker. */
  readonly brokenRules = computed(() => (this.report()?.rules ?? []).filter((r) => r.brokenAt > 0));

  constructor() {
    this.requests
      .pipe(
        tap((request) => {
          if (this.report()) this.stale.set(true);
          this.state.set(request.problems ? { kind: 'unparsed', problems: request.problems } : { kind: 'checking' });
        }),
        debounceTime(this.debounceMs),
        switchMap((request) => (request.problems ? EMPTY : this.sweep(request.content))),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe();
  }

  /** The content changed: `problems` is how many things the shared schema still finds in it. */
  contentChanged(content: Record<string, unknown>, problems: number): void {
    this.requests.next({ content, problems });
  }

  /** Submit was refused with this report: shown as it is, with the server's sentence. */
  showSubmitRefusal(report: CoverageReport, message: string): void {
    this.report.set(report);
    this.stale.set(false);
    this.state.set({ kind: 'submit-refused', message });
  }

  private sweep(content: Record<string, unknown>) {
    return this.api.contentCoverage(content).pipe(
      tap((report) => {
        this.report.set(report);
        this.stale.set(false);
        this.state.set({ kind: 'ready' });
      }),
      catchError((error: ApiRequestError) => {
        const unreachable = error.status === 0 || error.status === 504;
        this.state.set(unreachable ? { kind: 'unreachable', message: error.message } : { kind: 'server-refused', message: serverSentence(error) });
        return EMPTY;
      }),
    );
  }
}

function serverSentence(error: ApiRequestError): string {
  const first = Object.entries(error.fields)[0];
  return first ? `${error.message} (${first[0].replace(/^content\./, '')}: ${first[1]})` : error.message;
}
