import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface DiscardDraftData {
  readonly number: number;
  readonly bookTitle: string;
  readonly changeSummary: string;
}

/** Asked before a draft is deleted for good. Closes with true to discard. */
@Component({
  selector: 'sw-discard-draft-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Discard draft {{ data.number }}?</h2>
    <mat-dialog-content>
      <p data-testid="discard-draft-sentence">
        Draft {{ data.number }} of {{ data.bookTitle }} (“{{ data.changeSummary }}”), its content and its source pages
        will be deleted. This cannot be undone; the audit trail keeps a line saying it was discarded.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>Keep the draft</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true" data-testid="confirm-discard-draft">Discard draft</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiscardDraftDialog {
  protected readonly data = inject<DiscardDraftData>(MAT_DIALOG_DATA);
}
