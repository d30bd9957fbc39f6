import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { recordIdParam } from '../speed-books/speed-books-page';
import { RevisionList } from '../speed-books/revision-list';
import { RevisionEditor } from './revision-editor';

/** The drafts route: the list of drafts, or the editor of one (`?revision=`). */
@Component({
  selector: 'sw-drafts-page',
  imports: [RevisionList, RevisionEditor],
  template: `
    @if (revisionId(); as revisionId) {
      <sw-revision-editor [revisionId]="revisionId" />
    } @else {
      <sw-revision-list kind="drafts" />
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DraftsPage {
  readonly revision = input<string>();
  protected readonly revisionId = computed(() => recordIdParam(this.revision()));
}
