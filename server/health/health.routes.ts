import { Router } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ReadinessProbe } from './readiness';

/**
 * Health for load balancers, supervisors and people (no session needed; `no-store`):
 *
 * - `GET /api/health`: 200 when the database answers, 503 when it does not (kept as it was);
 * - `GET /api/health/live`: 200 whenever the process answers at all — restart it when this fails;
 * - `GET /api/health/ready`: 200 when this instance should get traffic, 503 with the reason
 *   (`readiness.ts`) when it should not — take it out of the balancer, do not restart it.
 */
export function healthRoutes(sequelize: Sequelize, readiness: ReadinessProbe): Router {
  const router = Router();
  router.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  router.get('/', async (_req, res) => {
    let db: 'ok' | 'down' = 'ok';
    try {
      await Promise.race([
        sequelize.query('SELECT 1', { type: QueryTypes.SELECT }),
        new Promise((_resolve, reject) => setTimeout(() => reject(new Error('timeout')), 2000).unref()),
      ]);
    } catch {
      db = 'down';
    }
    res.status(db === 'ok' ? 200 : 503).json({ status: db === 'ok' ? 'ok' : 'degraded', db });
  });
  router.get('/live', (_req, res) => {
    res.status(200).json({ status: 'live' });
  });
  router.get('/ready', async (_req, res) => {
    const answer = await readiness.check();
    res.status(answer.status === 'ready' ? 200 : 503).json(answer);
  });
  return router;
}
