import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/**
 * The frame of the account pages reached from a mail or the account menu (change, choose or
 * reset a password, lift a sign-in wait): one narrow card under the page's heading, the
 * heading naming the card for a screen reader.
 */
@Component({
  selector: 'sw-account-frame',
  template: `
    <section class="account-card" aria-labelledby="account-title">
      <h1 id="account-title" class="sw-page-title">{{ heading() }}</h1>
      <ng-content />
    </section>
  `,
  styles: `
    :host {
      display: block;
      padding: 48px 24px;
    }
    .account-card {
      box-sizing: border-box;
      max-width: 28rem;
      margin: 0 auto;
      padding: 32px;
      border-radius: 16px;
      background: var(--mat-sys-surface-container-low);
      border: 1px solid var(--mat-sys-outline-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountFrame {
  readonly heading = input.required<string>();
}
