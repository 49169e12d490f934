import type { RequestHandler } from 'express';
import type { Role } from '@cellwarden/shared';
import { forbidden, notAuthenticated } from '../errors/app-error';

/** Middleware after `requireUser`: the signed-in person must hold `role`, else 403. */
export function requireRole(role: Role): RequestHandler {
  return (req, _res, next) => {
    if (!req.currentUser) throw notAuthenticated();
    if (!req.currentUser.roles.includes(role)) throw forbidden(`This needs the ${role} role`);
    next();
  };
}

/** Middleware after `requireUser`: admins only. */
export const requireAdmin: RequestHandler = requireRole('admin');
