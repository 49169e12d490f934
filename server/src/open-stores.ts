import { createGrantsRepository } from './access/grants-repository';
import { createAccessRequestsRepository } from './access-requests/access-requests-repository';
import { createAccountLinksRepository } from './accounts/account-links-repository';
import { createAccountsRepository } from './accounts/accounts-repository';
import { createSessionsRepository } from './accounts/sessions-repository';
import { createAlertsRepository } from './alerts/alerts-repository';
import { createAuditRepository } from './audit/audit-repository';
import { startClusterMode } from './cluster/cluster-mode';
import type { Config } from './config';
import { connectDatabase } from './database/connect-database';
import { initModels } from './database/models';
import { createDevicesRepository } from './devices/devices-repository';
import { createCommissioningRepository } from './installer/commissioning-repository';
import { createUploadsRepository } from './installer/uploads-repository';
import type { Logger } from './logger';
import { startMailCatcher } from './mail/mail-catcher';
import { createMailer } from './mail/mailer';
import { createOnboardingRepository } from './onboarding/onboarding-repository';
import { createSettingsRepository } from './settings/settings-repository';
import { createSystemsRepository } from './systems/systems-repository';
import { createReadingsRepository } from './telemetry/readings-repository';
import { migrateToLatest } from '../../db/migrator';

/**
 * The first step of the composition root: the database (migrated, models bound), the cluster bus and the read
 * replica when configured, and mail (the local catcher when no SMTP_URL is set). `close` shuts them in reverse.
 */
export async function openStores(config: Config, logger: Logger) {
  const sequelize = connectDatabase(config.DATABASE_URL);
  await migrateToLatest(sequelize, (m) => logger.debug('migration', { step: m }));
  initModels(sequelize);
  // Cluster mode and the read replica only by configuration: without them a single machine runs as ever.
  const cluster = config.REDIS_URL ? await startClusterMode(config.REDIS_URL, logger) : undefined;
  const reader = config.DATABASE_READ_URL ? connectDatabase(config.DATABASE_READ_URL) : undefined;
  const mailCatcher = config.SMTP_URL
    ? undefined
    : await startMailCatcher({ host: '127.0.0.1', port: 0, limit: 200, logger });
  const mailer = createMailer({
    smtpUrl: config.SMTP_URL || mailCatcher!.url,
    from: config.MAIL_FROM,
    logger,
  });
  return {
    sequelize,
    reader,
    cluster,
    mailCatcher,
    mailer,
    async close() {
      mailer.close();
      await mailCatcher?.stop();
      await cluster?.close();
      await reader?.close();
      await sequelize.close();
    },
  };
}

export type Stores = Awaited<ReturnType<typeof openStores>>;

/**
 * Every component's repository over the open stores (the components that own theirs, battery health and the
 * install register, build them inside). Reads that may go to the replica get `reader`.
 */
export function createRepositories({ sequelize, reader }: Pick<Stores, 'sequelize' | 'reader'>) {
  return {
    accounts: createAccountsRepository(sequelize),
    sessions: createSessionsRepository(sequelize),
    links: createAccountLinksRepository(sequelize),
    grants: createGrantsRepository(sequelize),
    systems: createSystemsRepository(sequelize, reader),
    audit: createAuditRepository(sequelize),
    readings: createReadingsRepository(sequelize, reader),
    alerts: createAlertsRepository(sequelize),
    settings: createSettingsRepository(sequelize),
    commissioning: createCommissioningRepository(sequelize),
    uploads: createUploadsRepository(sequelize),
    devices: createDevicesRepository(sequelize),
    onboarding: createOnboardingRepository(sequelize),
    accessRequests: createAccessRequestsRepository(sequelize),
  };
}

export type Repositories = ReturnType<typeof createRepositories>;
