import { Router } from 'express';
import { z } from 'zod';
import type { GrantsService } from './grants-service';
import { createSystemRouter } from '../systems/system-router';

const grantBody = z
  .object({
    granteeCompanyId: z.string().uuid('granteeCompanyId must be a company id').optional(),
    granteeEmail: z
      .string()
      .trim()
      .toLowerCase()
      .email('granteeEmail must be an e-mail address')
      .max(254)
      .optional(),
    access: z.enum(['view', 'configure'], { error: 'access must be view or configure' }),
    expiresAt: z.iso
      .datetime({ offset: true, error: 'expiresAt must be an ISO 8601 time' })
      .transform((t) => new Date(t)),
  })
  .refine((b) => !!b.granteeCompanyId !== !!b.granteeEmail, {
    message: 'give exactly one of granteeCompanyId or granteeEmail',
    path: ['granteeEmail'],
  });

/** Grants on one system (owner) under /api/systems. */
export function createGrantsRoutes(grants: GrantsService): Router {
  const router = createSystemRouter();
  router.get('/:systemId/grants', async (req, res) => {
    res.json({ grants: await grants.list(req.currentUser!, req.params.systemId) });
  });
  router.post('/:systemId/grants', async (req, res) => {
    const body = grantBody.parse(req.body ?? {});
    res.status(201).json({ grant: await grants.create(req.currentUser!, req.params.systemId, body) });
  });
  router.delete('/:systemId/grants/:grantId', async (req, res) => {
    await grants.revoke(req.currentUser!, req.params.systemId, req.params.grantId);
    res.status(204).end();
  });
  return router;
}

/** GET /api/grants/received: what was granted to me or my company. */
export function createReceivedGrantsRoutes(grants: GrantsService): Router {
  const router = Router();
  router.get('/received', async (req, res) => {
    res.json({ grants: await grants.listReceived(req.currentUser!) });
  });
  return router;
}
