import { Directive, OnInit, inject, input } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatSort } from '@angular/material/sort';
import type { ListTableRow, ListTableState } from './list-table-state';

/**
 * A list table's sort headers bound to its `ListTableState`: put on the `mat-table` instead of
 * `matSort`. The headers first show the state's sort; a click on one sorts the state. Every
 * later change comes from the headers, so the two never disagree.
 */
@Directive({
  selector: '[swListSort]',
  hostDirectives: [MatSort],
})
export class ListSort implements OnInit {
  readonly state = input.required<ListTableState<ListTableRow>>({ alias: 'swListSort' });
  private readonly matSort = inject(MatSort);

  constructor() {
    this.matSort.sortChange.pipe(takeUntilDestroyed()).subscribe((sort) => this.state().sortBy(sort));
  }

  ngOnInit(): void {
    const { active, direction } = this.state().sort();
    this.matSort.active = active;
    this.matSort.direction = direction;
  }
}
