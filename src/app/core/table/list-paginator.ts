import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatPaginatorModule } from '@angular/material/paginator';
import { LIST_PAGE_SIZES, type ListTableRow, type ListTableState } from './list-table-state';

/** The paginator under a client-side list table, bound to its `ListTableState`. */
@Component({
  selector: 'sw-list-paginator',
  imports: [MatPaginatorModule],
  template: `<mat-paginator
    [length]="table().matching().length"
    [pageIndex]="table().safePageIndex()"
    [pageSize]="table().pageSize()"
    [pageSizeOptions]="pageSizes"
    (page)="table().page($event)"
    [attr.aria-label]="label()"
  />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListPaginator {
  readonly table = input.required<ListTableState<ListTableRow>>();
  /** Names the pages, as "Pages of airframes". */
  readonly label = input.required<string>();
  protected readonly pageSizes = LIST_PAGE_SIZES;
}
