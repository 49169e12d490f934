import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import type { AccountsService } from './accounts-service';

const signInBody = z.object({
  email: z.string({ error: 'email is required' }).trim().email('email must be an e-mail address').max(254),
  password: z.string({ error: 'password is required' }).min(1, 'password is required').max(1000),
});

/** Sign-in and who-am-I. */
export function createAccountsRoutes(accounts: AccountsService, requireUser: RequestHandler): Router {
  const router = Router();
  router.post('/sign-in', async (req, res) => {
    const { email, password } = signInBody.parse(req.body ?? {});
    res.json(await accounts.signIn(email, password));
  });
  router.get('/me', requireUser, (req, res) => {
    res.json({ user: req.currentUser });
  });
  return router;
}
