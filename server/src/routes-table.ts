import type { RequestHandler, Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { MonitorLatest } from '@cellwarden/shared';
import { createGrantsRoutes, createReceivedGrantsRoutes } from './access/grants-routes';
import type { GrantsService } from './access/grants-service';
import {
  createAccessRequestsRoutes,
  createSystemShareRoutes,
} from './access-requests/access-requests-routes';
import type { AccessRequestsService } from './access-requests/access-requests-service';
import type { createAccountsComponent } from './accounts/accounts-component';
import type { AccountsRepository } from './accounts/accounts-repository';
import { createAccountsRoutes } from './accounts/accounts-routes';
import { createCompaniesRoutes, createCompanyRoutes } from './accounts/company-routes';
import { createRequireUser } from './accounts/require-user';
import { createSignInLimiters, type SignInLimits } from './accounts/sign-in-limits';
import type { createAlertsComponent } from './alerts/alerts-component';
import { createAlertsRoutes } from './alerts/alerts-routes';
import { createAuditRoutes } from './audit/audit-routes';
import type { AuditService } from './audit/audit-service';
import { createDevicesRoutes } from './devices/devices-routes';
import type { DevicesService } from './devices/devices-service';
import { createHealthRoutes } from './health/health-routes';
import type { MailCatcher } from './mail/mail-catcher';
import { createMailOutboxRoutes } from './mail/mail-routes';
import { createHandoverRoutes, createOnboardingRoutes } from './onboarding/onboarding-routes';
import type { OnboardingService } from './onboarding/onboarding-service';
import { createPreferencesRoutes, createSettingsRoutes } from './settings/settings-routes';
import type { SettingsService } from './settings/settings-service';
import { createSystemsRoutes } from './systems/systems-routes';
import type { SystemsService } from './systems/systems-service';
import { createReadingsCsvRoutes } from './telemetry/readings-csv-routes';
import type { ReadingsCsvService } from './telemetry/readings-csv-service';
import { createReadingsRoutes } from './telemetry/readings-routes';
import type { ReadingsService } from './telemetry/readings-service';

/** One row of the table: where a router is mounted, and whether a request must be signed in to reach it. */
export interface MountedRouter {
  path: string;
  router: Router;
  access: 'public' | 'signed-in';
}

/** Every API router in mounting order, and the one sign-in check the signed-in rows go through. */
export interface RoutesTable {
  /** Verifies the token and reads the session once per request, however many signed-in rows it passes. */
  requireUser: RequestHandler;
  routers: MountedRouter[];
}

/**
 * The API's routers, read as a table: built from the services by the composition root and mounted by
 * createApp in this order. Order matters where paths share a prefix: the rows under /api/systems are tried in
 * turn, and a request that no row answers falls through to the API's 404.
 */
export function createRoutesTable(deps: {
  sequelize: Sequelize;
  jwtSecret: string;
  signInLimits: SignInLimits;
  people: ReturnType<typeof createAccountsComponent>;
  accountsRepository: AccountsRepository;
  systems: SystemsService;
  grants: GrantsService;
  devices: DevicesService;
  audit: AuditService;
  readings: ReadingsService;
  readingsCsv: ReadingsCsvService;
  alerting: Pick<ReturnType<typeof createAlertsComponent>, 'alerts' | 'analytics'>;
  monitors: (systemId: string) => Promise<MonitorLatest[]>;
  settings: SettingsService;
  onboarding: OnboardingService;
  accessRequests: AccessRequestsService;
  /** Routers a component builds itself, under /api/systems. */
  componentRouters: { installer: Router; installRegister: Router; batteryHealth: Router };
  mailCatcher: MailCatcher | undefined;
}): RoutesTable {
  const { people, systems } = deps;
  const requireUser = createRequireUser(people.accounts, deps.jwtSecret);
  const open = (path: string, router: Router): MountedRouter => ({ path, router, access: 'public' });
  const signedIn = (path: string, router: Router): MountedRouter => ({ path, router, access: 'signed-in' });
  const system = (router: Router) => signedIn('/api/systems', router);
  return {
    requireUser,
    routers: [
      open('/api/health', createHealthRoutes(deps.sequelize)),
      // Public, with the sign-in limiters on its sign-in routes and the check on its own signed-in ones.
      open(
        '/api/auth',
        createAccountsRoutes({
          accounts: people.accounts,
          invitations: people.invitations,
          passwordReset: people.passwordReset,
          requireUser,
          signInLimiters: createSignInLimiters(deps.signInLimits),
        }),
      ),
      signedIn(
        '/api/company',
        createCompanyRoutes({ members: people.companyMembers, invitations: people.invitations }),
      ),
      signedIn('/api/companies', createCompaniesRoutes(deps.accountsRepository)),
      signedIn('/api/grants', createReceivedGrantsRoutes(deps.grants)),
      system(createSystemsRoutes(systems)),
      system(createReadingsRoutes(deps.readings)),
      system(createGrantsRoutes(deps.grants)),
      system(createDevicesRoutes(deps.devices)),
      system(createAuditRoutes(deps.audit)),
      system(createReadingsCsvRoutes(deps.readingsCsv)),
      system(
        createAlertsRoutes({
          alerts: deps.alerting.alerts,
          systems,
          analytics: deps.alerting.analytics,
          monitors: deps.monitors,
        }),
      ),
      system(createSettingsRoutes(deps.settings)),
      system(deps.componentRouters.installer),
      system(deps.componentRouters.installRegister),
      system(createOnboardingRoutes(deps.onboarding)),
      system(createSystemShareRoutes(deps.accessRequests)),
      system(deps.componentRouters.batteryHealth),
      signedIn('/api/me', createPreferencesRoutes(deps.settings)),
      // Each person sees only the captured mail addressed to them; with a real SMTP service the list is empty.
      signedIn('/api/dev/mail', createMailOutboxRoutes(deps.mailCatcher)),
      signedIn('/api/handovers', createHandoverRoutes(deps.onboarding)),
      signedIn('/api/access-requests', createAccessRequestsRoutes(deps.accessRequests)),
    ],
  };
}
