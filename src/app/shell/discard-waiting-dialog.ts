import { ChangeDetectionStrategy, Component, inject, type Signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface DiscardWaitingData {
  /** Entries of this operator on the device that the server had not recorded when asked. */
  readonly waiting: number;
  /** The same count as it is now: a sync while the dialog is open may send them. */
  readonly waitingNow: Signal<number>;
  /** Why they could not be sent just now. */
  readonly reason: string | null;
}

/**
 * Asked before signing out would delete card-log entries the server does not have. Closes
 * with true to sign out (discarding what still waits). When a sync sends them while it is
 * open, it says so and signing out discards nothing.
 */
@Component({
  selector: 'sw-discard-waiting-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    @if (data.waitingNow() === 0) {
      <h2 mat-dialog-title>Cards sent</h2>
      <mat-dialog-content>
        <p data-testid="discard-sentence">
          The connection came back and {{ data.waiting === 1 ? 'the card has' : 'the cards have' }} reached the operator's card log. Nothing is lost
          by signing out now.
        </p>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" [mat-dialog-close]="false" data-testid="keep-waiting">Stay signed in</button>
        <button mat-flat-button type="button" [mat-dialog-close]="true" data-testid="sign-out-now" cdkFocusInitial>Sign out</button>
      </mat-dialog-actions>
    } @else {
      <h2 mat-dialog-title>Cards not sent yet</h2>
      <mat-dialog-content>
        <p data-testid="discard-sentence">
          {{ waitingWords() }} not reached the server, and sending {{ data.waitingNow() === 1 ? 'it' : 'them' }} just now did not
          work{{ data.reason ? ': ' + data.reason : '.' }}
        </p>
        <p>
          Signing out removes your operator's data from this device, so {{ data.waitingNow() === 1 ? 'this card' : 'these cards' }} would never appear in
          the operator's card log. Stay signed in and sync when you have a connection, or discard {{ data.waitingNow() === 1 ? 'it' : 'them' }} and sign
          out.
        </p>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" [mat-dialog-close]="false" data-testid="keep-waiting" cdkFocusInitial>Stay signed in</button>
        <button mat-flat-button type="button" [mat-dialog-close]="true" data-testid="discard-and-sign-out">Discard and sign out</button>
      </mat-dialog-actions>
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiscardWaitingDialog {
  protected readonly data = inject<DiscardWaitingData>(MAT_DIALOG_DATA);

  protected waitingWords(): string {
    const count = this.data.waitingNow();
    return count === 1 ? '1 card issued on this device has' : `${count} cards issued on this device have`;
  }
}
