import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ApiRequestError } from '../core/api/api-request-error';
import { OperatorPeople } from './operator-people';
import { PersonRow, toPersonRow } from './person-row';

type SortableColumn = 'displayName' | 'roleLabel' | 'accountLabel' | 'lastSignIn';

/** The admin's list of the operator's people: who they are, their role, and their account. */
@Component({
  selector: 'sw-people-page',
  imports: [MatTableModule, MatSortModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './people-page.html',
  styleUrl: './people-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage {
  private readonly people = inject(OperatorPeople);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly columns: readonly SortableColumn[] = ['displayName', 'roleLabel', 'accountLabel', 'lastSignIn'];
  protected readonly loading = signal(true);
  protected readonly problem = signal<string | null>(null);
  protected readonly filterText = signal('');
  protected readonly sort = signal<Sort>({ active: 'displayName', direction: 'asc' });
  private readonly allRows = signal<readonly PersonRow[]>([]);

  protected readonly total = computed(() => this.allRows().length);
  protected readonly rows = computed(() => sortRows(filterRows(this.allRows(), this.filterText()), this.sort()));
  protected readonly countSentence = computed(() => {
    const shown = this.rows().length;
    const total = this.total();
    const noun = total === 1 ? 'person' : 'people';
    return shown === total ? `${total} ${noun}` : `Showing ${shown} of ${total} ${noun}`;
  });

  constructor() {
    this.loadPeople();
  }

  protected loadPeople(): void {
    this.loading.set(true);
    this.problem.set(null);
    this.people
      .list()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (people) => {
          this.allRows.set(people.map(toPersonRow));
          this.loading.set(false);
        },
        error: (error: ApiRequestError) => {
          this.problem.set(error.message);
          this.loading.set(false);
        },
      });
  }

  protected filterPeople(event: Event): void {
    this.filterText.set((event.target as HTMLInputElement).value);
  }

  protected sortPeople(sort: Sort): void {
    this.sort.set(sort);
  }
}

function filterRows(rows: readonly PersonRow[], text: string): readonly PersonRow[] {
  const needle = text.trim().toLowerCase();
  if (!needle) {
    return rows;
  }
  return rows.filter((row) =>
    [row.displayName, row.email, row.roleLabel, row.accountLabel].some((value) => value.toLowerCase().includes(needle)),
  );
}

function sortRows(rows: readonly PersonRow[], sort: Sort): readonly PersonRow[] {
  if (!sort.direction) {
    return rows;
  }
  const sign = sort.direction === 'asc' ? 1 : -1;
  const column = sort.active as SortableColumn;
  return [...rows].sort((a, b) => sign * compareBy(column, a, b));
}

function compareBy(column: SortableColumn, a: PersonRow, b: PersonRow): number {
  if (column === 'lastSignIn') {
    // Never signed in counts as the oldest.
    return (a.lastSignInMs ?? -Infinity) - (b.lastSignInMs ?? -Infinity) || 0;
  }
  return a[column].localeCompare(b[column], 'en', { sensitivity: 'base' });
}
