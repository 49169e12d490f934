import type { Request, RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator, type Store } from 'express-rate-limit';
import { slowDown } from 'express-slow-down';
import { AppError } from '../errors/app-error';

/** How many failed sign-ins are tolerated, and where the counters live. */
export interface SignInLimits {
  /** Failed sign-ins per account from one client address, then that address is refused for that account. */
  perAccount: number;
  /** Failed sign-ins per account from all addresses, after which every further try on it is slowed. */
  perAccountGlobal: number;
  /** Requests per client address, whatever the account. */
  perAddress: number;
  windowSeconds: number;
  /** Where the counters live, one store per limiter by name; absent keeps them in this process's memory. */
  store?: (name: string) => Store;
}

/** Each failure past the global allowance adds this much delay to the next try on that account. */
export const GLOBAL_DELAY_STEP_MS = 500;
/** The global back-off never holds a request longer than this. */
export const GLOBAL_DELAY_MAX_MS = 10_000;

const tooMany = (what: string) =>
  new AppError(
    'too_many_attempts',
    429,
    `Too many sign-in attempts ${what}; wait a few minutes and try again`,
  );

const accountOf = (req: Request) =>
  String(req.body?.email ?? '')
    .trim()
    .toLowerCase()
    .slice(0, 254);
// IPv6 clients are counted per /56 network, as express-rate-limit recommends (one host holds many addresses).
const addressOf = (req: Request) => ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? '');

/**
 * Brute-force brakes for sign-in and password-reset requests (OWASP Authentication Cheat Sheet, "Protect
 * against automated attacks"; the rule is ours):
 * - per client address: `perAddress` requests in the window, so one client cannot sweep many accounts;
 * - per account *and* address: `perAccount` failures, then that address is refused for that account only,
 *   so a stranger guessing from elsewhere never locks the owner out;
 * - per account from everywhere: past `perAccountGlobal` failures each try is delayed a little more (never
 *   refused), which slows a guesser spread over many addresses while the owner can still sign in.
 * Only failures count against an account.
 */
export function createSignInLimiters(limits: SignInLimits): RequestHandler[] {
  const windowMs = limits.windowSeconds * 1000;
  const common = { windowMs, standardHeaders: 'draft-8', legacyHeaders: false } as const;
  const perAddress = rateLimit({
    ...common,
    limit: limits.perAddress,
    ...(limits.store && { store: limits.store('address') }),
    keyGenerator: (req) => `address:${addressOf(req)}`,
    handler: (_req, _res, next) => next(tooMany('from this address')),
  });
  const perPair = rateLimit({
    ...common,
    limit: limits.perAccount,
    skipSuccessfulRequests: true,
    ...(limits.store && { store: limits.store('account-address') }),
    keyGenerator: (req) => `pair:${accountOf(req)}|${addressOf(req)}`,
    handler: (_req, _res, next) => next(tooMany('for this account from this address')),
  });
  const perAccountEverywhere = slowDown({
    windowMs,
    delayAfter: limits.perAccountGlobal,
    delayMs: (used) => Math.min((used - limits.perAccountGlobal) * GLOBAL_DELAY_STEP_MS, GLOBAL_DELAY_MAX_MS),
    maxDelayMs: GLOBAL_DELAY_MAX_MS,
    skipSuccessfulRequests: true,
    ...(limits.store && { store: limits.store('account') }),
    keyGenerator: (req) => `account:${accountOf(req)}`,
  });
  return [perAddress, perPair, perAccountEverywhere];
}
