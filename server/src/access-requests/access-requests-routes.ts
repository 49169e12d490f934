import { Router } from 'express';
import { z } from 'zod';
import { parseNamingEveryField } from '../onboarding/every-field';
import type { AccessRequestsService } from './access-requests-service';
import { createSystemRouter } from '../systems/system-router';

const note = z
  .string({ error: 'note must be text' })
  .trim()
  .max(300, 'note must be at most 300 characters')
  .regex(/^[^\p{Cc}]*$/u, 'note must not contain control characters')
  .optional();

const byCode = z.object({
  shareCode: z.string({ error: 'shareCode must be text' }).max(40, 'shareCode is too long'),
  note,
});
const byOwnerAndName = z.object({
  ownerEmail: z
    .string({ error: 'ownerEmail is required' })
    .trim()
    .toLowerCase()
    .max(254, 'ownerEmail must be at most 254 characters')
    .email('ownerEmail must be an e-mail address'),
  systemName: z
    .string({ error: 'systemName is required' })
    .trim()
    .min(1, 'systemName is required')
    .max(120, 'systemName must be at most 120 characters')
    .regex(/^[^\p{Cc}]*$/u, 'systemName must not contain control characters'),
  note,
});

// By which form the body is meant decides which fields are named when it is wrong.
const parseRequest = (body: unknown) =>
  body && typeof body === 'object' && 'shareCode' in body
    ? parseNamingEveryField(byCode, body)
    : parseNamingEveryField(byOwnerAndName, body);

const approvalBody = z.object({
  access: z.enum(['view', 'configure'], { error: 'access must be view or configure' }),
  expiresAt: z.iso
    .datetime({ offset: true, error: 'expiresAt must be an ISO 8601 time' })
    .transform((t) => new Date(t)),
});

/** /api/access-requests: support people ask; owners list, approve and decline. */
export function createAccessRequestsRoutes(requests: AccessRequestsService): Router {
  const router = Router();
  router.post('/', async (req, res) => {
    const body = parseRequest(req.body);
    res.status(202).json({ request: await requests.request(req.currentUser!, body) });
  });
  router.get('/outgoing', async (req, res) => {
    res.json({ requests: await requests.listOutgoing(req.currentUser!) });
  });
  router.get('/incoming', async (req, res) => {
    res.json({ requests: await requests.listIncoming(req.currentUser!) });
  });
  router.post('/:requestId/approve', async (req, res) => {
    const body = parseNamingEveryField(approvalBody, req.body);
    res.json({ grant: await requests.approve(req.currentUser!, req.params.requestId, body) });
  });
  router.post('/:requestId/decline', async (req, res) => {
    await requests.decline(req.currentUser!, req.params.requestId);
    res.status(204).end();
  });
  return router;
}

/** Under /api/systems: the owner's share codes and one system's pending requests. */
export function createSystemShareRoutes(requests: AccessRequestsService): Router {
  const router = createSystemRouter();
  router.post('/:systemId/share-codes', async (req, res) => {
    res.status(201).json(await requests.createShareCode(req.currentUser!, req.params.systemId));
  });
  router.get('/:systemId/access-requests', async (req, res) => {
    res.json({ requests: await requests.listIncoming(req.currentUser!, req.params.systemId) });
  });
  return router;
}
