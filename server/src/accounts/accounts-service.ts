import jwt from 'jsonwebtoken';
import { AppError, notAuthenticated } from '../errors/app-error';
import type { AccountsRepository, UserRecord } from './accounts-repository';
import { verifyPassword } from './password-hashing';

/** What the API tells a client about a signed-in person. */
export interface PublicUser {
  id: string;
  email: string;
  displayName: string;
  roles: string[];
  companyId: string | null;
}

/** The one signing algorithm; verification refuses any other, so `alg: none` and key confusion fail. */
export const TOKEN_ALGORITHM = 'HS256';
export const TOKEN_AUDIENCE = 'cellwarden';

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

// A fixed hash to compare against when the e-mail is unknown, so both cases take the same time.
const DUMMY_HASH = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.aK5Z5Tq3bZ2JtYfQGkGm8S3v5r6W';

/** Sign-in and token checks. */
export function createAccountsService(deps: {
  repository: AccountsRepository;
  jwtSecret: string;
  tokenTtlSeconds: number;
}) {
  return {
    async signIn(email: string, password: string) {
      const user = await deps.repository.findByEmail(email.trim().toLowerCase());
      const matches = await verifyPassword(password, user?.passwordHash ?? DUMMY_HASH);
      if (!user || !matches)
        throw new AppError('invalid_credentials', 401, 'E-mail or password is not correct');
      const accessToken = jwt.sign({ roles: user.roles }, deps.jwtSecret, {
        algorithm: TOKEN_ALGORITHM,
        subject: user.id,
        audience: TOKEN_AUDIENCE,
        expiresIn: deps.tokenTtlSeconds,
      });
      return { accessToken, expiresIn: deps.tokenTtlSeconds, user: toPublicUser(user) };
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
