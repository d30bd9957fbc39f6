import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { ConnectionStatus } from '../core/connection/connection-status';

/** "Online" or "Offline" in words (and an icon), announced politely when it changes. */
@Component({
  selector: 'sw-connection-indicator',
  imports: [MatIcon],
  host: {
    role: 'status',
    class: 'connection-indicator',
    '[class.offline]': '!online()',
  },
  template: `
    <mat-icon>{{ online() ? 'wifi' : 'wifi_off' }}</mat-icon>
    <span data-testid="connection-status">{{ online() ? 'Online' : 'Offline' }}</span>
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      min-height: 32px;
      padding: 0 12px;
      border-radius: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }

    :host(.offline) {
      border-color: var(--mat-sys-tertiary);
      background: var(--sw-caution-container);
      color: var(--sw-on-caution-container);
    }

    mat-icon {
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConnectionIndicator {
  protected readonly online = inject(ConnectionStatus).online;
}
