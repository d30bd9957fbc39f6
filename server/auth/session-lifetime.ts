/**
 * The absolute lifetime of a sign-in (OWASP ASVS 4.0.3 §3.3.2: re-authentication at least every
 * 12 hours for level 2), beside the rolling 12-hour idle timeout of the session cookie.
 *
 * The time of sign-in is kept in the session; every request checks it. Past it the session is
 * destroyed and the request goes on signed out, so a route that needs someone answers 401 and the
 * app asks for the password again. The cookie and the stored session never outlive it either.
 * A device offline at that moment keeps its cards (within the currency limit) and is asked to
 * sign in the next time it reaches the server.
 */
import type { RequestHandler } from 'express';

export const ABSOLUTE_SESSION_HOURS = 12;
const ABSOLUTE_MS = ABSOLUTE_SESSION_HOURS * 3600_000;

declare module 'express-session' {
  interface SessionData {
    /** Epoch ms of the sign-in that made this session. */
    signedInAt?: number;
  }
}

/** Call right after `req.logIn`: starts the 12 hours. */
export function markSignedIn(req: Parameters<RequestHandler>[0], now = Date.now()): Date {
  req.session.signedInAt = now;
  req.session.cookie.maxAge = ABSOLUTE_MS;
  return new Date(now + ABSOLUTE_MS);
}

/** When the sign-in of this request's session ends, or null when nobody is signed in. */
export function sessionEndsAt(req: Parameters<RequestHandler>[0]): Date | null {
  const at = req.session?.signedInAt;
  return req.user && typeof at === 'number' ? new Date(at + ABSOLUTE_MS) : null;
}

/** After passport's session middleware: ends sessions past their absolute lifetime. */
export function absoluteSessionLifetime(now: () => number = Date.now): RequestHandler {
  return (req, res, next) => {
    if (!req.user) return next();
    const at = req.session.signedInAt;
    const left = typeof at === 'number' ? at + ABSOLUTE_MS - now() : 0;
    if (left > 0) {
      // The rolling cookie is renewed on this answer (express-session's touch() sets maxAge back
      // to originalMaxAge), never beyond the absolute end.
      const maxAge = Math.min(left, ABSOLUTE_MS);
      req.session.cookie.originalMaxAge = maxAge;
      req.session.cookie.maxAge = maxAge;
      return next();
    }
    // A session from before sign-in times were kept counts as ended, too. A fresh empty session
    // (the old one is deleted from the store) lets the request go on signed out.
    req.user = undefined;
    res.locals['sessionEnded'] = true;
    req.session.regenerate((error) => next(error));
  };
}
