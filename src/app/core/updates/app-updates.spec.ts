import { DOCUMENT } from '@angular/common';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { SwUpdate, VersionEvent } from '@angular/service-worker';
import { NavigationError } from '@angular/router';
import { Subject } from 'rxjs';
import { AppUpdates } from './app-updates';

describe('AppUpdates', () => {
  const versionUpdates = new Subject<VersionEvent>();
  const unrecoverable = new Subject<{ type: 'UNRECOVERABLE_STATE'; reason: string }>();
  const action = new Subject<void>();
  const snackBar = { open: jest.fn(() => ({ onAction: () => action })) };
  const reload = jest.fn();
  const assign = jest.fn();
  const navigatorState = { onLine: true };
  const session = new Map<string, string>();
  const sessionStorage = { getItem: (key: string) => session.get(key) ?? null, setItem: (key: string, value: string) => session.set(key, value) };

  function start(isEnabled: boolean): void {
    TestBed.configureTestingModule({
      providers: [
        { provide: SwUpdate, useValue: { isEnabled, versionUpdates, unrecoverable } },
        { provide: MatSnackBar, useValue: snackBar },
        { provide: DOCUMENT, useValue: { location: { reload, assign }, defaultView: { navigator: navigatorState, sessionStorage } } },
      ],
    });
    TestBed.inject(AppUpdates).watch();
  }

  /** The snack bar's code loads when first needed (core/notices/notices.ts): let it arrive. */
  const loaded = () => new Promise<void>((done) => setTimeout(done, 0));

  beforeEach(() => {
    snackBar.open.mockClear();
    reload.mockClear();
    assign.mockClear();
    session.clear();
    navigatorState.onLine = true;
  });

  it('offers a reload when a new version is ready, and reloads only when asked', async () => {
    start(true);
    versionUpdates.next({ type: 'VERSION_DETECTED', version: { hash: 'b' } });
    await loaded();
    expect(snackBar.open).not.toHaveBeenCalled();

    versionUpdates.next({ type: 'VERSION_READY', currentVersion: { hash: 'a' }, latestVersion: { hash: 'b' } });
    await loaded();
    expect(snackBar.open).toHaveBeenCalledWith('A new version of Speedwright is ready.', 'Reload');
    expect(reload).not.toHaveBeenCalled();

    action.next();
    expect(reload).toHaveBeenCalledTimes(1);
  });

  it('asks to reload when the offline copy is broken', async () => {
    start(true);
    unrecoverable.next({ type: 'UNRECOVERABLE_STATE', reason: 'missing file' });
    await loaded();
    expect(snackBar.open).toHaveBeenCalledWith('Speedwright must reload to repair its offline copy.', 'Reload');
  });

  it('does nothing without a service worker', async () => {
    start(false);
    versionUpdates.next({ type: 'VERSION_READY', currentVersion: { hash: 'a' }, latestVersion: { hash: 'b' } });
    await loaded();
    expect(snackBar.open).not.toHaveBeenCalled();
  });

  describe('a lazy page whose code cannot be fetched', () => {
    const failed = (message: string) => new NavigationError(1, '/card-log', new TypeError(message));

    it('loads the page afresh at the address asked for, once a minute at most', async () => {
      start(true);
      const updates = TestBed.inject(AppUpdates);
      updates.failedNavigation(failed('Failed to fetch dynamically imported module: http://localhost/chunk-ABCD1234.js'));
      expect(assign).toHaveBeenCalledWith('/card-log');
      updates.failedNavigation(failed('Failed to fetch dynamically imported module: http://localhost/chunk-ABCD1234.js'));
      expect(assign).toHaveBeenCalledTimes(1);
      await loaded();
      expect(snackBar.open).toHaveBeenCalledWith('Speedwright could not load that page. Reload when the connection is steady.', 'Reload');
    });

    it('says so offline instead of reloading into nothing', async () => {
      start(true);
      navigatorState.onLine = false;
      TestBed.inject(AppUpdates).failedNavigation(failed('Importing a module script failed.'));
      expect(assign).not.toHaveBeenCalled();
      await loaded();
      expect(snackBar.open).toHaveBeenCalledWith('That page is not on this device yet. Connect to the network to open it.', 'Dismiss');
    });

    it('leaves other navigation errors to the router', async () => {
      start(true);
      TestBed.inject(AppUpdates).failedNavigation(failed('Cannot match any routes'));
      expect(assign).not.toHaveBeenCalled();
      await loaded();
      expect(snackBar.open).not.toHaveBeenCalled();
    });
  });
});
