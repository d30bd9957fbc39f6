import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { debounceTime, from } from 'rxjs';
import type { AirframeView } from '../../../shared/api/fleet';
import { formatCardCode } from '../../../shared/card-check/card-code';
import type { CardIssueView } from '../../../shared/card/card-api';
import { ApiRequestError } from '../core/api/api-request-error';
import { userMay } from '../core/auth/user-may';
import { requestState } from '../core/api/request-state';
import { CursorPager } from '../core/table/cursor-pager';
import { CursorPages } from '../core/table/cursor-pages';
import { DAY_ORDER_PROBLEM, utcDayRange } from '../core/table/utc-day-range';
import { RevisionNotices } from '../core/sync/revision-notices';
import { CardLog, type CardLogFilter } from './card-log';
import { cardNumber } from './card-number-pipe';
import { utcMinutesShort } from '../core/format/display-format';
import { CardSources } from './card-sources';
import { DeviceCardLog } from './device-card-log';
import { ProblemRetry } from '../core/feedback/problem-retry';
import { ProblemNote } from '../core/feedback/problem-note';

export const CARD_LOG_PAGE_SIZE = 25;
const FILTER_PAUSE_MS = 300;

/** The operator's card log: every card its people issued and reported, filtered, a page at a time. */
@Component({
  selector: 'sw-card-log-page',
  imports: [ProblemNote, ProblemRetry, ReactiveFormsModule, MatFormFieldModule, MatSelectModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule, DeviceCardLog, RevisionNotices, RouterLink, CursorPager],
  templateUrl: './card-log-page.html',
  styleUrls: ['../core/table/list-table.scss', './card-log-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardLogPage {
  private readonly cardLog = inject(CardLog);
  private readonly sources = inject(CardSources);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly preparesCards = userMay('prepare-cards');
  protected readonly form = inject(NonNullableFormBuilder).group({ airframeId: [0], from: [''], to: [''] });
  protected readonly airframes = signal<readonly AirframeView[]>([]);
  protected readonly entries = signal<readonly CardIssueView[]>([]);
  private readonly request = requestState();
  protected readonly loading = this.request.busy;
  protected readonly problem = this.request.problem;
  protected readonly filterProblem = signal<string | null>(null);
  protected readonly pages = new CursorPages((cursor) => this.loadPage(cursor));

  constructor() {
    this.sources
      .airframes()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (airframes) => this.airframes.set(airframes), error: () => this.airframes.set([]) });
    this.form.valueChanges.pipe(debounceTime(FILTER_PAUSE_MS), takeUntilDestroyed(this.destroyRef)).subscribe(() => this.pages.first());
    this.pages.first();
  }

  protected clearFilters(): void {
    this.form.reset();
  }

  /** "2026-12-01 23:45", UTC: short enough for two time columns on a tablet. */
  protected when(iso: string): string {
    return utcMinutesShort(iso);
  }

  /** The card code as printed on the card. */
  protected readonly printedCode = formatCardCode;

  protected weightOf(entry: CardIssueView): string {
    const weight = entry.inputs['weightKg'];
    return typeof weight === 'number' ? cardNumber(weight) : '–';
  }

  private loadPage(cursor: string | null): void {
    const filter = this.filter();
    if (filter === null) return;
    this.request.runLatest(
      from(this.cardLog.operatorPage(filter, CARD_LOG_PAGE_SIZE, cursor)),
      (page) => {
        this.pages.arrived(cursor, page.nextCursor);
        this.entries.set(page.entries);
      },
      (error) => ApiRequestError.from(error).message,
    );
  }

  private filter(): CardLogFilter | null {
    const { airframeId, from: fromDay, to: toDay } = this.form.getRawValue();
    const days = utcDayRange(fromDay, toDay);
    this.filterProblem.set(days === null ? DAY_ORDER_PROBLEM : null);
    if (days === null) return null;
    return { airframeId: airframeId || undefined, ...days };
  }
}
