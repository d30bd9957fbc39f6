import type { Request } from 'express';
import type { Actor, RequestOrigin } from '../audit/actor';
import { operatorScope } from './authorize';

/** The request's address and user agent, as the audit trail keeps them. */
export function originOf(req: Request): RequestOrigin {
  return { ip: req.ip ?? null, userAgent: req.get('user-agent') ?? null };
}

/** The signed-in person of `req` as an actor (401 when nobody is signed in). */
export function actorOf(req: Request): Actor {
  const operatorId = operatorScope(req);
  const user = req.user as Express.User;
  return { operatorId, userId: user.id, role: user.role, origin: originOf(req), sendsMail: true };
}
