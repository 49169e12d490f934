import type { Invitation, InvitationPreview, PublicUser, Role } from '@cellwarden/shared';
import { AppError, forbidden } from '../errors/app-error';
import type { Logger } from '../logger';
import type { AccountLinksRepository, InvitationRecord } from './account-links-repository';
import type { AccountMail } from './account-mail';
import type { AccountsRepository } from './accounts-repository';
import type { AccountsService, IssuedSession } from './accounts-service';
import { hashToken, newOneTimeToken } from './one-time-token';
import { hashPassword } from './password-hashing';

/** How long an invitation link stays good. */
export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

const invitationGone = () =>
  new AppError(
    'invitation_invalid',
    410,
    'This invitation was already used or has expired; ask for a new one',
    'token',
  );

function toInvitation(record: InvitationRecord & { id: string }): Invitation {
  return {
    id: record.id,
    email: record.email,
    roles: record.roles,
    expiresAt: record.expiresAt.getTime(),
    acceptedAt: record.acceptedAt?.getTime() ?? null,
  };
}

/** Company admins invite people by e-mail; the link, used once before it expires, creates the account. */
export function createInvitationsService(deps: {
  links: AccountLinksRepository;
  accounts: AccountsRepository;
  sessions: AccountsService;
  mail: AccountMail;
  publicUrl: () => string;
  now: () => number;
  logger: Logger;
  /** Told of each new account, so grants made out to its address before it existed apply from now on. */
  onAccountCreated?: (email: string, userId: string) => Promise<void>;
}) {
  // Whether the address already signs in decides which mail goes out, never what the inviter is told.
  async function sendInvitation(email: string, companyId: string, link: string, expiresAt: Date) {
    const company = await deps.accounts.findCompany(companyId);
    if (await deps.accounts.findByEmail(email))
      await deps.mail.sendInvitationToExistingAccount(email, company?.name ?? null);
    else await deps.mail.sendInvitation(email, link, company?.name ?? null, expiresAt);
  }

  return {
    /**
     * Records the invitation and answers at once; the mail goes out afterwards. The answer is the same
     * whether or not the address has an account, so inviting cannot be used to probe addresses.
     */
    async invite(admin: PublicUser, email: string, roles: Role[]): Promise<Invitation> {
      if (!admin.roles.includes('admin') || !admin.companyId)
        throw forbidden('Only a company admin can invite');
      const { token, hash } = newOneTimeToken();
      const expiresAt = new Date(deps.now() + INVITATION_TTL_MS);
      const id = await deps.links.createInvitation({
        tokenHash: hash,
        email,
        roles,
        companyId: admin.companyId,
        invitedBy: admin.id,
        expiresAt,
      });
      sendInvitation(email, admin.companyId, `${deps.publicUrl()}/invitation/${token}`, expiresAt).catch(
        (error) => deps.logger.warn('invitation mail not sent', { error: String(error) }),
      );
      return { id, email, roles, expiresAt: expiresAt.getTime(), acceptedAt: null };
    },

    async list(admin: PublicUser): Promise<Invitation[]> {
      if (!admin.roles.includes('admin') || !admin.companyId)
        throw forbidden('Only a company admin can see invitations');
      return (await deps.links.listInvitations(admin.companyId)).map(toInvitation);
    },

    async preview(token: string): Promise<InvitationPreview> {
      const record = await deps.links.findInvitation(hashToken(token));
      if (!record || record.acceptedAt || record.expiresAt.getTime() <= deps.now()) throw invitationGone();
      return {
        email: record.email,
        roles: record.roles,
        companyName: record.companyName,
        expiresAt: record.expiresAt.getTime(),
      };
    },

    async accept(token: string, displayName: string, password: string): Promise<IssuedSession> {
      const record = await deps.links.claimInvitation(hashToken(token));
      if (!record) throw invitationGone();
      if (await deps.accounts.findByEmail(record.email))
        throw new AppError(
          'account_exists',
          409,
          'This address already has a Cellwarden sign-in; sign in instead',
          'token',
        );
      const user = await deps.accounts.createUser({
        email: record.email,
        displayName,
        passwordHash: await hashPassword(password),
        roles: record.roles,
        companyId: record.companyId,
      });
      await deps.onAccountCreated?.(user.email, user.id);
      return deps.sessions.issue(user);
    },
  };
}

export type InvitationsService = ReturnType<typeof createInvitationsService>;
