import { Router } from 'express';
import { z } from 'zod';
import { ROLES } from '@cellwarden/shared';
import type { AccountsRepository } from './accounts-repository';
import type { CompanyMembersService } from './company-members-service';
import type { InvitationsService } from './invitations-service';

const roles = z
  .array(
    z.enum(ROLES, {
      error: `roles may hold ${ROLES.join(', ')}`,
    }),
  )
  .min(1, 'roles must name at least one role')
  .max(ROLES.length);
const invitationBody = z.object({
  email: z
    .string({ error: 'email is required' })
    .trim()
    .toLowerCase()
    .email('email must be an e-mail address')
    .max(254),
  roles,
});

/** A company admin's view of their people: members and invitations. */
export function createCompanyRoutes(deps: {
  members: CompanyMembersService;
  invitations: InvitationsService;
}): Router {
  const router = Router();
  router.get('/members', async (req, res) => {
    res.json({ members: await deps.members.list(req.currentUser!) });
  });
  router.put('/members/:userId/roles', async (req, res) => {
    const body = z.object({ roles }).parse(req.body ?? {});
    await deps.members.setRoles(req.currentUser!, req.params.userId, body.roles);
    res.status(204).end();
  });
  router.delete('/members/:userId', async (req, res) => {
    await deps.members.remove(req.currentUser!, req.params.userId);
    res.status(204).end();
  });
  router.delete('/invitations/:invitationId', async (req, res) => {
    await deps.members.withdrawInvitation(req.currentUser!, req.params.invitationId);
    res.status(204).end();
  });
  router.get('/invitations', async (req, res) => {
    res.json({ invitations: await deps.invitations.list(req.currentUser!) });
  });
  router.post('/invitations', async (req, res) => {
    const body = invitationBody.parse(req.body ?? {});
    res.status(201).json({
      invitation: await deps.invitations.invite(req.currentUser!, body.email, [...new Set(body.roles)]),
    });
  });
  return router;
}

/** Companies an owner may grant access to. */
export function createCompaniesRoutes(accounts: AccountsRepository): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    res.json({ companies: await accounts.listCompanies() });
  });
  return router;
}
