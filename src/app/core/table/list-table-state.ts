import { computed, signal } from '@angular/core';
import { PageEvent } from '@angular/material/paginator';
import { Sort } from '@angular/material/sort';

/** What a list table needs of a row: words to filter on and values to sort by. */
export interface ListTableRow {
  readonly id: number;
  /** Everything the filter box matches against, already lower-case. */
  readonly searchText: string;
  readonly sortKeys: Readonly<Record<string, string | number>>;
}

export const LIST_PAGE_SIZES = [10, 25, 50] as const;

/**
 * Filter, sort and page of one list table (fleet, people) as signals: the rows shown follow
 * from the rows given, the filter text, the sort header and the paginator. `matching` is every
 * row the filter keeps, sorted; `shown` the current page of it. Numbers sort as numbers, words
 * without regard to case and with digit runs as numbers ("ZZ-A2" before "ZZ-A10").
 */
export class ListTableState<R extends ListTableRow> {
  readonly filterText = signal('');
  readonly sort = signal<Sort>({ active: '', direction: '' });
  readonly pageIndex = signal(0);
  readonly pageSize = signal<number>(LIST_PAGE_SIZES[0]);

  readonly matching = computed(() => sortRows(filterRows(this.rows(), this.filterText()), this.sort()));
  readonly shown = computed(() => {
    const start = this.safePageIndex() * this.pageSize();
    return this.matching().slice(start, start + this.pageSize());
  });
  /** The page stays in range when a filter leaves fewer rows. */
  readonly safePageIndex = computed(() => {
    const pages = Math.max(1, Math.ceil(this.matching().length / this.pageSize()));
    return Math.min(this.pageIndex(), pages - 1);
  });

  constructor(
    private readonly rows: () => readonly R[],
    initialSort: Sort,
  ) {
    this.sort.set(initialSort);
  }

  /** How many rows there are before the filter. */
  readonly total = computed(() => this.rows().length);

  /** "3 airframes", or "2 of 3 airframes match" while a filter hides some. */
  countSentence(singular: string, plural: string): string {
    const total = this.total();
    const matching = this.matching().length;
    const noun = total === 1 ? singular : plural;
    return matching === total ? `${total} ${noun}` : `${matching} of ${total} ${noun} match`;
  }

  filter(text: string): void {
    this.filterText.set(text);
    this.pageIndex.set(0);
  }

  sortBy(sort: Sort): void {
    this.sort.set(sort);
  }

  page(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }
}

function filterRows<R extends ListTableRow>(rows: readonly R[], text: string): readonly R[] {
  const needle = text.trim().toLowerCase();
  return needle ? rows.filter((row) => row.searchText.includes(needle)) : rows;
}

function sortRows<R extends ListTableRow>(rows: readonly R[], sort: Sort): readonly R[] {
  if (!sort.direction || !sort.active) {
    return rows;
  }
  const sign = sort.direction === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const x = a.sortKeys[sort.active];
    const y = b.sortKeys[sort.active];
    if (typeof x === 'number' && typeof y === 'number') return sign * (x - y);
    return sign * String(x).localeCompare(String(y), 'en', { sensitivity: 'base', numeric: true });
  });
}
