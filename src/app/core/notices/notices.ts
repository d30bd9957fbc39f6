import { Injectable, Injector, inject } from '@angular/core';
import type { MatSnackBar, MatSnackBarRef, TextOnlySnackBar } from '@angular/material/snack-bar';
import { EMPTY, Observable, from, switchMap } from 'rxjs';

const loadSnackBar = () => import('@angular/material/snack-bar').then((m) => m.MatSnackBar);

/**
 * The app's short messages at the foot of the screen (Material's snack bar), with the snack
 * bar's code (and the overlay code under it) loaded on the first message, never in a first
 * visit that shows none (issue 17). Offline it still loads: the service worker prefetches
 * every script of the app (`ngsw-config.json`, group `app-shell`) and answers from its cache.
 * A load that fails (offline before the service worker holds the app) is tried again on the
 * next message.
 */
@Injectable({ providedIn: 'root' })
export class Notices {
  private readonly injector = inject(Injector);
  private snackBar: Promise<MatSnackBar> | null = null;

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
