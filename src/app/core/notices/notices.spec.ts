import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Subject } from 'rxjs';
import { Notices } from './notices';

/** The snack bar's code loads on the first message, not at start-up nor when the service worker is ready (issue 17). */
describe('Notices', () => {
  const action = new Subject<void>();
  const snackBar = { open: jest.fn(() => ({ onAction: () => action })), dismiss: jest.fn() };
  let created = 0;
  let ready: () => void = () => undefined;
  const originalServiceWorker = Object.getOwnPropertyDescriptor(globalThis.navigator, 'serviceWorker');

  /** Lets the dynamic import and the promise chain after it settle. */
  const loaded = () => new Promise<void>((done) => setTimeout(done, 0));

  beforeEach(() => {
    created = 0;
    snackBar.open.mockClear();
    snackBar.dismiss.mockClear();
    // A service worker that becomes ready when the test says so.
    const readyPromise = new Promise<void>((resolve) => (ready = resolve));
    Object.defineProperty(globalThis.navigator, 'serviceWorker', { configurable: true, value: { ready: readyPromise } });
    TestBed.configureTestingModule({
      providers: [
        {
          provide: MatSnackBar,
          useFactory: () => {
            created += 1;
            return snackBar;
          },
        },
      ],
    });
  });

  afterEach(() => {
    if (originalServiceWorker) Object.defineProperty(globalThis.navigator, 'serviceWorker', originalServiceWorker);
    else delete (globalThis.navigator as { serviceWorker?: unknown }).serviceWorker;
  });

  it('does not load the snack bar at start-up, nor once the service worker is ready', async () => {
    TestBed.inject(Notices);
    ready();
    await loaded();
    expect(created).toBe(0);
    // Dismissing with nothing shown does not load it either.
    TestBed.inject(Notices).dismiss();
    await loaded();
    expect(created).toBe(0);
  });

  it('loads the snack bar on the first message and shows it; later messages reuse it', async () => {
    const notices = TestBed.inject(Notices);
    notices.show('Saved on this device.', 'OK');
    await loaded();
    expect(created).toBe(1);
    expect(snackBar.open).toHaveBeenCalledWith('Saved on this device.', 'OK');
    notices.show('Synced.', 'OK');
    await loaded();
    expect(created).toBe(1);
    expect(snackBar.open).toHaveBeenLastCalledWith('Synced.', 'OK');
    notices.dismiss();
    await loaded();
    expect(snackBar.dismiss).toHaveBeenCalledTimes(1);
  });

  it('emits when the action of an opened message is taken', async () => {
    const taken = jest.fn();
    TestBed.inject(Notices).open('A new version is ready.', 'Reload').subscribe(taken);
    await loaded();
    expect(snackBar.open).toHaveBeenCalledWith('A new version is ready.', 'Reload');
    expect(taken).not.toHaveBeenCalled();
    action.next();
    expect(taken).toHaveBeenCalledTimes(1);
  });
});
