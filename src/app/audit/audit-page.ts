import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Subscription, debounceTime } from 'rxjs';
import { AuditEventView } from '../../../shared/api/audit';
import { can } from '../../../shared/auth/roles';
import { ApiRequestError } from '../core/api/api-request-error';
import { AuthService } from '../core/auth/auth-service';
import { OperatorPeople } from '../people/operator-people';
import { AuditRow, toAuditRow } from './audit-row';
import { AuditFilter, AuditTrail } from './audit-trail';
import { AUDIT_ACTION_LABELS, AUDIT_ENTITY_LABELS, entityTypeOfAction } from './audit-vocabulary';
import { ProblemRetry } from '../core/feedback/problem-retry';

export const AUDIT_PAGE_SIZE = 25;
/** Long enough that choosing three filters in a row asks the server once. */
const FILTER_PAUSE_MS = 300;

interface PersonOption {
  readonly id: number;
  readonly name: string;
}

/** Who did what to which record, and when: the operator's audit trail, filtered, a page at a time. */
@Component({
  selector: 'sw-audit-page',
  imports: [ProblemRetry, ReactiveFormsModule, MatTableModule, MatFormFieldModule, MatSelectModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly trail = inject(AuditTrail);
  private readonly people = inject(OperatorPeople);
  private readonly user = inject(AuthService).user;
  private readonly destroyRef = inject(DestroyRef);

  protected readonly columns = ['when', 'person', 'action', 'record', 'expand'];
  protected readonly entityTypes = Object.entries(AUDIT_ENTITY_LABELS);
  protected readonly form = inject(NonNullableFormBuilder).group({
    entityType: [''],
    action: [''],
    actorId: [''],
    from: [''],
    to: [''],
  });
  private readonly chosenEntityType = signal('');
  protected readonly actions = computed(() => {
    const entityType = this.chosenEntityType();
    return Object.entries(AUDIT_ACTION_LABELS).filter(([action]) => !entityType || entityTypeOfAction(action) === entityType);
  });
  private readonly knownPeople = signal<readonly PersonOption[]>([]);
  private readonly seenPeople = signal<readonly PersonOption[]>([]);
  protected readonly personOptions = computed(() => {
    const byId = new Map<number, PersonOption>();
    for (const person of [...this.seenPeople(), ...this.knownPeople()]) byId.set(person.id, person);
    return [...byId.values()].sort((a, b) => a.name.localeCompare(b.name, 'en', { sensitivity: 'base' }));
  });

  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly filterProblem = signal<string | null>(null);
  protected readonly rows = signal<readonly AuditRow[]>([]);
  protected readonly expandedId = signal<number | null>(null);
  /** Cursors of the pages before this one; the first page has none. */
  private readonly cursors = signal<readonly (string | null)[]>([]);
  private readonly currentCursor = signal<string | null>(null);
  private readonly nextCursor = signal<string | null>(null);
  protected readonly pageNumber = computed(() => this.cursors().length + 1);
  protected readonly hasNewer = computed(() => this.cursors().length > 0);
  protected readonly hasOlder = computed(() => this.nextCursor() !== null);
  protected readonly filtered = signal(false);
  private request: Subscription | null = null;

  constructor() {
    this.loadPeopleForFilter();
    this.followFilterChanges();
    this.loadPage(null);
  }

  protected isExpanded = (row: AuditRow) => this.expandedId() === row.id;

  protected toggleDetails(row: AuditRow): void {
    this.expandedId.update((id) => (id === row.id ? null : row.id));
  }

  protected showOlder(): void {
    const next = this.nextCursor();
    if (next === null) return;
    this.cursors.update((list) => [...list, this.currentCursor()]);
    this.loadPage(next);
  }

  protected showNewer(): void {
    const list = this.cursors();
    if (list.length === 0) return;
    this.cursors.set(list.slice(0, -1));
    this.loadPage(list[list.length - 1]);
  }

  protected clearFilters(): void {
    this.form.reset();
  }

  protected reload(): void {
    this.loadPage(this.currentCursor());
  }

  private followFilterChanges(): void {
    this.form.controls.entityType.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe((entityType) => {
      this.chosenEntityType.set(entityType);
      const action = this.form.controls.action.value;
      if (action && entityType && entityTypeOfAction(action) !== entityType) this.form.controls.action.setValue('', { emitEvent: false });
    });
    this.form.valueChanges.pipe(debounceTime(FILTER_PAUSE_MS), takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.cursors.set([]);
      this.loadPage(null);
    });
  }

  private loadPage(cursor: string | null): void {
    const filter = this.filter();
    if (filter === null) return;
    this.filtered.set(Object.values(filter).some(Boolean));
    this.request?.unsubscribe();
    this.loading.set(true);
    this.problem.set(null);
    this.request = this.trail
      .page(filter, AUDIT_PAGE_SIZE, cursor)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (page) => {
          this.currentCursor.set(cursor);
          this.nextCursor.set(page.nextCursor);
          this.rows.set(page.events.map(toAuditRow));
          this.rememberActors(page.events);
          this.expandedId.set(null);
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }

  /** The form as the server's query, or null (with a sentence) when the dates contradict. */
  private filter(): AuditFilter | null {
    const { entityType, action, actorId, from, to } = this.form.getRawValue();
    if (from && to && from > to) {
      this.filterProblem.set('The “from” date is after the “to” date. Change one of them.');
      return null;
    }
    this.filterProblem.set(null);
    return {
      entityType: entityType || undefined,
      action: action || undefined,
      actorId: actorId || undefined,
      // Whole days in UTC, the "to" day included.
      from: from ? `${from}T00:00:00.000Z` : undefined,
      to: to ? `${to}T23:59:59.999Z` : undefined,
    };
  }

  private loadPeopleForFilter(): void {
    const user = this.user();
    if (!user || !can(user.role, 'manage-people')) return;
    this.people
      .list()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (people) => this.knownPeople.set(people.map((person) => ({ id: person.id, name: person.displayName }))),
        // The filter then offers the people seen in the trail; the trail itself still loads.
        error: () => undefined,
      });
  }

  private rememberActors(events: readonly AuditEventView[]): void {
    const seen = new Map(this.seenPeople().map((person) => [person.id, person]));
    for (const event of events) {
      if (event.actorId !== null && event.actorName !== null) seen.set(event.actorId, { id: event.actorId, name: event.actorName });
    }
    this.seenPeople.set([...seen.values()]);
  }
}
