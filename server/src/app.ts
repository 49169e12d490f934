import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import type { Sequelize } from 'sequelize';
import { createAccountsRoutes } from './accounts/accounts-routes';
import type { AccountsRepository } from './accounts/accounts-repository';
import type { AccountsService } from './accounts/accounts-service';
import { createRequireUser } from './accounts/require-user';
import { notFound } from './errors/app-error';
import { createErrorHandler } from './errors/error-handler';
import { createHealthRoutes } from './health/health-routes';
import type { Logger } from './logger';
import { createSystemsRoutes } from './systems/systems-routes';
import type { SystemsService } from './systems/systems-service';
import type { IngestService } from './ingest/ingest-service';
import { createWebHosting } from './web-hosting';
import { createReadingsRoutes } from './telemetry/readings-routes';
import type { ReadingsService } from './telemetry/readings-service';

/** Everything the HTTP app needs, built by main (or a test). */
export interface AppDeps {
  sequelize: Sequelize;
  logger: Logger;
  jwtSecret: string;
  accountsRepository: AccountsRepository;
  accounts: AccountsService;
  systems: SystemsService;
  readings: ReadingsService;
  ingest?: IngestService;
  webDist?: string;
}

/** Builds the Express app; it does not listen. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(express.json({ limit: '256kb' }));
  app.use(cookieParser());
  const requireUser = createRequireUser(deps.accountsRepository, deps.jwtSecret);

  app.use('/api/health', createHealthRoutes(deps.sequelize));
  app.use('/api/auth', createAccountsRoutes(deps.accounts, requireUser));
  app.use('/api/systems', requireUser, createSystemsRoutes(deps.systems));
  app.use('/api/systems', requireUser, createReadingsRoutes(deps.readings));
  app.use('/api', () => {
    throw notFound('Route');
  });
  const web = deps.webDist ? createWebHosting(deps.webDist) : undefined;
  if (web) app.use(web);
  app.use(createErrorHandler(deps.logger));
  return app;
}
