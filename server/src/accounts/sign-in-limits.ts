import type { RequestHandler } from 'express';
import { rateLimit, type Store } from 'express-rate-limit';
import { AppError } from '../errors/app-error';

/** How many failed sign-ins are tolerated per account and per client address within the window. */
export interface SignInLimits {
  perAccount: number;
  perAddress: number;
  windowSeconds: number;
  /** Where the counters live, one store per limiter by name; absent keeps them in this process's memory. */
  store?: (name: string) => Store;
}

const tooMany = (what: string) =>
  new AppError(
    'too_many_attempts',
    429,
    `Too many sign-in attempts for this ${what}; wait a few minutes and try again`,
  );

/**
 * Brute-force brakes for sign-in and password-reset requests: one counter per e-mail address tried (so a
 * botnet cannot guess one person's password) and one per client address (so one client cannot sweep many
 * accounts). Only failures count against the account.
 */
export function createSignInLimiters(limits: SignInLimits): RequestHandler[] {
  const windowMs = limits.windowSeconds * 1000;
  const perAccount = rateLimit({
    windowMs,
    limit: limits.perAccount,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    ...(limits.store && { store: limits.store('account') }),
    keyGenerator: (req) =>
      `account:${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}`,
    handler: (_req, _res, next) => next(tooMany('account')),
  });
  const perAddress = rateLimit({
    windowMs,
    limit: limits.perAddress,
    ...(limits.store && { store: limits.store('address') }),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(tooMany('address')),
  });
  return [perAddress, perAccount];
}
