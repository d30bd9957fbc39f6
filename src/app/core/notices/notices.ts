import { Injectable, Injector, inject } from '@angular/core';
import type { MatSnackBar, MatSnackBarRef, TextOnlySnackBar } from '@angular/material/snack-bar';
import { EMPTY, Observable, from, switchMap } from 'rxjs';

const loadSnackBar = () => import('@angular/material/snack-bar').then((m) => m.MatSnackBar);

/** Runs `task` when the browser is idle (`requestIdleCallback`, W3C Cooperative Scheduling), or soon where it has none. */
function whenIdle(task: () => void): void {
  if (typeof globalThis.requestIdleCallback === 'function') globalThis.requestIdleCallback(task, { timeout: 10_000 });
  else setTimeout(task, 2_000);
}

/**
 * The app's short messages at the foot of the screen (Material's snack bar), with the snack
 * bar's code (and the overlay code under it) loaded when first needed or once the service
 * worker is ready, instead of in the first download.
 */
@Injectable({ providedIn: 'root' })
export class Notices {
  private readonly injector = inject(Injector);
  private snackBar: Promise<MatSnackBar> | null = null;

  constructor() {
    // Once the service worker holds the app, the snack bar's code is in memory before any
    // message: one about a page that cannot be fetched offline must not need the network. It
    // loads when the browser is next idle, so its evaluation does not hold up the first page
    // on a slow phone (at the latest 10 s after the worker is ready).
    void globalThis.navigator?.serviceWorker?.ready.then(() => whenIdle(() => void this.load().catch(() => undefined))).catch(() => undefined);
  }

  /** Shows `message` with an action button; the observable emits when the action is taken. */
  open(message: string, action: string): Observable<void> {
    return from(this.load().then((snackBar) => snackBar.open(message, action))).pipe(switchMap((ref: MatSnackBarRef<TextOnlySnackBar>) => ref.onAction() ?? EMPTY));
  }

  /** Shows `message` with an action button, without caring for the action. */
  show(message: string, action: string): void {
    void this.load()
      .then((snackBar) => snackBar.open(message, action))
      .catch(() => undefined);
  }

  dismiss(): void {
    void this.snackBar?.then((snackBar) => snackBar.dismiss()).catch(() => undefined);
  }

  private load(): Promise<MatSnackBar> {
    this.snackBar ??= loadSnackBar().then((type) => this.injector.get(type));
    this.snackBar.catch(() => (this.snackBar = null));
    return this.snackBar;
  }
}
