import { Router } from 'express';
import type { Sequelize } from 'sequelize';

/** Liveness with the database's state: 200 when it answers, 503 while it is away. */
export function createHealthRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await sequelize.query('SELECT 1');
      res.json({ status: 'ok', database: 'up' });
    } catch {
      res.status(503).json({ status: 'degraded', database: 'down' });
    }
  });
  return router;
}
