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
import { AuditEventView } from '@shared/api/audit';
import { userMay } from '../core/auth/user-may';
import { CursorPager } from '../core/table/cursor-pager';
import { FilteredLog } from '../core/table/filtered-log';
import { OperatorPeople } from '../people/operator-people';
import { AuditRow, toAuditRow } from './audit-row';
import { AuditFilter, AuditTrail, type AuditPage as AuditPageAnswer } from './audit-trail';
import { AUDIT_ACTION_LABELS, AUDIT_ENTITY_LABELS, entityTypeOfAction } from './audit-vocabulary';
import { ProblemRetry } from '../core/feedback/problem-retry';
import { ProblemNote } from '../core/feedback/problem-note';

export const AUDIT_PAGE_SIZE = 25;

interface PersonOption {
  readonly id: number;
  readonly name: string;
}

/** Who did what to which record, and when: the operator's audit trail, filtered, a page at a time. */
const AUDIT_TEXT_COLUMNS: readonly { name: string; header: string; label: 'whenLabel' | 'personLabel' | 'actionLabel' | 'recordLabel' }[] = [
  { name: 'when', header: 'When', label: 'whenLabel' },
  { name: 'person', header: 'Person', label: 'personLabel' },
  { name: 'action', header: 'Action', label: 'actionLabel' },
  { name: 'record', header: 'Record', label: 'recordLabel' },
];

@Component({
  selector: 'sw-audit-page',
  imports: [ProblemNote, ProblemRetry, ReactiveFormsModule, MatTableModule, MatFormFieldModule, MatSelectModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule, CursorPager],
  templateUrl: './audit-page.html',
  styleUrls: ['../core/table/list-table.scss', './audit-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly trail = inject(AuditTrail);
  private readonly people = inject(OperatorPeople);
  private readonly managesPeople = userMay('manage-people');
  private readonly destroyRef = inject(DestroyRef);

  /** The columns that show one of the row's words, in order; then the details button. */
  protected readonly textColumns = AUDIT_TEXT_COLUMNS;
  protected readonly columns = [...AUDIT_TEXT_COLUMNS.map((column) => column.name), 'expand'];
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

  protected readonly rows = signal<readonly AuditRow[]>([]);
  protected readonly expandedId = signal<number | null>(null);
  protected readonly filtered = signal(false);
  private readonly log = new FilteredLog({
    form: this.form,
    days: () => this.form.getRawValue(),
    filterOf: (days): AuditFilter => {
      const { entityType, action, actorId } = this.form.getRawValue();
      return { entityType: entityType || undefined, action: action || undefined, actorId: actorId || undefined, ...days };
    },
    page: (filter, cursor) => this.trail.page(filter, AUDIT_PAGE_SIZE, cursor),
    show: (page, filter) => this.showPage(page, filter),
  });
  protected readonly loading = this.log.loading;
  protected readonly problem = this.log.problem;
  protected readonly filterProblem = this.log.filterProblem;
  protected readonly pages = this.log.pages;

  constructor() {
    this.loadPeopleForFilter();
    this.followFilterChanges();
    this.pages.first();
  }

  protected isExpanded = (row: AuditRow) => this.expandedId() === row.id;

  protected toggleDetails(row: AuditRow): void {
    this.expandedId.update((id) => (id === row.id ? null : row.id));
  }

  protected clearFilters(): void {
    this.form.reset();
  }

  private followFilterChanges(): void {
    this.form.controls.entityType.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe((entityType) => {
      this.chosenEntityType.set(entityType);
      const action = this.form.controls.action.value;
      if (action && entityType && entityTypeOfAction(action) !== entityType) this.form.controls.action.setValue('', { emitEvent: false });
    });
  }

  private showPage(page: AuditPageAnswer, filter: AuditFilter): void {
    this.filtered.set(Object.values(filter).some(Boolean));
    this.rows.set(page.events.map(toAuditRow));
    this.rememberActors(page.events);
    this.expandedId.set(null);
  }

  private loadPeopleForFilter(): void {
    if (!this.managesPeople()) return;
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
