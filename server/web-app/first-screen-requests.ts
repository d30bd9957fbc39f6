import { parseCheckUrl } from '@shared/card-check/check-url';
import { VERIFY_PATHS } from '@shared/card-check/verify-api';

/** The session probe every page's guards wait for (`AuthService.session()` in the app). */
export const SESSION_PATH = '/api/auth/me';

/**
 * The API answers the first screen of a page waits for, to be asked beside index.html with a
 * `Link: rel=preload; as=fetch` header (HTML Living Standard, "Link type preload"; RFC 8288).
 * Without it, a phone asks for them only after the entry script has arrived and run, each one
 * more round trip on a slow network before the page can show anything of its own:
 *
 * - `/sign-in` and `/check/…`: the session probe that the route guards wait for;
 * - `/check/<code>`: the card's verdict (`GET /api/verify/<code>`), and with a QR code's figures
 *   (`?c=`) what the card was built from (`…/source`), as `src/app/check/card-check-flow.ts`
 *   asks for them. The code is read by the same `parseCheckUrl` as the page, so the paths are
 *   the ones the page will ask for; an address that names no valid code preloads no verdict.
 *
 * The browser hands a preloaded answer to the page's own request for the same URL, mode and
 * credentials (Fetch Standard; same-origin, so `crossorigin` = credentials "same-origin", what
 * the app's requests use): nothing is asked twice.
 */
export function firstScreenRequests(pathAndQuery: string): string[] {
  const path = pathAndQuery.split('?')[0]!;
  if (path === '/sign-in') return [SESSION_PATH];
  if (!path.startsWith('/check/')) return [];
  const parsed = parseCheckUrl(pathAndQuery);
  if (!parsed.ok) return [SESSION_PATH];
  const { code, payload, payloadProblem } = parsed.value;
  return [SESSION_PATH, VERIFY_PATHS.verify(code), ...(payload && !payloadProblem ? [VERIFY_PATHS.source(code)] : [])];
}

/** `Link` header entries for API answers (same origin; `crossorigin` as the app's requests are made in CORS mode). */
export function fetchPreloadLinks(paths: readonly string[]): string[] {
  return paths.map((path) => `<${path}>; rel=preload; as=fetch; crossorigin`);
}
