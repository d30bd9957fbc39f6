import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface RotateKeyData {
  /** The active key's number, the one the rotation retires. */
  readonly activeKeyId: number;
  readonly operatorName: string;
}

/**
 * Asked before an administrator rotates the operator's signing key: what changes, what does
 * not, and when to do it. Closes with true to rotate.
 */
@Component({
  selector: 'sw-rotate-key-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Rotate the signing key?</h2>
    <mat-dialog-content>
      <p>A new Ed25519 key will be made for {{ data.operatorName }}, and:</p>
      <ul data-testid="rotate-key-consequences">
        <li>every revision published from now on is signed with the new key;</li>
        <li>
          key No. {{ data.activeKeyId }} is retired, not deleted: the revisions it signed stay valid, and devices and the card check keep
          verifying them with it, so cards already issued stay good;
        </li>
        <li>devices learn the new key at their next sync, together with any revision it signs;</li>
        <li>the audit trail records who rotated the key and when.</li>
      </ul>
      <p>
        Rotate it when the key may have been exposed (a copy of the database or of SIGNING_KEY_SECRET went where it should not), when
        someone who could reach them leaves, or as your security policy schedules. A rotation cannot be undone; the retired key is never
        used to sign again.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>Keep the current key</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true" data-testid="confirm-rotate-key">Rotate the key</button>
    </mat-dialog-actions>
  `,
  styles: `
    ul {
      padding-left: 20px;
    }
    li {
      margin-bottom: 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RotateKeyDialog {
  protected readonly data = inject<RotateKeyData>(MAT_DIALOG_DATA);
}
