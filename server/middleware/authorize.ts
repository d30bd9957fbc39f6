import '../auth/session-user';
import type { RequestHandler, Response } from 'express';
import { can, type Capability } from '@shared/auth/roles';
import { DomainError } from '../errors/domain-error';

/** The 401 of a request nobody is signed in for; it says so when the 12 hours of a sign-in ran out. */
function signedOut(res: Response): DomainError {
  return res.locals['sessionEnded']
    ? new DomainError('unauthenticated', 'session_expired', 'Your sign-in is 12 hours old, so it has ended. Sign in again to continue.')
    : new DomainError('unauthenticated', 'not_signed_in', 'Sign in to continue.');
}

/** 401 unless someone is signed in. */
export const requireSignIn: RequestHandler = (req, res, next) => {
  if (!req.user) {
    next(signedOut(res));
    return;
  }
  next();
};

/** 401 when signed out, 403 unless the signed-in role holds `capability`. */
export function requireCapability(capability: Capability): RequestHandler {
  return (req, res, next) => {
    if (!req.user) {
      next(signedOut(res));
      return;
    }
    if (!can(req.user.role, capability)) {
      next(new DomainError('forbidden', 'forbidden', 'Your role may not do this.'));
      return;
    }
    next();
  };
}

/**
 * The operator every query of this request is limited to. Services take it as their first
 * argument so no query can forget it.
 */
export function operatorScope(req: Express.Request): number {
  if (!req.user) throw new DomainError('unauthenticated', 'not_signed_in', 'Sign in to continue.');
  return req.user.operatorId;
}
