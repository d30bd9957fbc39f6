import { Router } from 'express';
import { auditQuerySchema } from '@shared/api/audit';
import { operatorScope, requireCapability } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { listAudit } from './audit-query.service';

/** `GET /api/audit`: the operator's audit trail (administrators, approvers, inspectors). */
export function auditRoutes(): Router {
  const router = Router();
  router.get('/', requireCapability('read-audit'), async (req, res) => {
    const query = parseOrThrow(auditQuerySchema, req.query, 'audit filter');
    res.set('Cache-Control', 'no-store').json(await listAudit(operatorScope(req), query));
  });
  return router;
}
