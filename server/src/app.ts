import cookieParser from 'cookie-parser';
import cors from 'cors';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { notFound } from './errors/app-error';
import { createErrorHandler } from './errors/error-handler';
import type { Logger } from './logger';
import type { RoutesTable } from './routes-table';
import { createWebHosting } from './web-hosting';

/** Everything the HTTP app needs, built by the composition root (or a test). */
export interface AppDeps {
  logger: Logger;
  /** Express "trust proxy": false, or the proxies whose X-Forwarded-For is believed. */
  trustProxy: boolean | number | string;
  /** Every API router in mounting order, public or signed in (routes-table.ts). */
  routes: RoutesTable;
  corsOrigins: string[];
  webDist?: string;
}

/** Builds the Express app; it does not listen. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  // Every API answer is no-store, so a browser never revalidates one: hashing each body for an ETag (a whole
  // history series, say) would be work for nothing. Static files keep the ETags serve-static gives them.
  app.set('etag', false);
  // Off unless configured: otherwise anyone could choose, through X-Forwarded-For, the address their
  // sign-in attempts are counted against.
  app.set('trust proxy', deps.trustProxy);
  app.use(helmet({ contentSecurityPolicy: { directives: { 'upgrade-insecure-requests': null } } }));
  // Closed by default: the dashboard is served from the same origin and needs no CORS at all.
  app.use(
    '/api',
    cors({ origin: deps.corsOrigins.length > 0 ? deps.corsOrigins : false, credentials: true }),
  );
  // API answers carry personal data and short-lived state: no browser or proxy keeps a copy.
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use(express.json({ limit: '256kb' }));
  app.use(cookieParser());
  // One loop over the table: a signed-in row runs the sign-in check first (it answers 401 before the router is
  // tried, and passes at once when an earlier row already signed the request in).
  const { requireUser, routers } = deps.routes;
  for (const { path, router, access } of routers)
    if (access === 'public') app.use(path, router);
    else app.use(path, requireUser, router);
  app.use('/api', () => {
    throw notFound('Route');
  });
  const web = deps.webDist ? createWebHosting(deps.webDist) : undefined;
  if (web) app.use(web);
  app.use(createErrorHandler(deps.logger));
  return app;
}
