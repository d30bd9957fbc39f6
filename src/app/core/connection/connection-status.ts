import { DOCUMENT } from '@angular/common';
import { Injectable, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { EMPTY, Observable, fromEvent, map, merge } from 'rxjs';

/**
 * Whether the device believes it has a network. The browser's word only: it can say "online"
 * on a captive Wi-Fi, so callers still handle failed requests.
 */
@Injectable({ providedIn: 'root' })
export class ConnectionStatus {
  private readonly window = inject(DOCUMENT).defaultView;
  private readonly isOnline = signal(this.window?.navigator.onLine ?? true);

  readonly online = this.isOnline.asReadonly();

  constructor() {
    this.onlineChanges()
      .pipe(takeUntilDestroyed())
      .subscribe((online) => this.isOnline.set(online));
  }

  private onlineChanges(): Observable<boolean> {
    if (!this.window) {
      return EMPTY;
    }
    return merge(
      fromEvent(this.window, 'online').pipe(map(() => true)),
      fromEvent(this.window, 'offline').pipe(map(() => false)),
    );
  }
}
