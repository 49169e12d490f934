import { Router, type RequestParamHandler } from 'express';
import { idSchema } from '@cellwarden/shared';
import { notFound } from '../errors/app-error';

const systemId = idSchema('systemId');

/**
 * The `:systemId` check, once per router: an id that cannot be a system's (not a uuid) is answered as a system
 * not found, 404, the answer the access policy gives for a system one may not see, so a malformed id reveals
 * nothing more than a well-formed one. Runs after the sign-in check and before any handler reads the body.
 */
export const checkSystemId: RequestParamHandler = (_req, _res, next, value: string) =>
  next(systemId.safeParse(value).success ? undefined : notFound('System'));

/** A router for routes under /api/systems/:systemId, with the id checked before any of them runs. */
export function createSystemRouter(): Router {
  const router = Router();
  router.param('systemId', checkSystemId);
  return router;
}
