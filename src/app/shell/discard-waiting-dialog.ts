import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface DiscardWaitingData {
  /** Entries of this operator on the device that the server has not recorded. */
  readonly waiting: number;
  /** Why they could not be sent just now. */
  readonly reason: string | null;
}

/** Asked before signing out would delete card-log entries the server does not have. Closes with true to discard. */
@Component({
  selector: 'sw-discard-waiting-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Cards not sent yet</h2>
    <mat-dialog-content>
      <p data-testid="discard-sentence">
        {{ data.waiting === 1 ? '1 card issued on this device has' : data.waiting + ' cards issued on this device have' }} not reached the server, and
        sending {{ data.waiting === 1 ? 'it' : 'them' }} just now did not work{{ data.reason ? ': ' + data.reason : '.' }}
      </p>
      <p>
        Signing out removes your operator's data from this device, so {{ data.waiting === 1 ? 'this card' : 'these cards' }} would never appear in the
        operator's card log. Stay signed in and sync when you have a connection, or discard {{ data.waiting === 1 ? 'it' : 'them' }} and sign out.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" data-testid="keep-waiting" cdkFocusInitial>Stay signed in</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true" data-testid="discard-and-sign-out">Discard and sign out</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiscardWaitingDialog {
  protected readonly data = inject<DiscardWaitingData>(MAT_DIALOG_DATA);
}
