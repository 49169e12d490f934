import type { RequestHandler } from 'express';
import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { notAuthenticated } from '../errors/app-error';
import { readAccessClaims, TOKEN_ALGORITHM, TOKEN_AUDIENCE, tokenKey } from './access-token';
import type { AccountsService, PublicUser } from './accounts-service';

declare module 'express-serve-static-core' {
  interface Request {
    currentUser?: PublicUser;
    /** The sign-in session the request's access token belongs to. */
    sessionId?: string;
  }
}

type SignedIn = { user: PublicUser; sessionId: string };

/**
 * Middleware: a valid bearer token (algorithm and audience pinned, every required claim present) whose
 * sign-in session is still open, or 401. passport-jwt checks the signature and expiry; the claims and the
 * session go through the same `userForClaims` the live stream uses.
 */
export function createRequireUser(accounts: AccountsService, jwtSecret: string): RequestHandler {
  const authenticator = new passport.Passport();
  authenticator.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        // A key object (see tokenKey), which passport-jwt hands to jsonwebtoken as it is; its types say string.
        secretOrKey: tokenKey(jwtSecret) as unknown as string,
        algorithms: [TOKEN_ALGORITHM],
        audience: TOKEN_AUDIENCE,
      },
      (payload: unknown, done: (error: unknown, user?: SignedIn | false) => void) => {
        const claims = readAccessClaims(payload);
        if (!claims) return done(null, false);
        accounts.userForClaims(claims).then(
          (user) => done(null, { user, sessionId: claims.sessionId }),
          (error: { status?: number }) => (error?.status === 401 ? done(null, false) : done(error)),
        );
      },
    ),
  );
  return (req, res, next) => {
    // Every signed-in row of the routes table runs this check, so a request passing several rows before its
    // route would otherwise verify its token and read its session once per row (seven times for /status).
    if (req.currentUser) return next();
    authenticator.authenticate('jwt', { session: false }, (error: unknown, signedIn: SignedIn | false) => {
      if (error) return next(error);
      if (!signedIn) return next(notAuthenticated());
      req.currentUser = signedIn.user;
      req.sessionId = signedIn.sessionId;
      next();
    })(req, res, next);
  };
}
