import '../auth/session-user';
import type { RequestHandler } from 'express';
import { can, type Capability } from '../../shared/auth/roles';
import { HttpError } from '../http-error';

/** 401 unless someone is signed in. */
export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) {
    next(new HttpError(401, 'not_signed_in', 'Sign in to continue.'));
    return;
  }
  next();
};

/** 401 when signed out, 403 unless the signed-in role holds `capability`. */
export function requireCapability(capability: Capability): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) {
      next(new HttpError(401, 'not_signed_in', 'Sign in to continue.'));
      return;
    }
    if (!can(req.user.role, capability)) {
      next(new HttpError(403, 'forbidden', 'Your role may not do this.'));
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
  if (!req.user) throw new HttpError(401, 'not_signed_in', 'Sign in to continue.');
  return req.user.operatorId;
}
