import { Router } from 'express';
import { syncQuerySchema } from '@shared/api/sync';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { syncSince } from './sync.service';

/** `/api/sync`: the published data of the signed-in person's operator, as changes since a cursor. */
export function syncRoutes({ signingKeySecret }: { signingKeySecret: string }): Router {
  const router = Router();
  router.get('/', requireCapability('read-published'), async (req, res) => {
    const { cursor } = parseOrThrow(syncQuerySchema, req.query, 'query');
    res.setHeader('Cache-Control', 'no-store');
    res.json(await syncSince(actorOf(req), cursor, signingKeySecret));
  });
  return router;
}
