import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { recordIdParam } from '../speed-books/speed-books-page';
import { DraftList } from './draft-list';
import { RevisionEditor } from './revision-editor';

/** The drafts route: the list of drafts, or the editor of one (`?revision=`). */
@Component({
  selector: 'sw-drafts-page',
  imports: [DraftList, RevisionEditor],
  template: `
    @if (revisionId(); as revisionId) {
      <sw-revision-editor [revisionId]="revisionId" />
    } @else {
      <sw-draft-list />
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DraftsPage {
  readonly revision = input<string>();
  protected readonly revisionId = computed(() => recordIdParam(this.revision()));
}
