import type { Grant, GrantAccess, PublicUser } from '@cellwarden/shared';
import type { AccountsRepository } from '../accounts/accounts-repository';
import type { AuditService } from '../audit/audit-service';
import { invalidInput, notFound } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { GrantsRepository } from './grants-repository';
import { isUuid } from '../database/sql-values';

/** Longest a grant may run before the owner must renew it. */
export const MAX_GRANT_MS = 366 * 24 * 3600 * 1000;

/** Something that wants to hear when access to a system shrinks (the live stream). */
export type AccessChangeListener = (systemId: string) => void;

/** Owners grant and revoke access to one system; grantees list what they were given. */
export function createGrantsService(deps: {
  repository: Pick<GrantsRepository, 'listForSystem' | 'listReceived' | 'find' | 'create' | 'revoke'>;
  accounts: Pick<AccountsRepository, 'findCompany' | 'findByEmail'>;
  systems: Pick<SystemsService, 'getFor'>;
  audit: Pick<AuditService, 'record'>;
  now: () => number;
  onAccessRevoked?: AccessChangeListener;
}) {
  return {
    async list(user: PublicUser, systemId: string): Promise<Grant[]> {
      const system = await deps.systems.getFor(user, systemId, 'manage-grants');
      return deps.repository.listForSystem(system.id, deps.now());
    },

    listReceived: (user: PublicUser) => deps.repository.listReceived(user.id, user.companyId, deps.now()),

    async create(
      user: PublicUser,
      systemId: string,
      request: { granteeCompanyId?: string; granteeEmail?: string; access: GrantAccess; expiresAt: Date },
    ): Promise<Grant> {
      const system = await deps.systems.getFor(user, systemId, 'manage-grants');
      const now = deps.now();
      if (request.expiresAt.getTime() <= now)
        throw invalidInput('expiresAt', 'expiresAt must be in the future');
      if (request.expiresAt.getTime() > now + MAX_GRANT_MS)
        throw invalidInput('expiresAt', 'expiresAt must be within a year; renew the grant later');
      let granteeCompanyId: string | null = null;
      let granteeUserId: string | null = null;
      let granteeEmail: string | null = null;
      if (request.granteeCompanyId) {
        const company = await deps.accounts.findCompany(request.granteeCompanyId);
        if (!company) throw invalidInput('granteeCompanyId', 'No such company');
        granteeCompanyId = company.id;
      } else {
        granteeEmail = request.granteeEmail!.trim().toLowerCase();
        if (granteeEmail === user.email) throw invalidInput('granteeEmail', 'You already own this system');
        // An address without an account gets a grant that waits for one: the answer is the same either way.
        granteeUserId = (await deps.accounts.findByEmail(granteeEmail))?.id ?? null;
      }
      const id = await deps.repository.create({
        systemId: system.id,
        granteeCompanyId,
        granteeUserId,
        granteeEmail,
        access: request.access,
        grantedBy: user.id,
        expiresAt: request.expiresAt,
      });
      const grant = (await deps.repository.find(system.id, id, now))!;
      const grantee = grant.granteeCompany?.name ?? grant.granteeUser?.email ?? '';
      await deps.audit.record(
        system.id,
        user,
        'grant.created',
        `${request.access} for ${grantee} until ${request.expiresAt.toISOString()}`,
      );
      return grant;
    },

    async revoke(user: PublicUser, systemId: string, grantId: string): Promise<void> {
      const system = await deps.systems.getFor(user, systemId, 'manage-grants');
      const grant = isUuid(grantId) ? await deps.repository.find(system.id, grantId, deps.now()) : undefined;
      if (!grant) throw notFound('Grant');
      if (await deps.repository.revoke(system.id, grant.id)) {
        await deps.audit.record(
          system.id,
          user,
          'grant.revoked',
          grant.granteeCompany?.name ?? grant.granteeUser?.email ?? '',
        );
        deps.onAccessRevoked?.(system.id);
      }
    },
  };
}

export type GrantsService = ReturnType<typeof createGrantsService>;
