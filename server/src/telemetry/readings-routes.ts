import { Router } from 'express';
import type { ReadingsService } from './readings-service';

/** History of a system's readings. */
export function createReadingsRoutes(readings: ReadingsService): Router {
  const router = Router();
  router.get('/:systemId/readings', async (req, res) => {
    res.json(await readings.history(req.currentUser!, req.params.systemId, req.query));
  });
  return router;
}
