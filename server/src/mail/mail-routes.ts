import { Router } from 'express';
import type { MailCatcher } from './mail-catcher';

/** GET / lists what the mail catcher holds; mount at /api/dev/mail behind sign-in and `requireAdmin`. */
export function createMailOutboxRoutes(catcher: Pick<MailCatcher, 'messages'>): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ messages: catcher.messages() });
  });
  return router;
}
