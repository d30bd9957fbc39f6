import { Router } from 'express';
import { createRevisionSchema, createSpeedBookSchema } from '@shared/api/revisions';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { createRevision } from '../revisions/revisions.service';
import { idParam } from '../middleware/id-param';
import { createSpeedBook, getSpeedBook, listSpeedBooks } from './speed-books.service';

/** `/api/speed-books`: every role reads (published revisions); engineers and approvers write. */
export function speedBooksRoutes(): Router {
  const router = Router();
  router.get('/', requireCapability('read-published'), async (req, res) => {
    res.json({ speedBooks: await listSpeedBooks(actorOf(req)) });
  });
  router.post('/', requireCapability('edit-speed-books'), async (req, res) => {
    const input = parseOrThrow(createSpeedBookSchema, req.body, 'speed book');
    res.status(201).json({ speedBook: await createSpeedBook(actorOf(req), input) });
  });
  router.get('/:id', requireCapability('read-published'), async (req, res) => {
    res.json({ speedBook: await getSpeedBook(actorOf(req), idParam(req.params['id'], 'That speed book')) });
  });
  router.post('/:id/revisions', requireCapability('edit-speed-books'), async (req, res) => {
    const id = idParam(req.params['id'], 'That speed book');
    const input = parseOrThrow(createRevisionSchema, req.body, 'revision');
    res.status(201).json({ revision: await createRevision(actorOf(req), id, input) });
  });
  return router;
}
