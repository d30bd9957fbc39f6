import { DOCUMENT } from '@angular/common';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { SwUpdate, VersionEvent } from '@angular/service-worker';
import { Subject } from 'rxjs';
import { AppUpdates } from './app-updates';

describe('AppUpdates', () => {
  const versionUpdates = new Subject<VersionEvent>();
  const unrecoverable = new Subject<{ type: 'UNRECOVERABLE_STATE'; reason: string }>();
  const action = new Subject<void>();
  const snackBar = { open: jest.fn(() => ({ onAction: () => action })) };
  const reload = jest.fn();

  function start(isEnabled: boolean): void {
    TestBed.configureTestingModule({
      providers: [
        { provide: SwUpdate, useValue: { isEnabled, versionUpdates, unrecoverable } },
        { provide: MatSnackBar, useValue: snackBar },
        { provide: DOCUMENT, useValue: { location: { reload } } },
      ],
    });
    TestBed.inject(AppUpdates).watch();
  }

  beforeEach(() => {
    snackBar.open.mockClear();
    reload.mockClear();
  });

  it('offers a reload when a new version is ready, and reloads only when asked', () => {
    start(true);
    versionUpdates.next({ type: 'VERSION_DETECTED', version: { hash: 'b' } });
    expect(snackBar.open).not.toHaveBeenCalled();

    versionUpdates.next({ type: 'VERSION_READY', currentVersion: { hash: 'a' }, latestVersion: { hash: 'b' } });
    expect(snackBar.open).toHaveBeenCalledWith('A new version of Speedwright is ready.', 'Reload');
    expect(reload).not.toHaveBeenCalled();

    action.next();
    expect(reload).toHaveBeenCalledTimes(1);
  });

  it('asks to reload when the offline copy is broken', () => {
    start(true);
    unrecoverable.next({ type: 'UNRECOVERABLE_STATE', reason: 'missing file' });
    expect(snackBar.open).toHaveBeenCalledWith('Speedwright must reload to repair its offline copy.', 'Reload');
  });

  it('does nothing without a service worker', () => {
    start(false);
    versionUpdates.next({ type: 'VERSION_READY', currentVersion: { hash: 'a' }, latestVersion: { hash: 'b' } });
    expect(snackBar.open).not.toHaveBeenCalled();
  });
});
