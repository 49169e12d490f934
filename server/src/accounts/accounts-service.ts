import { randomUUID } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { PublicUser, SessionResponse } from '@cellwarden/shared';
import { AppError, notAuthenticated } from '../errors/app-error';
import type { AccountsRepository, UserRecord } from './accounts-repository';
import { hashToken, newOneTimeToken } from './one-time-token';
import { verifyPassword } from './password-hashing';
import type { SessionsRepository } from './sessions-repository';

export type { PublicUser };

/** The one signing algorithm; verification refuses any other, so `alg: none` and key confusion fail. */
export const TOKEN_ALGORITHM = 'HS256';
export const TOKEN_AUDIENCE = 'cellwarden';
/** How long a sign-in lasts without use of the refresh token. */
export const REFRESH_TOKEN_TTL_MS = 30 * 24 * 3600 * 1000;

/** The public view of a stored user. */
export function toPublicUser(user: UserRecord): PublicUser {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    roles: user.roles,
    companyId: user.companyId,
  };
}

/** A session as the routes hand it out: the body, and the refresh token for the httpOnly cookie. */
export interface IssuedSession {
  body: SessionResponse;
  refreshToken: string;
}

// A fixed hash to compare against when the e-mail is unknown, so both cases take the same time.
const DUMMY_HASH = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.aK5Z5Tq3bZ2JtYfQGkGm8S3v5r6W';

/** Sign-in, token refresh with rotation, sign-out and access-token checks. */
export function createAccountsService(deps: {
  repository: AccountsRepository;
  sessions: SessionsRepository;
  jwtSecret: string;
  tokenTtlSeconds: number;
  now?: () => number;
}) {
  const now = deps.now ?? Date.now;

  async function issue(user: UserRecord, familyId: string = randomUUID()): Promise<IssuedSession> {
    const accessToken = jwt.sign({ roles: user.roles }, deps.jwtSecret, {
      algorithm: TOKEN_ALGORITHM,
      subject: user.id,
      audience: TOKEN_AUDIENCE,
      expiresIn: deps.tokenTtlSeconds,
      jwtid: randomUUID(),
    });
    const refresh = newOneTimeToken();
    await deps.sessions.insert({
      tokenHash: refresh.hash,
      familyId,
      userId: user.id,
      expiresAt: new Date(now() + REFRESH_TOKEN_TTL_MS),
    });
    return {
      body: { accessToken, expiresIn: deps.tokenTtlSeconds, user: toPublicUser(user) },
      refreshToken: refresh.token,
    };
  }

  return {
    issue,

    async signIn(email: string, password: string): Promise<IssuedSession> {
      const user = await deps.repository.findByEmail(email.trim().toLowerCase());
      const matches = await verifyPassword(password, user?.passwordHash ?? DUMMY_HASH);
      if (!user || !matches)
        throw new AppError('invalid_credentials', 401, 'E-mail or password is not correct');
      return issue(user);
    },

    /**
     * Trades a refresh token for a new pair. A token is good once: presenting a rotated one means it was
     * copied, so the whole sign-in (its family) is revoked.
     */
    async refresh(refreshToken: string | undefined): Promise<IssuedSession> {
      if (!refreshToken) throw notAuthenticated('No session to refresh; sign in');
      const hash = hashToken(refreshToken);
      const claimed = await deps.sessions.claimForRotation(hash);
      if (!claimed) {
        const family = await deps.sessions.findFamily(hash);
        if (family) await deps.sessions.revokeFamily(family);
        throw notAuthenticated('Session expired or signed out; sign in again');
      }
      const user = await deps.repository.findById(claimed.userId);
      if (!user) throw notAuthenticated('Session names no current user');
      return issue(user, claimed.familyId);
    },

    async signOut(refreshToken: string | undefined): Promise<void> {
      if (!refreshToken) return;
      const family = await deps.sessions.findFamily(hashToken(refreshToken));
      if (family) await deps.sessions.revokeFamily(family);
    },

    /** The user a token belongs to; throws 401 for any token that is not ours, expired or for a removed user. */
    async authenticateToken(token: string): Promise<PublicUser> {
      let subject: string | undefined;
      try {
        const claims = jwt.verify(token, deps.jwtSecret, {
          algorithms: [TOKEN_ALGORITHM],
          audience: TOKEN_AUDIENCE,
        });
        subject = typeof claims === 'object' ? claims.sub : undefined;
      } catch (error) {
        throw notAuthenticated(`Access token rejected: ${(error as Error).message}`);
      }
      const user = subject ? await deps.repository.findById(subject) : undefined;
      if (!user) throw notAuthenticated('Access token names no current user');
      return toPublicUser(user);
    },
  };
}

export type AccountsService = ReturnType<typeof createAccountsService>;
