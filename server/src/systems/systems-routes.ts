import { Router } from 'express';
import type { SystemsService } from './systems-service';

/** Systems the signed-in user may see. */
export function createSystemsRoutes(systems: SystemsService): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    res.json({ systems: await systems.listFor(req.currentUser!) });
  });
  router.get('/:systemId', async (req, res) => {
    res.json({ system: await systems.getFor(req.currentUser!, req.params.systemId) });
  });
  return router;
}
