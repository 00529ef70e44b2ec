import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { appVersion } from '../version';

/** GET /api/health: the process answers and the database takes a query. */
export function healthRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      res.json({ status: 'ok', db: 'ok', version: appVersion });
    } catch (err) {
      console.error('[arcwright] health check: database query failed:', err);
      res.status(503).json({ error: 'database unavailable', status: 'degraded', db: 'error', version: appVersion });
    }
  });
  return router;
}
