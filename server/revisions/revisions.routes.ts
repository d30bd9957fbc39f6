import { Router } from 'express';
import type { Logger } from 'pino';
import { contentCoverageRequestSchema, diffQuerySchema, reasonSchema, updateRevisionSchema } from '@shared/api/revisions';
import { AttachmentStore } from '../attachments/attachments.service';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { idParam } from '../middleware/id-param';
import * as revisions from './revisions.service';

/** `/api/revisions/:id` and its workflow steps. */
export function revisionsRoutes({ signingKeySecret, attachmentsDir, logger }: { signingKeySecret: string; attachmentsDir: string; logger?: Logger }): Router {
  const router = Router();
  const attachments = new AttachmentStore(attachmentsDir, logger);
  const id = (value: string | string[] | undefined) => idParam(value, 'That revision');

  // The envelope sweep of unsaved editor content (before '/:id', which it is not).
  router.post('/coverage', requireCapability('edit-speed-books'), (req, res) => {
    const { content } = parseOrThrow(contentCoverageRequestSchema, req.body, 'coverage');
    res.json({ report: revisions.contentCoverage(content) });
  });
  router.get('/:id', requireCapability('read-published'), async (req, res) => {
    res.json({ revision: await revisions.getRevision(actorOf(req), id(req.params['id'])) });
  });
  router.get('/:id/diff', requireCapability('read-published'), async (req, res) => {
    const revisionId = id(req.params['id']);
    const { against } = parseOrThrow(diffQuerySchema, req.query, 'comparison');
    res.json(await revisions.diffRevisions(actorOf(req), revisionId, Number(against)));
  });
  router.get('/:id/coverage', requireCapability('read-published'), async (req, res) => {
    res.json({ report: await revisions.revisionCoverage(actorOf(req), id(req.params['id'])) });
  });
  router.patch('/:id', requireCapability('edit-speed-books'), async (req, res) => {
    const revisionId = id(req.params['id']);
    const input = parseOrThrow(updateRevisionSchema, req.body, 'revision');
    res.json({ revision: await revisions.updateRevision(actorOf(req), revisionId, input) });
  });
  router.delete('/:id', requireCapability('edit-speed-books'), async (req, res) => {
    await revisions.discardDraft(actorOf(req), id(req.params['id']), attachments);
    res.status(204).end();
  });
  router.post('/:id/submit', requireCapability('edit-speed-books'), async (req, res) => {
    res.json({ revision: await revisions.submitRevision(actorOf(req), id(req.params['id'])) });
  });
  router.post('/:id/approve', requireCapability('publish-revisions'), async (req, res) => {
    res.json({ revision: await revisions.approveRevision(actorOf(req), id(req.params['id']), signingKeySecret) });
  });
  router.post('/:id/return', requireCapability('publish-revisions'), async (req, res) => {
    const revisionId = id(req.params['id']);
    const { reason } = parseOrThrow(reasonSchema, req.body, 'return');
    res.json({ revision: await revisions.returnRevision(actorOf(req), revisionId, reason) });
  });
  router.post('/:id/withdraw', requireCapability('publish-revisions'), async (req, res) => {
    const revisionId = id(req.params['id']);
    const { reason } = parseOrThrow(reasonSchema, req.body, 'withdrawal');
    res.json({ revision: await revisions.withdrawRevision(actorOf(req), revisionId, reason) });
  });
  return router;
}
