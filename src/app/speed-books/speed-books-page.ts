import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RevisionPage } from './revision-page';
import { SpeedBookDetail } from './speed-book-detail';
import { SpeedBookList } from './speed-book-list';

/** A positive whole number from a query parameter, NaN for anything else; null when absent. */
export function recordIdParam(value: string | undefined): number | null {
  if (value === undefined || value === '') return null;
  return /^[1-9]\d{0,9}$/.test(value) ? Number(value) : Number.NaN;
}

/**
 * The speed books route: the list, one speed book (`?book=`) or one of its revisions
 * (`?book=&revision=`). Query parameters keep the whole feature behind its one navigation entry.
 */
@Component({
  selector: 'sw-speed-books-page',
  imports: [SpeedBookList, SpeedBookDetail, RevisionPage],
  template: `
    @if (revisionId(); as revisionId) {
      <sw-revision-page [revisionId]="revisionId" />
    } @else if (bookId(); as bookId) {
      <sw-speed-book-detail [bookId]="bookId" />
    } @else {
      <sw-speed-book-list />
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeedBooksPage {
  readonly book = input<string>();
  readonly revision = input<string>();

  protected readonly bookId = computed(() => recordIdParam(this.book()));
  protected readonly revisionId = computed(() => recordIdParam(this.revision()));
}
