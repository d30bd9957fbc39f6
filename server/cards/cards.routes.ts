import { Router, type RequestHandler } from 'express';
import { can } from '@shared/auth/roles';
import { cardIssueBatchSchema, cardIssueQuerySchema, cardPreviewRequestSchema } from '@shared/card/card-api';
import { actorOf } from '../middleware/request-actor';
import { DomainError, notFound } from '../errors/domain-error';
import { requireCapability } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { getCardIssue, listCardIssues, recordCardIssues } from './card-issues.service';
import { previewCard } from './cards.service';

/** `/api/cards`: the card preview, for the roles that prepare cards. */
export function cardsRoutes(): Router {
  const router = Router();
  router.post('/preview', requireCapability('prepare-cards'), async (req, res) => {
    const request = parseOrThrow(cardPreviewRequestSchema, req.body, 'card preview');
    res.json({ card: await previewCard(actorOf(req), request) });
  });
  return router;
}

/** Readers of the card log: the whole log with `read-card-log`, their own cards with `prepare-cards`. */
const requireLogReader: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new DomainError('unauthenticated', 'not_signed_in', 'Sign in to continue.'));
  if (!can(req.user.role, 'read-card-log') && !can(req.user.role, 'prepare-cards')) {
    return next(new DomainError('forbidden', 'forbidden', 'Your role may not do this.'));
  }
  next();
};

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** `/api/card-issues`: devices report issued cards; the card log is read here. */
export function cardIssuesRoutes(): Router {
  const router = Router();
  router.post('/', requireCapability('prepare-cards'), async (req, res) => {
    const batch = parseOrThrow(cardIssueBatchSchema, req.body, 'card log report');
    const entries = batch.entries.map((entry) => ({ ...entry, id: entry.id.toLowerCase() }));
    res.json({ results: await recordCardIssues(actorOf(req), entries) });
  });
  router.get('/', requireLogReader, async (req, res) => {
    const query = parseOrThrow(cardIssueQuerySchema, req.query, 'card log query');
    const actor = actorOf(req);
    res.json(await listCardIssues({ operatorId: actor.operatorId, userId: actor.userId, role: actor.role }, query));
  });
  router.get('/:id', requireLogReader, async (req, res) => {
    const id = String(req.params['id']);
    if (!UUID.test(id)) throw notFound('That card log entry');
    const actor = actorOf(req);
    res.json({ entry: await getCardIssue({ operatorId: actor.operatorId, userId: actor.userId, role: actor.role }, id.toLowerCase()) });
  });
  return router;
}
