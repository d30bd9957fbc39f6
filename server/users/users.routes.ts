import { Router } from 'express';
import { actorOf } from '../middleware/request-actor';
import { invitePersonRequestSchema, updatePersonRequestSchema } from '@shared/api/auth';
import { operatorScope, requireCapability } from '../middleware/authorize';
import { idParam } from '../middleware/id-param';
import { parseOrThrow } from '../middleware/validate';
import { invitePerson, listOperatorPeople, resendInvitation, updatePerson } from './users.service';

/** `/api/users`: the operator's people (administrators). */
export function usersRoutes(): Router {
  const router = Router();
  router.use(requireCapability('manage-people'));

  router.get('/', async (req, res) => {
    res.json({ users: await listOperatorPeople(operatorScope(req)) });
  });

  router.post('/', async (req, res) => {
    const input = parseOrThrow(invitePersonRequestSchema, req.body, 'invitation');
    res.status(201).json(await invitePerson(actorOf(req), input));
  });

  router.patch('/:id', async (req, res) => {
    const userId = idParam(req.params['id'], 'That person');
    const input = parseOrThrow(updatePersonRequestSchema, req.body, 'change');
    res.json({ user: await updatePerson(actorOf(req), userId, input) });
  });

  router.post('/:id/invitation', async (req, res) => {
    const userId = idParam(req.params['id'], 'That person');
    res.status(201).json(await resendInvitation(actorOf(req), userId));
  });

  return router;
}
