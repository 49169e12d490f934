import { Router } from 'express';
import type { Sequelize } from 'sequelize';

/** Longest the database may take to answer before health reports it down: a frozen server must not hang us. */
export const HEALTH_TIMEOUT_MS = 2000;

function withTimeout<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms);
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}

/** Liveness with the database's state: 200 when it answers in time, 503 while it is away or stuck. */
export function createHealthRoutes(sequelize: Sequelize, timeoutMs = HEALTH_TIMEOUT_MS): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await withTimeout(sequelize.query('SELECT 1'), timeoutMs);
      res.json({ status: 'ok', database: 'up' });
    } catch {
      res.status(503).json({ status: 'degraded', database: 'down' });
    }
  });
  return router;
}
