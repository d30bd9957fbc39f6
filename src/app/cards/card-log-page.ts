import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { landingWindWords } from '@shared/card/card-wind-words';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { from } from 'rxjs';
import type { AirframeView } from '@shared/api/fleet';
import { formatCardCode } from '@shared/card-check/card-code';
import type { CardIssueView } from '@shared/card/card-api';
import { ApiRequestError } from '../core/api/api-request-error';
import { userMay } from '../core/auth/user-may';
import { CursorPager } from '../core/table/cursor-pager';
import { FilteredLog } from '../core/table/filtered-log';
import { RevisionNotices } from '../core/sync/revision-notices';
import { CardLog, type CardLogFilter } from './card-log';
import { cardNumber } from './card-number-pipe';
import { utcMinutesShort } from '../core/format/display-format';
import { CardSources } from './card-sources';
import { DeviceCardLog } from './device-card-log';
import { ProblemRetry } from '../core/feedback/problem-retry';
import { ProblemNote } from '../core/feedback/problem-note';

export const CARD_LOG_PAGE_SIZE = 25;

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
  private readonly log = new FilteredLog({
    form: this.form,
    days: () => this.form.getRawValue(),
    filterOf: (days): CardLogFilter => ({ airframeId: this.form.controls.airframeId.value || undefined, ...days }),
    page: (filter, cursor) => from(this.cardLog.operatorPage(filter, CARD_LOG_PAGE_SIZE, cursor)),
    show: (page) => this.entries.set(page.entries),
    failed: (error) => ApiRequestError.from(error).message,
  });
  protected readonly loading = this.log.loading;
  protected readonly problem = this.log.problem;
  protected readonly filterProblem = this.log.filterProblem;
  protected readonly pages = this.log.pages;

  constructor() {
    this.sources
      .airframes()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (airframes) => this.airframes.set(airframes), error: () => this.airframes.set([]) });
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

  /** The wind where the card lands and the operator's policy the card used, from its inputs; a dash without a wind. */
  protected windOf(entry: CardIssueView): string {
    return landingWindWords(entry.inputs);
  }
}
