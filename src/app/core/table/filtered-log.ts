import { signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { AbstractControl } from '@angular/forms';
import { debounceTime, type Observable } from 'rxjs';
import { requestState, type FailureHandler } from '../api/request-state';
import { CursorPages } from './cursor-pages';
import { DAY_ORDER_PROBLEM, utcDayRange, type UtcInstantRange } from './utc-day-range';

/** How long the filter waits after the last keystroke or choice: choosing three filters in a row asks the server once. */
export const FILTER_PAUSE_MS = 300;

/** What a filtered log page tells `FilteredLog` about its own log. */
export interface FilteredLogSource<F, P extends { readonly nextCursor: string | null }> {
  /** The filter form; a change goes back to the newest page once the typing pauses. */
  readonly form: AbstractControl;
  /** The form's "from" and "to" days (UTC, as the date fields give them; empty for none). */
  readonly days: () => { readonly from: string; readonly to: string };
  /** The server's filter: the form's other fields and the days as instants. */
  readonly filterOf: (days: UtcInstantRange) => F;
  /** Asks for the page at `cursor` (null: the newest). */
  readonly page: (filter: F, cursor: string | null) => Observable<P>;
  /** Shows a page that arrived, for the filter it was asked with. */
  readonly show: (page: P, filter: F) => void;
  /** The sentence of a failed page; the server's by default. */
  readonly failed?: FailureHandler;
}

/**
 * A log the server pages with cursors (audit trail, card log), filtered by a form with a day
 * range: the newest page again whenever the filter changes, only the newest request's answer
 * shown, and a sentence instead of a request while the days contradict each other. Create it in
 * a component's field; the page calls `pages.first()` when it is ready.
 */
export class FilteredLog<F, P extends { readonly nextCursor: string | null }> {
  private readonly request = requestState();
  readonly loading = this.request.busy;
  readonly problem = this.request.problem;
  /** Why the filter cannot be asked for (the days contradict), or null. */
  readonly filterProblem = signal<string | null>(null);
  readonly pages = new CursorPages((cursor) => this.load(cursor));

  constructor(private readonly source: FilteredLogSource<F, P>) {
    source.form.valueChanges.pipe(debounceTime(FILTER_PAUSE_MS), takeUntilDestroyed()).subscribe(() => this.pages.first());
  }

  private load(cursor: string | null): void {
    const { from, to } = this.source.days();
    const days = utcDayRange(from, to);
    this.filterProblem.set(days === null ? DAY_ORDER_PROBLEM : null);
    if (days === null) return;
    const filter = this.source.filterOf(days);
    this.request.runLatest(
      this.source.page(filter, cursor),
      (page) => {
        this.pages.arrived(cursor, page.nextCursor);
        this.source.show(page, filter);
      },
      this.source.failed,
    );
  }
}
