import { DOCUMENT } from '@angular/common';
import { DestroyRef, Injectable, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatSnackBar } from '@angular/material/snack-bar';
import { SwUpdate, VersionReadyEvent } from '@angular/service-worker';
import { filter } from 'rxjs';

/**
 * New versions of the installed app: the person decides when to reload, so a card being
 * prepared is never lost to an update. A broken cache leaves no choice but to reload.
 */
@Injectable({ providedIn: 'root' })
export class AppUpdates {
  private readonly updates = inject(SwUpdate);
  private readonly snackBar = inject(MatSnackBar);
  private readonly document = inject(DOCUMENT);
  private readonly destroyRef = inject(DestroyRef);

  watch(): void {
    if (!this.updates.isEnabled) {
      return;
    }
    this.offerReloadWhenReady();
    this.reloadWhenUnrecoverable();
  }

  private offerReloadWhenReady(): void {
    this.updates.versionUpdates
      .pipe(
        filter((event): event is VersionReadyEvent => event.type === 'VERSION_READY'),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe(() => {
        this.snackBar
          .open('A new version of Speedwright is ready.', 'Reload')
          .onAction()
          .subscribe(() => this.reload());
      });
  }

  private reloadWhenUnrecoverable(): void {
    this.updates.unrecoverable.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.snackBar
        .open('Speedwright must reload to repair its offline copy.', 'Reload')
        .onAction()
        .subscribe(() => this.reload());
    });
  }

  private reload(): void {
    this.document.location.reload();
  }
}
