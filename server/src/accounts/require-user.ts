import type { RequestHandler } from 'express';
import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { notAuthenticated } from '../errors/app-error';
import type { AccountsRepository } from './accounts-repository';
import { TOKEN_ALGORITHM, TOKEN_AUDIENCE, toPublicUser, type PublicUser } from './accounts-service';

declare module 'express-serve-static-core' {
  interface Request {
    currentUser?: PublicUser;
  }
}

/** Middleware: a valid bearer token (algorithm pinned) naming a current user, or 401. */
export function createRequireUser(repository: AccountsRepository, jwtSecret: string): RequestHandler {
  const authenticator = new passport.Passport();
  authenticator.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
        secretOrKey: jwtSecret,
        algorithms: [TOKEN_ALGORITHM],
        audience: TOKEN_AUDIENCE,
      },
      (payload: { sub?: string }, done: (error: unknown, user?: PublicUser | false) => void) => {
        if (!payload.sub) return done(null, false);
        repository.findById(payload.sub).then(
          (user) => done(null, user ? toPublicUser(user) : false),
          (error) => done(error),
        );
      },
    ),
  );
  return (req, res, next) => {
    authenticator.authenticate('jwt', { session: false }, (error: unknown, user: PublicUser | false) => {
      if (error) return next(error);
      if (!user) return next(notAuthenticated());
      req.currentUser = user;
      next();
    })(req, res, next);
  };
}
