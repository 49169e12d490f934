import cookieParser from 'cookie-parser';
import cors from 'cors';
import express, { type Express, type RequestHandler, type Router } from 'express';
import helmet from 'helmet';
import type { Sequelize } from 'sequelize';
import { createGrantsRoutes, createReceivedGrantsRoutes } from './access/grants-routes';
import type { GrantsService } from './access/grants-service';
import type { AccountsRepository } from './accounts/accounts-repository';
import { createAccountsRoutes } from './accounts/accounts-routes';
import type { AccountsService } from './accounts/accounts-service';
import type { CompanyMembersService } from './accounts/company-members-service';
import { createCompaniesRoutes, createCompanyRoutes } from './accounts/company-routes';
import type { InvitationsService } from './accounts/invitations-service';
import type { PasswordResetService } from './accounts/password-reset-service';
import { createRequireUser } from './accounts/require-user';
import { createSignInLimiters, type SignInLimits } from './accounts/sign-in-limits';
import { createAuditRoutes } from './audit/audit-routes';
import type { AuditService } from './audit/audit-service';
import { createDevicesRoutes } from './devices/devices-routes';
import type { DevicesService } from './devices/devices-service';
import { notFound } from './errors/app-error';
import { createErrorHandler } from './errors/error-handler';
import { createHealthRoutes } from './health/health-routes';
import type { IngestService } from './ingest/ingest-service';
import type { Logger } from './logger';
import { createSystemsRoutes } from './systems/systems-routes';
import type { SystemsService } from './systems/systems-service';
import { createReadingsRoutes } from './telemetry/readings-routes';
import type { ReadingsService } from './telemetry/readings-service';
import { createWebHosting } from './web-hosting';

/** Everything the HTTP app needs, built by the composition root (or a test). */
export interface AppDeps {
  sequelize: Sequelize;
  logger: Logger;
  jwtSecret: string;
  accountsRepository: AccountsRepository;
  accounts: AccountsService;
  invitations: InvitationsService;
  passwordReset: PasswordResetService;
  companyMembers: CompanyMembersService;
  signInLimits: SignInLimits;
  /** Express "trust proxy": false, or the proxies whose X-Forwarded-For is believed. */
  trustProxy: boolean | number | string;
  systems: SystemsService;
  grants: GrantsService;
  devices: DevicesService;
  audit: AuditService;
  readings: ReadingsService;
  ingest?: IngestService;
  /** Further routers under /api/systems (alerts, settings, installer tools), mounted after sign-in. */
  systemRouters?: Router[];
  /** Further signed-in routers by path (e.g. /api/me, /api/dev/mail). */
  signedInRouters?: Record<string, Router>;
  corsOrigins: string[];
  webDist?: string;
}

/** Builds the Express app; it does not listen. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
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
  const requireUser: RequestHandler = createRequireUser(deps.accounts, deps.jwtSecret);

  app.use('/api/health', createHealthRoutes(deps.sequelize));
  app.use(
    '/api/auth',
    createAccountsRoutes({
      accounts: deps.accounts,
      invitations: deps.invitations,
      passwordReset: deps.passwordReset,
      requireUser,
      signInLimiters: createSignInLimiters(deps.signInLimits),
    }),
  );
  app.use(
    '/api/company',
    requireUser,
    createCompanyRoutes({ members: deps.companyMembers, invitations: deps.invitations }),
  );
  app.use('/api/companies', requireUser, createCompaniesRoutes(deps.accountsRepository));
  app.use('/api/grants', requireUser, createReceivedGrantsRoutes(deps.grants));
  for (const router of [
    createSystemsRoutes(deps.systems),
    createReadingsRoutes(deps.readings),
    createGrantsRoutes(deps.grants),
    createDevicesRoutes(deps.devices),
    createAuditRoutes(deps.audit),
    ...(deps.systemRouters ?? []),
  ])
    app.use('/api/systems', requireUser, router);
  for (const [path, router] of Object.entries(deps.signedInRouters ?? {})) app.use(path, requireUser, router);
  app.use('/api', () => {
    throw notFound('Route');
  });
  const web = deps.webDist ? createWebHosting(deps.webDist) : undefined;
  if (web) app.use(web);
  app.use(createErrorHandler(deps.logger));
  return app;
}
