import type { Request } from 'express';
import type { Role } from '../../shared/auth/roles';
import { operatorScope } from '../middleware/authorize';

/** Who is acting, for whom, from where: what services need to scope, check and audit a change. */
export interface Actor {
  operatorId: number;
  userId: number;
  role: Role;
  req?: Request;
}

/** The signed-in person of `req` as an actor (401 when nobody is signed in). */
export function actorOf(req: Request): Actor {
  const operatorId = operatorScope(req);
  const user = req.user as Express.User;
  return { operatorId, userId: user.id, role: user.role, req };
}
