import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import type { AccountLinksRepository } from './account-links-repository';
import { createAccountMail } from './account-mail-sender';
import type { AccountsRepository } from './accounts-repository';
import { createAccountsService } from './accounts-service';
import { createCompanyMembersService } from './company-members-service';
import { createInvitationsService } from './invitations-service';
import { createPasswordResetService } from './password-reset-service';
import type { SessionsRepository } from './sessions-repository';

/** The accounts component's services: sign-in and sessions, invitations, password resets, company members. */
export function createAccountsComponent(deps: {
  repository: AccountsRepository;
  sessions: SessionsRepository;
  links: AccountLinksRepository;
  mailer: Mailer;
  jwtSecret: string;
  tokenTtlSeconds: number;
  publicUrl: () => string;
  logger: Logger;
  now: () => number;
  /** Runs when an invitation creates an account (grants and systems waiting for that address become its). */
  onAccountCreated: (email: string, userId: string) => Promise<void>;
}) {
  const accounts = createAccountsService({
    repository: deps.repository,
    sessions: deps.sessions,
    jwtSecret: deps.jwtSecret,
    tokenTtlSeconds: deps.tokenTtlSeconds,
    now: deps.now,
  });
  const linkDeps = {
    links: deps.links,
    accounts: deps.repository,
    mail: createAccountMail(deps.mailer),
    now: deps.now,
    publicUrl: deps.publicUrl,
    logger: deps.logger,
  };
  return {
    accounts,
    invitations: createInvitationsService({
      ...linkDeps,
      sessions: accounts,
      onAccountCreated: deps.onAccountCreated,
    }),
    passwordReset: createPasswordResetService({ ...linkDeps, sessions: deps.sessions }),
    companyMembers: createCompanyMembersService({
      accounts: deps.repository,
      links: deps.links,
      sessions: accounts,
    }),
  };
}
