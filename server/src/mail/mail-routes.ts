import { Router } from 'express';
import { notAuthenticated } from '../errors/app-error';
import type { CapturedMail } from './captured-mail';
import type { MailCatcher } from './mail-catcher';

/** What GET /api/dev/mail answers: whether the catcher runs, and the signed-in person's captured mail. */
export interface OwnCapturedMail {
  /** False when the server sends through a real SMTP service: nothing is kept, nothing to show. */
  catcher: boolean;
  /** The address the messages were filtered by: the signed-in person's own. */
  address: string;
  /** Newest first; `to` lists only the person's own address, never other recipients. */
  messages: CapturedMail[];
}

/**
 * GET / lists the captured messages addressed to the signed-in person, and nothing else: the catcher
 * stands in for an SMTP service, and nobody — a company admin included — may read another person's mail
 * (a password-reset link in it would hand over the account). Mount behind sign-in at /api/dev/mail.
 */
export function createMailOutboxRoutes(catcher: Pick<MailCatcher, 'messages'> | undefined): Router {
  const router = Router();
  router.get('/', (req, res) => {
    if (!req.currentUser) throw notAuthenticated();
    const address = req.currentUser.email.trim().toLowerCase();
    const answer: OwnCapturedMail = { catcher: catcher !== undefined, address, messages: [] };
    for (const mail of catcher?.messages() ?? []) {
      const own = mail.to.filter((recipient) => recipient.trim().toLowerCase() === address);
      if (own.length > 0) answer.messages.push({ ...mail, to: own });
    }
    res.json(answer);
  });
  return router;
}
