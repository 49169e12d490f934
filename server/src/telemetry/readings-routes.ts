import type { Router } from 'express';
import { toHistoryColumns } from '@cellwarden/shared';
import type { ReadingsService } from './readings-service';
import { createSystemRouter } from '../systems/system-router';

/** History of a system's readings, sent as columns (shared/src/api/history-columns.ts). */
export function createReadingsRoutes(readings: ReadingsService): Router {
  const router = createSystemRouter();
  router.get('/:systemId/readings', async (req, res) => {
    const { resolution, points } = await readings.history(req.currentUser!, req.params.systemId, req.query);
    res.json({ resolution, columns: toHistoryColumns(points) });
  });
  return router;
}
