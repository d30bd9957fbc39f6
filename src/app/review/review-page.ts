import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { recordIdParam } from '../speed-books/speed-books-page';
import { RevisionList } from '../speed-books/revision-list';
import { RevisionReview } from './revision-review';

/** The review route: revisions waiting for an approver, or the review of one (`?revision=`). */
@Component({
  selector: 'sw-review-page',
  imports: [RevisionList, RevisionReview],
  template: `
    @if (revisionId(); as revisionId) {
      <sw-revision-review [revisionId]="revisionId" />
    } @else {
      <sw-revision-list kind="review" />
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  readonly revision = input<string>();
  protected readonly revisionId = computed(() => recordIdParam(this.revision()));
}
