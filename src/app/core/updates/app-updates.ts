import { DOCUMENT } from '@angular/common';
import { DestroyRef, Injectable, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { NavigationError } from '@angular/router';
import { SwUpdate, VersionReadyEvent } from '@angular/service-worker';
import { filter } from 'rxjs';
import { Notices } from '../notices/notices';

/** What browsers say when a lazy chunk cannot be fetched (Chromium, WebKit, Firefox). */
const FAILED_CHUNK = /Failed to fetch dynamically imported module|Importing a module script failed|error loading dynamically imported module/i;

/** Key in sessionStorage: when the last reload for a failed chunk was, so a missing file cannot loop. */
const CHUNK_RELOAD_KEY = 'speedwright.chunk-reload-at';

/**
 * New versions of the installed app: the person decides when to reload, so a card being
 * prepared is never lost to an update. A broken cache leaves no choice but to reload, and a
 * page whose code is gone (an old version's chunk after an update) is loaded afresh.
 */
@Injectable({ providedIn: 'root' })
export class AppUpdates {
  private readonly updates = inject(SwUpdate);
  private readonly notices = inject(Notices);
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
        this.notices.open('A new version of Speedwright is ready.', 'Reload').subscribe(() => this.reload());
      });
  }

  private reloadWhenUnrecoverable(): void {
    this.updates.unrecoverable.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => {
      this.notices.open('Speedwright must reload to repair its offline copy.', 'Reload').subscribe(() => this.reload());
    });
  }

  /**
   * The router's navigation-error handler: a lazy chunk that failed to load belongs to a
   * version the server no longer has, so the page is loaded afresh at the address asked for
   * (once; a second failure within a minute is told, not retried). Offline, there is nothing
   * to load it from, and the person is told so.
   */
  failedNavigation(error: NavigationError): void {
    const message = error.error instanceof Error ? error.error.message : String(error.error);
    if (!FAILED_CHUNK.test(message)) return;
    const window = this.document.defaultView;
    if (window && !window.navigator.onLine) {
      this.notices.show('That page is not on this device yet. Connect to the network to open it.', 'Dismiss');
      return;
    }
    const storage = window?.sessionStorage;
    const last = Number(storage?.getItem(CHUNK_RELOAD_KEY) ?? 0);
    if (Date.now() - last < 60_000) {
      this.notices.open('Speedwright could not load that page. Reload when the connection is steady.', 'Reload').subscribe(() => this.reload());
      return;
    }
    storage?.setItem(CHUNK_RELOAD_KEY, String(Date.now()));
    this.document.location.assign(error.url);
  }

  private reload(): void {
    this.document.location.reload();
  }
}
