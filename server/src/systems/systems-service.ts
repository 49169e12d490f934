import type { PublicUser } from '@cellwarden/shared';
import { decideAccess, type AccessDecision, type SystemAction } from '../access/access-policy';
import type { GrantsRepository } from '../access/grants-repository';
import { isUuid } from '../database/sql-values';
import { forbidden, notFound } from '../errors/app-error';
import type { OwnedSystem, StoredSystem, SystemsRepository } from './systems-repository';

/** A system together with what the asking person may do with it. */
export interface SystemWithAccess {
  system: StoredSystem;
  access: AccessDecision;
}

/** Opening systems through the access policy: the only path by which routes and the stream reach a system. */
export function createSystemsService(deps: {
  repository: Pick<SystemsRepository, 'findById' | 'findOwnership' | 'listVisible'>;
  grants: Pick<GrantsRepository, 'factsForSystem'>;
  now: () => number;
}) {
  /** The system as `load` reads it with the rule's decision, when the user may at least view it. */
  async function open<S extends OwnedSystem>(
    user: PublicUser,
    systemId: string,
    load: (id: string) => Promise<S | undefined>,
  ): Promise<{ system: S; access: AccessDecision } | undefined> {
    if (!isUuid(systemId)) return undefined;
    const now = deps.now();
    // Both are keyed by the id asked for, so they are read side by side rather than one after the other.
    const [system, grants] = await Promise.all([load(systemId), deps.grants.factsForSystem(systemId, now)]);
    if (!system) return undefined;
    const access = decideAccess(user, system, grants, now);
    return access.allowed.has('view') ? { system, access } : undefined;
  }

  /** 404 when it does not exist or may not even be viewed (its existence is not revealed), 403 without `action`. */
  function permit<T extends { access: AccessDecision }>(opened: T | undefined, action: SystemAction): T {
    if (!opened) throw notFound('System');
    if (!opened.access.allowed.has(action))
      throw forbidden(`Your access to this system does not include "${action}"`);
    return opened;
  }

  return {
    listFor(user: PublicUser) {
      return deps.repository.listVisible({
        userId: user.id,
        companyId: user.companyId,
        seesCompanySystems: user.roles.includes('installer') || user.roles.includes('admin'),
        now: deps.now(),
      });
    },

    /**
     * A system the user may act on. 404 when it does not exist or they may not even view it (its existence
     * is not revealed); 403 when they may view it but not do `action`.
     */
    async getFor(user: PublicUser, systemId: string, action: SystemAction = 'view'): Promise<StoredSystem> {
      return (await this.openFor(user, systemId, action)).system;
    },

    /** Like getFor, with the decision itself (the stream keeps its expiry). */
    async openFor(
      user: PublicUser,
      systemId: string,
      action: SystemAction = 'view',
    ): Promise<SystemWithAccess> {
      return permit(await open(user, systemId, deps.repository.findById), action);
    },

    /**
     * Like getFor, for a route that needs only the system's id: the same decision, without reading the
     * system's latest reading and flags (a history request would otherwise pay for them on every call).
     */
    async authorize(user: PublicUser, systemId: string, action: SystemAction = 'view'): Promise<OwnedSystem> {
      return permit(await open(user, systemId, deps.repository.findOwnership), action).system;
    },
  };
}

export type SystemsService = ReturnType<typeof createSystemsService>;
