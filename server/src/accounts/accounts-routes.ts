import { Router, type CookieOptions, type Request, type RequestHandler, type Response } from 'express';
import { MAX_PASSWORD_BYTES, MIN_PASSWORD_LENGTH } from '@cellwarden/shared';
import { z } from 'zod';
import type { AccountsService, IssuedSession } from './accounts-service';
import { REFRESH_TOKEN_TTL_MS } from './accounts-service';
import type { InvitationsService } from './invitations-service';
import type { PasswordResetService } from './password-reset-service';

/** The refresh token's cookie: httpOnly so page scripts never see it, only sent to the session routes. */
export const REFRESH_COOKIE = 'cw_refresh';
const COOKIE_PATH = '/api/auth';

const email = z
  .string({ error: 'email is required' })
  .trim()
  .toLowerCase()
  .email('email must be an e-mail address')
  .max(254);
const newPassword = z
  .string({ error: 'password is required' })
  .min(MIN_PASSWORD_LENGTH, `password must be at least ${MIN_PASSWORD_LENGTH} characters`)
  .refine(
    (p) => Buffer.byteLength(p, 'utf8') <= MAX_PASSWORD_BYTES,
    `password must be at most ${MAX_PASSWORD_BYTES} bytes (about ${MAX_PASSWORD_BYTES} letters, fewer with accents or symbols)`,
  );
const token = z
  .string({ error: 'token is required' })
  .regex(/^[A-Za-z0-9_-]{20,100}$/, 'token is not a valid link token');
const displayName = z
  .string({ error: 'displayName is required' })
  .trim()
  .min(1, 'displayName is required')
  .max(120, 'displayName must be at most 120 characters')
  .regex(/^[^\p{Cc}]*$/u, 'displayName must not contain control characters');

const signInBody = z.object({
  email,
  password: z.string({ error: 'password is required' }).min(1, 'password is required').max(1000),
});

function cookieOptions(req: Request): CookieOptions {
  return { httpOnly: true, sameSite: 'strict', secure: req.secure, path: COOKIE_PATH };
}

function sendSession(req: Request, res: Response, session: IssuedSession) {
  res.cookie(REFRESH_COOKIE, session.refreshToken, { ...cookieOptions(req), maxAge: REFRESH_TOKEN_TTL_MS });
  res.json(session.body);
}

/** Sign-in, session refresh and sign-out, who-am-I, invitations and password reset. */
export function createAccountsRoutes(deps: {
  accounts: AccountsService;
  invitations: InvitationsService;
  passwordReset: PasswordResetService;
  requireUser: RequestHandler;
  signInLimiters: RequestHandler[];
}): Router {
  const router = Router();
  router.post('/sign-in', ...deps.signInLimiters, async (req, res) => {
    const body = signInBody.parse(req.body ?? {});
    sendSession(req, res, await deps.accounts.signIn(body.email, body.password));
  });
  router.post('/refresh', async (req, res) => {
    try {
      sendSession(req, res, await deps.accounts.refresh(req.cookies?.[REFRESH_COOKIE]));
    } catch (error) {
      res.clearCookie(REFRESH_COOKIE, cookieOptions(req));
      throw error;
    }
  });
  router.post('/sign-out', async (req, res) => {
    await deps.accounts.signOut(req.cookies?.[REFRESH_COOKIE]);
    res.clearCookie(REFRESH_COOKIE, cookieOptions(req));
    res.status(204).end();
  });
  router.get('/me', deps.requireUser, (req, res) => {
    res.json({ user: req.currentUser });
  });
  router.post('/password', deps.requireUser, async (req, res) => {
    const body = z
      .object({
        currentPassword: z.string({ error: 'currentPassword is required' }).min(1).max(1000),
        newPassword: newPassword.refine((p) => p !== req.body?.currentPassword, {
          message: 'newPassword must differ from the current one',
        }),
      })
      .parse(req.body ?? {});
    await deps.accounts.changePassword(
      req.currentUser!.id,
      req.sessionId!,
      body.currentPassword,
      body.newPassword,
    );
    res.status(204).end();
  });
  router.post('/password-reset/request', ...deps.signInLimiters, async (req, res) => {
    const body = z.object({ email }).parse(req.body ?? {});
    deps.passwordReset.request(body.email);
    res.status(202).json({ message: 'If that address has an account, a reset link is on its way' });
  });
  router.post('/password-reset/complete', async (req, res) => {
    const body = z.object({ token, password: newPassword }).parse(req.body ?? {});
    await deps.passwordReset.complete(body.token, body.password);
    res.status(204).end();
  });
  router.get('/invitations/:token', async (req, res) => {
    res.json({ invitation: await deps.invitations.preview(token.parse(req.params.token)) });
  });
  router.post('/invitations/accept', async (req, res) => {
    const body = z.object({ token, displayName, password: newPassword }).parse(req.body ?? {});
    sendSession(req, res, await deps.invitations.accept(body.token, body.displayName, body.password));
  });
  return router;
}
