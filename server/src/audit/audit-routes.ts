import type { Router } from 'express';
import { z } from 'zod';
import { epochMsSchema } from '@cellwarden/shared';
import type { AuditService } from './audit-service';
import { createSystemRouter } from '../systems/system-router';

const auditQuery = z.object({
  limit: z.coerce.number({ error: 'limit must be a number' }).int().min(1).max(500).optional(),
  before: epochMsSchema('before').optional(),
});

/** GET /api/systems/:systemId/audit. */
export function createAuditRoutes(audit: AuditService): Router {
  const router = createSystemRouter();
  router.get('/:systemId/audit', async (req, res) => {
    const query = auditQuery.parse(req.query);
    res.json({ entries: await audit.list(req.currentUser!, req.params.systemId, query) });
  });
  return router;
}
