import { AfterContentInit, ChangeDetectionStrategy, Component, contentChildren, input, viewChild } from '@angular/core';
import { MatColumnDef, MatTable, MatTableModule } from '@angular/material/table';
import { ListPaginator } from './list-paginator';
import type { ListTableRow, ListTableState } from './list-table-state';
import { TableToolbar } from './table-toolbar';

/**
 * One client-side list table (fleet, people): the filter toolbar with its count, the framed
 * `mat-table`, the empty row and, when `paged`, the paginator. The page projects only its
 * `matColumnDef`s (and any toolbar button, marked `swTableAction`) and puts `[swListSort]` on this
 * element so its sort headers reach the state. Columns are added to the inner table as in
 * Angular Material's "table with wrapped column definitions" example.
 */
@Component({
  selector: 'sw-list-table',
  imports: [MatTableModule, ListPaginator, TableToolbar],
  templateUrl: './list-table.html',
  styleUrl: './list-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListTable implements AfterContentInit {
  readonly table = input.required<ListTableState<ListTableRow>>();
  readonly columns = input.required<readonly string[]>();
  /** The table's accessible name, as "Airframes of your operator". */
  readonly label = input.required<string>();
  readonly filterLabel = input.required<string>();
  readonly filterHint = input.required<string>();
  /** The count sentence; null hides it. */
  readonly count = input.required<string | null>();
  readonly countTestId = input.required<string>();
  /** Said in the empty row when there are no rows at all. */
  readonly emptyText = input.required<string>();
  /** Said in the empty row, followed by the filter text, when the filter keeps no row: "No airframe matches". */
  readonly noMatchText = input.required<string>();
  readonly loading = input(false);
  readonly loadingText = input('Loading…');
  /** Names the pages, as "Pages of airframes"; without it every matching row is shown on one page. */
  readonly pagesLabel = input<string | null>(null);

  private readonly matTable = viewChild.required(MatTable);
  private readonly columnDefs = contentChildren(MatColumnDef);

  ngAfterContentInit(): void {
    for (const columnDef of this.columnDefs()) this.matTable().addColumnDef(columnDef);
  }
}
