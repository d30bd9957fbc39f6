import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { debounceTime } from 'rxjs';
import type { AirframeView } from '../../../shared/api/fleet';
import { can } from '../../../shared/auth/roles';
import { formatCardCode } from '../../../shared/card-check/card-code';
import type { CardIssueView } from '../../../shared/card/card-api';
import { ApiRequestError } from '../core/api/api-request-error';
import { AuthService } from '../core/auth/auth-service';
import { RevisionNotices } from '../core/sync/revision-notices';
import { CardLog, type CardLogFilter } from './card-log';
import { cardNumber } from './card-number-pipe';
import { utcMinutesShort } from '../core/format/display-format';
import { CardSources } from './card-sources';
import { DeviceCardLog } from './device-card-log';
import { ProblemRetry } from '../core/feedback/problem-retry';

export const CARD_LOG_PAGE_SIZE = 25;
const FILTER_PAUSE_MS = 300;

/** The operator's card log: every card its people issued and reported, filtered, a page at a time. */
@Component({
  selector: 'sw-card-log-page',
  imports: [ProblemRetry, ReactiveFormsModule, MatFormFieldModule, MatSelectModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule, DeviceCardLog, RevisionNotices, RouterLink],
  templateUrl: './card-log-page.html',
  styleUrl: './card-log-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CardLogPage {
  private readonly cardLog = inject(CardLog);
  private readonly sources = inject(CardSources);
  private readonly destroyRef = inject(DestroyRef);
  private readonly user = inject(AuthService).user;

  protected readonly preparesCards = computed(() => {
    const user = this.user();
    return user !== null && can(user.role, 'prepare-cards');
  });
  protected readonly form = inject(NonNullableFormBuilder).group({ airframeId: [0], from: [''], to: [''] });
  protected readonly airframes = signal<readonly AirframeView[]>([]);
  protected readonly entries = signal<readonly CardIssueView[]>([]);
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly filterProblem = signal<string | null>(null);
  private readonly cursors = signal<readonly (string | null)[]>([]);
  private readonly currentCursor = signal<string | null>(null);
  protected readonly nextCursor = signal<string | null>(null);
  protected readonly hasNewer = computed(() => this.cursors().length > 0);
  private request = 0;

  constructor() {
    this.sources
      .airframes()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (airframes) => this.airframes.set(airframes), error: () => this.airframes.set([]) });
    this.form.valueChanges.pipe(debounceTime(FILTER_PAUSE_MS), takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.cursors.set([]);
      void this.loadPage(null);
    });
    void this.loadPage(null);
  }

  protected showEarlier(): void {
    const next = this.nextCursor();
    if (next === null) return;
    this.cursors.update((list) => [...list, this.currentCursor()]);
    void this.loadPage(next);
  }

  protected showNewer(): void {
    const list = this.cursors();
    if (list.length === 0) return;
    this.cursors.set(list.slice(0, -1));
    void this.loadPage(list[list.length - 1]);
  }

  protected clearFilters(): void {
    this.form.reset();
  }

  protected reload(): void {
    void this.loadPage(this.currentCursor());
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

  private async loadPage(cursor: string | null): Promise<void> {
    const filter = this.filter();
    if (filter === null) return;
    const request = ++this.request;
    this.loading.set(true);
    this.problem.set(null);
    try {
      const page = await this.cardLog.operatorPage(filter, CARD_LOG_PAGE_SIZE, cursor);
      if (request !== this.request) return;
      this.currentCursor.set(cursor);
      this.nextCursor.set(page.nextCursor);
      this.entries.set(page.entries);
    } catch (error) {
      if (request === this.request) this.problem.set(ApiRequestError.from(error).message);
    } finally {
      if (request === this.request) this.loading.set(false);
    }
  }

  private filter(): CardLogFilter | null {
    const { airframeId, from, to } = this.form.getRawValue();
    if (from && to && from > to) {
      this.filterProblem.set('The “from” date is after the “to” date. Change one of them.');
      return null;
    }
    this.filterProblem.set(null);
    return {
      airframeId: airframeId || undefined,
      // Whole days in UTC, the "to" day included.
      from: from ? `${from}T00:00:00.000Z` : undefined,
      to: to ? `${to}T23:59:59.999Z` : undefined,
    };
  }
}
