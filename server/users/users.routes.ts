import { Router } from 'express';
import { operatorScope, requireCapability } from '../middleware/authorize';
import { listOperatorPeople } from './users.service';

/** `/api/users`: the operator's people (administrators). */
export function usersRoutes(): Router {
  const router = Router();
  router.get('/', requireCapability('manage-people'), async (req, res) => {
    res.json({ users: await listOperatorPeople(operatorScope(req)) });
  });
  return router;
}
