import { Router } from 'express';
import { QueryTypes, type Sequelize } from 'sequelize';

/** `GET /api/health`: 200 when the database answers, 503 when it does not. Needs no session. */
export function healthRoutes(sequelize: Sequelize): Router {
  const router = Router();
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
    res
      .status(db === 'ok' ? 200 : 503)
      .set('Cache-Control', 'no-store')
      .json({ status: db === 'ok' ? 'ok' : 'degraded', db });
  });
  return router;
}
