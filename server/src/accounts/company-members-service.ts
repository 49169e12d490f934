import { COMPANY_ROLES, type CompanyMember, type PublicUser, type Role } from '@cellwarden/shared';
import { isUuid } from '../database/sql-values';
import { forbidden, invalidInput, notFound } from '../errors/app-error';
import type { AccountLinksRepository } from './account-links-repository';
import type { AccountsRepository } from './accounts-repository';
import type { AccountsService } from './accounts-service';

/**
 * A company admin's people: change a member's roles, remove a member, withdraw an invitation. Every
 * change to what a person may do ends their sessions at once, so no token outlives the rights it carried.
 */
export function createCompanyMembersService(deps: {
  accounts: AccountsRepository;
  links: AccountLinksRepository;
  sessions: Pick<AccountsService, 'endAllSessions'>;
}) {
  function adminCompany(admin: PublicUser): string {
    if (!admin.roles.includes('admin') || !admin.companyId)
      throw forbidden('Only a company admin can manage members');
    return admin.companyId;
  }

  async function member(admin: PublicUser, userId: string) {
    const companyId = adminCompany(admin);
    if (userId === admin.id) throw forbidden('Ask another admin to change or remove your own membership');
    const found = isUuid(userId) ? await deps.accounts.findMember(companyId, userId) : undefined;
    if (!found) throw notFound('Member');
    return found;
  }

  return {
    async list(admin: PublicUser): Promise<CompanyMember[]> {
      return deps.accounts.listMembers(adminCompany(admin));
    },

    async setRoles(admin: PublicUser, userId: string, roles: Role[]): Promise<void> {
      const found = await member(admin, userId);
      const companyRoles = roles.filter((r) => COMPANY_ROLES.includes(r));
      if (companyRoles.length === 0)
        throw invalidInput(
          'roles',
          'roles must name installer, support or admin; to remove someone, remove them',
        );
      const kept = found.roles.includes('owner') ? (['owner'] as Role[]) : [];
      await deps.accounts.setRoles(found.id, [...kept, ...new Set(companyRoles)]);
      await deps.sessions.endAllSessions(found.id, 'roles-changed');
    },

    async remove(admin: PublicUser, userId: string): Promise<void> {
      const found = await member(admin, userId);
      await deps.accounts.leaveCompany(
        found.id,
        found.roles.filter((r) => !COMPANY_ROLES.includes(r)),
      );
      await deps.sessions.endAllSessions(found.id, 'removed-from-company');
    },

    async withdrawInvitation(admin: PublicUser, invitationId: string): Promise<void> {
      const companyId = adminCompany(admin);
      if (!isUuid(invitationId) || !(await deps.links.withdrawInvitation(companyId, invitationId)))
        throw notFound('Open invitation');
    },
  };
}

export type CompanyMembersService = ReturnType<typeof createCompanyMembersService>;
