import { Router, type RequestHandler } from 'express';
import type { PassportStatic } from 'passport';
import { loginRequestSchema } from '@shared/api/auth';
import { changePasswordRequestSchema } from '@shared/api/new-password';
import { DomainError } from '../errors/domain-error';
import { requireSignIn } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { changeOwnPassword } from './change-password.service';
import { originOf } from '../middleware/request-actor';
import { markSignedIn, sessionEndsAt } from './session-lifetime';
import { DEVICE_COOKIE, deviceCookieOptions, deviceCookieValue } from './device-cookie';

export interface AuthRoutesDeps {
  passport: PassportStatic;
  generateCsrfToken: (req: Parameters<RequestHandler>[0], overwrite?: boolean) => string;
  loginLimiter: RequestHandler;
  sessionCookieName: string;
  /** SESSION_SECRET, which signs the known-device cookie. */
  secret: string;
  cookieSecure: (req: Parameters<RequestHandler>[0]) => boolean;
}

/** `/api/auth`: CSRF token, sign-in, sign-out, who am I. */
export function authRoutes({ passport, generateCsrfToken, loginLimiter, sessionCookieName, secret, cookieSecure }: AuthRoutesDeps): Router {
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.set('Cache-Control', 'no-store').json({ token: generateCsrfToken(req) });
  });

  router.post('/login', loginLimiter, (req, res, next) => {
    req.body = parseOrThrow(loginRequestSchema, req.body, 'sign-in');
    passport.authenticate('local', (error: unknown, user: Express.User | false, info?: unknown) => {
      if (error) return next(error);
      if (!user) return next(info instanceof DomainError ? info : new DomainError('unauthenticated', 'invalid_credentials', 'The e-mail or password is not right.'));
      req.logIn(user, (loginError) => {
        if (loginError) return next(loginError);
        const sessionExpiresAt = markSignedIn(req);
        res.cookie(DEVICE_COOKIE, deviceCookieValue(user.id, secret), deviceCookieOptions(cookieSecure(req)));
        res.json({ user, sessionExpiresAt: sessionExpiresAt.toISOString() });
      });
    })(req, res, next);
  });

  router.post('/logout', (req, res, next) => {
    req.logOut((error) => {
      if (error) return next(error);
      req.session.destroy((destroyError) => {
        if (destroyError) return next(destroyError);
        res.clearCookie(sessionCookieName, { path: '/' }).status(204).end();
      });
    });
  });

  router.post('/password', requireSignIn, async (req, res) => {
    const input = parseOrThrow(changePasswordRequestSchema, req.body, 'password change');
    await changeOwnPassword(req.user!.id, input, { origin: originOf(req), keepSessionId: req.sessionID });
    res.status(204).end();
  });

  router.get('/me', requireSignIn, (req, res) => {
    res.set('Cache-Control', 'no-store').json({ user: req.user, sessionExpiresAt: sessionEndsAt(req)?.toISOString() });
  });

  return router;
}
