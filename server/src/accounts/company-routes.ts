import { Router } from 'express';
import { z } from 'zod';
import { forbidden } from '../errors/app-error';
import type { AccountsRepository } from './accounts-repository';
import type { InvitationsService } from './invitations-service';

const invitationBody = z.object({
  email: z
    .string({ error: 'email is required' })
    .trim()
    .toLowerCase()
    .email('email must be an e-mail address')
    .max(254),
  roles: z
    .array(
      z.enum(['owner', 'installer', 'support', 'admin'], {
        error: 'roles may hold owner, installer, support, admin',
      }),
    )
    .min(1, 'roles must name at least one role')
    .max(4),
});

/** A company admin's view of their people: members and invitations. */
export function createCompanyRoutes(deps: {
  accounts: AccountsRepository;
  invitations: InvitationsService;
}): Router {
  const router = Router();
  router.get('/members', async (req, res) => {
    const user = req.currentUser!;
    if (!user.roles.includes('admin') || !user.companyId)
      throw forbidden('Only a company admin can list members');
    res.json({ members: await deps.accounts.listMembers(user.companyId) });
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
