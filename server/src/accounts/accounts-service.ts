import { randomUUID } from 'node:crypto';
import type { PublicUser, SessionResponse } from '@cellwarden/shared';
import { AppError, notAuthenticated } from '../errors/app-error';
import { signAccessToken, verifyAccessToken, type AccessClaims } from './access-token';
import type { AccountsRepository, UserRecord } from './accounts-repository';
import { hashToken, newOneTimeToken } from './one-time-token';
import { exceedsHashInput, hashPassword, verifyPassword } from './password-hashing';
import type { SessionEndReason, SessionsRepository } from './sessions-repository';

export type { PublicUser };
export { TOKEN_ALGORITHM, TOKEN_AUDIENCE } from './access-token';
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

/** A signed-in person as an access token proves them, with the session and when the token lapses. */
export interface TokenHolder {
  user: PublicUser;
  sessionId: string;
  expiresAt: number;
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

  /** Starts a sign-in session (or continues `sessionId` on refresh) with a fresh token pair. */
  async function issue(user: UserRecord, sessionId?: string): Promise<IssuedSession> {
    if (!sessionId) {
      sessionId = randomUUID();
      await deps.sessions.startSession(sessionId, user.id);
    }
    const accessToken = signAccessToken(deps.jwtSecret, { userId: user.id, sessionId }, deps.tokenTtlSeconds);
    const refresh = newOneTimeToken();
    await deps.sessions.insert({
      tokenHash: refresh.hash,
      familyId: sessionId,
      userId: user.id,
      expiresAt: new Date(now() + REFRESH_TOKEN_TTL_MS),
    });
    return {
      body: { accessToken, expiresIn: deps.tokenTtlSeconds, user: toPublicUser(user) },
      refreshToken: refresh.token,
    };
  }

  async function userForClaims(claims: AccessClaims): Promise<PublicUser> {
    const user = await deps.sessions.openSessionUser(claims.sessionId, claims.userId);
    if (!user) throw notAuthenticated('Session ended; sign in again');
    return toPublicUser(user);
  }

  return {
    issue,

    async signIn(email: string, password: string): Promise<IssuedSession> {
      const user = await deps.repository.findByEmail(email.trim().toLowerCase());
      // A password longer than the hash reads cannot be the one set (new ones are refused at that length).
      const matches =
        !exceedsHashInput(password) && (await verifyPassword(password, user?.passwordHash ?? DUMMY_HASH));
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
        if (family) await deps.sessions.endSession(family, 'refresh-token-reused');
        throw notAuthenticated('Session expired or signed out; sign in again');
      }
      // The session row decides: one ended by a password reset or role change is not continued.
      const user = await deps.sessions.openSessionUser(claimed.familyId, claimed.userId);
      if (!user) throw notAuthenticated('Session ended; sign in again');
      return issue(user, claimed.familyId);
    },

    async signOut(refreshToken: string | undefined, sessionId?: string): Promise<void> {
      const family = refreshToken ? await deps.sessions.findFamily(hashToken(refreshToken)) : undefined;
      for (const id of new Set([family, sessionId])) if (id) await deps.sessions.endSession(id, 'signed-out');
    },

    /** The person behind verified claims while their session is open; 401 otherwise. */
    userForClaims,

    /** Checks a token completely (signature, claims, open session): the stream's path to the same answer. */
    async authenticateToken(token: string): Promise<TokenHolder> {
      let claims: AccessClaims;
      try {
        claims = verifyAccessToken(token, deps.jwtSecret);
      } catch (error) {
        throw notAuthenticated(`Access token rejected: ${(error as Error).message}`);
      }
      return { user: await userForClaims(claims), ...claims };
    },

    /** Changes one's own password; every other session of theirs ends, this one carries on. */
    async changePassword(userId: string, sessionId: string, current: string, next: string): Promise<void> {
      const user = await deps.repository.findById(userId);
      if (!user || exceedsHashInput(current) || !(await verifyPassword(current, user.passwordHash)))
        throw new AppError('invalid_credentials', 400, 'Current password is not correct', 'currentPassword');
      await deps.repository.setPassword(userId, await hashPassword(next));
      await deps.sessions.endAllForUser(userId, 'password-changed', sessionId);
    },

    /** Ends every session of a person (their roles changed, or they left a company). */
    endAllSessions: (userId: string, reason: SessionEndReason) => deps.sessions.endAllForUser(userId, reason),
  };
}

export type AccountsService = ReturnType<typeof createAccountsService>;
