import type { Router } from 'express';
import { SYSTEM_ACTIONS } from '@cellwarden/shared';
import type { SystemsService } from './systems-service';
import { createSystemRouter } from './system-router';

/** Systems the signed-in user may see. */
export function createSystemsRoutes(systems: SystemsService): Router {
  const router = createSystemRouter();
  router.get('/', async (req, res) => {
    res.json({ systems: await systems.listFor(req.currentUser!) });
  });
  router.get('/:systemId', async (req, res) => {
    const { system, access } = await systems.openFor(req.currentUser!, req.params.systemId);
    // In the rule's own order, so the list reads the same for everyone.
    const allowedActions = SYSTEM_ACTIONS.filter((action) => access.allowed.has(action));
    res.json({ system: { ...system, allowedActions } });
  });
  return router;
}
