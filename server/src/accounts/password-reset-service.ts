import { AppError } from '../errors/app-error';
import type { Logger } from '../logger';
import type { AccountLinksRepository } from './account-links-repository';
import type { AccountMail } from './account-mail';
import type { AccountsRepository } from './accounts-repository';
import { hashToken, newOneTimeToken } from './one-time-token';
import { hashPassword } from './password-hashing';
import type { SessionsRepository } from './sessions-repository';

/** How long a password-reset link stays good. */
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/** Password reset by an e-mailed one-time link; completing it ends every existing session. */
export function createPasswordResetService(deps: {
  links: AccountLinksRepository;
  accounts: AccountsRepository;
  sessions: SessionsRepository;
  mail: AccountMail;
  publicUrl: () => string;
  now: () => number;
  logger: Logger;
}) {
  async function sendLink(email: string): Promise<void> {
    const user = await deps.accounts.findByEmail(email);
    if (!user) return;
    const { token, hash } = newOneTimeToken();
    const expiresAt = new Date(deps.now() + PASSWORD_RESET_TTL_MS);
    // The newest link is the only good one: issuing it voids every older one of this person.
    await deps.links.createPasswordReset({ tokenHash: hash, userId: user.id, expiresAt });
    await deps.mail.sendPasswordReset(user.email, `${deps.publicUrl()}/password-reset/${token}`, expiresAt);
  }

  return {
    /**
     * Starts sending a link when the address is known and returns at once, before any lookup: the answer
     * takes the same time and says the same words either way, so addresses cannot be probed.
     */
    request(email: string): void {
      sendLink(email).catch((error) =>
        deps.logger.warn('password reset link not sent', { error: String(error) }),
      );
    },

    async complete(token: string, password: string): Promise<void> {
      const userId = await deps.links.claimPasswordReset(hashToken(token));
      if (!userId)
        throw new AppError(
          'reset_invalid',
          410,
          'This reset link was already used or has expired; ask for a new one',
          'token',
        );
      await deps.accounts.setPassword(userId, await hashPassword(password));
      await deps.links.voidPasswordResets(userId);
      await deps.sessions.endAllForUser(userId, 'password-reset');
    },
  };
}

export type PasswordResetService = ReturnType<typeof createPasswordResetService>;
