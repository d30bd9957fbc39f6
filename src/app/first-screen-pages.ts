import type { Type } from '@angular/core';

/** The sign-in page's code (its route's `loadComponent`). */
export const loadSignInPage = (): Promise<Type<unknown>> => import('./sign-in/sign-in-page').then((m) => m.SignInPage);

/** The card check page's code (its route's `loadComponent`). */
export const loadCheckPage = (): Promise<Type<unknown>> => import('./check/check-page').then((m) => m.CheckPage);

/**
 * The two pages a phone most often opens first: the sign-in page of a new device and the
 * check page a printed card's QR code leads to. The router loads a page's code only after its
 * guards, which wait for the server's answer about the session; starting the download of the
 * page that the address names at bootstrap overlaps the two (the router's later `import()`
 * finds the module already on its way). Settles once that code has arrived and run (or failed),
 * so that `main.ts` bootstraps in a task of its own after it.
 */
export function prefetchFirstScreen(path: string): Promise<void> {
  const load = path === '/sign-in' || path.startsWith('/sign-in?') ? loadSignInPage : path.startsWith('/check/') ? loadCheckPage : null;
  if (!load) return Promise.resolve();
  // Settles either way: a page whose code failed to arrive is the router's to report.
  return load().then(
    () => undefined,
    () => undefined,
  );
}
