import type { Router } from 'express';
import type { ReadingsService } from './readings-service';
import { createSystemRouter } from '../systems/system-router';

/** History of a system's readings. */
export function createReadingsRoutes(readings: ReadingsService): Router {
  const router = createSystemRouter();
  router.get('/:systemId/readings', async (req, res) => {
    res.json(await readings.history(req.currentUser!, req.params.systemId, req.query));
  });
  return router;
}
