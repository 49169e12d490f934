import { createServer, type Server } from 'node:http';
import type { AlertEvent } from '@cellwarden/shared';
import type { AddressInfo } from 'node:net';
import { createGrantsRepository } from './access/grants-repository';
import { createGrantsService } from './access/grants-service';
import { createAccountLinksRepository } from './accounts/account-links-repository';
import { createAccountMail } from './accounts/account-mail-sender';
import { createAccountsRepository } from './accounts/accounts-repository';
import { createAccountsService } from './accounts/accounts-service';
import { createCompanyMembersService } from './accounts/company-members-service';
import { createInvitationsService } from './accounts/invitations-service';
import { createPasswordResetService } from './accounts/password-reset-service';
import { createSessionsRepository } from './accounts/sessions-repository';
import { createAlertNotices } from './alerts/alert-notices';
import { createAlertsRepository } from './alerts/alerts-repository';
import { createAlertsRoutes } from './alerts/alerts-routes';
import { createAlertsService } from './alerts/alerts-service';
import { createLiveAnalytics } from './alerts/live-analytics';
import { createApp } from './app';
import { createCommissioningRecordService } from './installer/commissioning-record-service';
import { createCommissioningRepository } from './installer/commissioning-repository';
import { createCommissioningService } from './installer/commissioning-service';
import { createEnergyBudgetsService } from './installer/energy-budgets-service';
import { createInstallerRoutes } from './installer/installer-routes';
import { createInstallRegisterComponent } from './install-register/install-register-component';
import { createUploadsRepository } from './installer/uploads-repository';
import { createUploadsService } from './installer/uploads-service';
import { createUploadStorage } from './uploads/upload-storage';
import { createAuditRepository } from './audit/audit-repository';
import { createAuditService } from './audit/audit-service';
import { createBrokerPolicy } from './broker/broker-policy';
import { startMqttBroker } from './broker/mqtt-broker';
import { startClusterMode } from './cluster/cluster-mode';
import type { Config } from './config';
import { connectDatabase } from './database/connect-database';
import { initModels } from './database/models';
import { createDevicesRepository } from './devices/devices-repository';
import { createDevicesService } from './devices/devices-service';
import { createDeviceRefusals } from './broker/device-refusals';
import { createOnboardingRepository } from './onboarding/onboarding-repository';
import { createHandoverRoutes, createOnboardingRoutes } from './onboarding/onboarding-routes';
import { createOnboardingService } from './onboarding/onboarding-service';
import { createAccessRequestsRepository } from './access-requests/access-requests-repository';
import {
  createAccessRequestsRoutes,
  createSystemShareRoutes,
} from './access-requests/access-requests-routes';
import { createAccessRequestsService } from './access-requests/access-requests-service';
import { createShareCodeLimits } from './access-requests/share-code-limits';
import { startBatteryHealth } from './battery-health/battery-health-component';
import { createBatchWriter } from './ingest/batch-writer';
import { createIngestService } from './ingest/ingest-service';
import type { Logger } from './logger';
import { startMailCatcher, type MailCatcher } from './mail/mail-catcher';
import { createMailOutboxRoutes } from './mail/mail-routes';
import { createMailer } from './mail/mailer';
import { createSettingsRepository } from './settings/settings-repository';
import { createPreferencesRoutes, createSettingsRoutes } from './settings/settings-routes';
import { createSettingsService } from './settings/settings-service';
import { attachLiveStream } from './stream/live-stream-server';
import { createSystemsRepository } from './systems/systems-repository';
import { createSystemsService } from './systems/systems-service';
import { createReadingsHub } from './telemetry/readings-hub';
import { createReadingsRepository } from './telemetry/readings-repository';
import { createReadingsCsvRoutes } from './telemetry/readings-csv-routes';
import { createReadingsCsvService } from './telemetry/readings-csv-service';
import { createReadingsService } from './telemetry/readings-service';
import { migrateToLatest } from '../../db/migrator';
import { Router } from 'express';

/** A running Cellwarden node: HTTP (API, dashboard, stream) and the MQTT broker. */
export interface RunningServer {
  httpPort: number;
  mqttPort: number;
  http: Server;
  ingest: ReturnType<typeof createIngestService>;
  /** The local SMTP catcher, when no SMTP_URL was configured. */
  mailCatcher: MailCatcher | undefined;
  stop(): Promise<void>;
}

/** Wires every collaborator and starts listening; `stop` closes them in reverse order. */
export async function startServer(
  config: Config,
  logger: Logger,
  now: () => number = Date.now,
): Promise<RunningServer> {
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
  let publicUrl = config.PUBLIC_URL ?? '';

  const accountsRepository = createAccountsRepository(sequelize);
  const sessions = createSessionsRepository(sequelize);
  const accounts = createAccountsService({
    repository: accountsRepository,
    sessions,
    jwtSecret: config.JWT_SECRET,
    tokenTtlSeconds: config.ACCESS_TOKEN_TTL_SECONDS,
    now,
  });
  const links = createAccountLinksRepository(sequelize);
  const accountMail = createAccountMail(mailer);
  const linkDeps = {
    links,
    accounts: accountsRepository,
    mail: accountMail,
    now,
    publicUrl: () => publicUrl,
    logger,
  };
  const grantsRepository = createGrantsRepository(sequelize);
  const invitations = createInvitationsService({
    ...linkDeps,
    sessions: accounts,
    onAccountCreated: async (email, userId) => {
      await grantsRepository.attachWaiting(email, userId);
      // Systems an installer set up for this address become the new account's (onboarding).
      await acceptWaitingSystems(email, userId);
    },
  });
  const passwordReset = createPasswordResetService({ ...linkDeps, sessions });

  const systems = createSystemsService({
    repository: createSystemsRepository(sequelize, reader),
    grants: grantsRepository,
    now,
  });
  const audit = createAuditService({ repository: createAuditRepository(sequelize), systems, logger });
  let onAccessRevoked: (systemId: string) => void = () => undefined;
  let acceptWaitingSystems: (email: string, userId: string) => Promise<void> = async () => undefined;
  const grants = createGrantsService({
    repository: grantsRepository,
    accounts: accountsRepository,
    systems,
    audit,
    now,
    onAccessRevoked: (systemId) => onAccessRevoked(systemId),
  });
  const readingsRepository = createReadingsRepository(sequelize, reader);
  const readings = createReadingsService({ systems, repository: readingsRepository, audit, now });
  const hub = cluster?.hub ?? createReadingsHub();
  const alertsRepository = createAlertsRepository(sequelize);
  const publishAlert = (alert: AlertEvent) =>
    hub.publish({ systemId: alert.systemId, message: { type: 'alert', systemId: alert.systemId, alert } });
  const alerts = createAlertsService({
    repository: alertsRepository,
    systems,
    audit,
    notices: createAlertNotices({ repository: alertsRepository, mailer, logger, now }),
    logger,
    publish: publishAlert,
  });
  const settingsRepository = createSettingsRepository(sequelize);
  const analytics = createLiveAnalytics({
    settings: settingsRepository,
    alerts,
    readings: readingsRepository,
    alertsRepository,
    publish: publishAlert,
    logger,
    now,
  });
  const settings = createSettingsService({
    repository: settingsRepository,
    systems,
    audit,
    onChanged: (systemId) => analytics.settingsChanged(systemId),
  });
  const silenceSweep = setInterval(() => {
    analytics.sweepSilence().catch((error) => logger.warn('silence check failed', { error: String(error) }));
  }, config.SILENCE_CHECK_SECONDS * 1000);
  silenceSweep.unref();
  const installRegister = createInstallRegisterComponent({
    sequelize,
    systems,
    audit,
    settings: settingsRepository,
    alerts,
    alertsRepository,
    logger,
    now,
  });
  const commissioningRepository = createCommissioningRepository(sequelize);
  await commissioningRepository.abandonRunning();
  const checks = createCommissioningService({
    repository: commissioningRepository,
    settings: settingsRepository,
    systems,
    audit,
    logger,
    now,
    registeredRatingA: (systemId, sourceId) => installRegister.register.sourceRatingA(systemId, sourceId),
  });
  const uploadStorage = createUploadStorage({ root: config.UPLOAD_DIR });
  const uploads = createUploadsService({
    repository: createUploadsRepository(sequelize),
    storage: uploadStorage,
    systems,
    audit,
  });
  const installerRoutes = createInstallerRoutes({
    checks,
    uploads,
    uploadMiddleware: uploadStorage.middleware(),
    record: createCommissioningRecordService({
      systems,
      settings: settingsRepository,
      checks: commissioningRepository,
      uploads,
      accounts: accountsRepository,
      mailer,
      audit,
      now,
      installRegister: installRegister.forRecord,
    }),
    budgets: createEnergyBudgetsService({ sequelize, systems, readings: readingsRepository, now }),
  });
  const batteryHealth = startBatteryHealth({
    sequelize,
    systems,
    settings: settingsRepository,
    audit,
    logger,
    now,
  });
  const devicesRepository = createDevicesRepository(sequelize);
  const writer = createBatchWriter({
    repository: readingsRepository,
    logger,
    batchSize: config.INGEST_BATCH_SIZE,
    retryMs: config.INGEST_RETRY_MS,
    queueLimit: config.INGEST_QUEUE_LIMIT,
    onStored: (rows) => {
      const lastSeen = new Map<string, number>();
      const receivedAt = now();
      for (const { systemId, reading } of rows) checks.onReading(systemId, reading);
      for (const { deviceId, reading } of rows)
        lastSeen.set(deviceId, Math.max(lastSeen.get(deviceId) ?? 0, reading.measuredAt));
      // Each reading goes live as soon as the analytics have run on it, not after the whole batch's (an alert
      // stored for one reading must not hold up the rest); the order within each system is kept.
      for (const row of rows)
        void analytics.process([row]).then(([derived]) =>
          hub.publish({
            systemId: row.systemId,
            message: {
              type: 'reading',
              systemId: row.systemId,
              reading: { ...row.reading, receivedAt, deviceId: row.deviceId },
              derived,
            },
          }),
        );
      devicesRepository
        .markSeen(lastSeen)
        .catch((error) => logger.warn('last seen not updated', { error: String(error) }));
    },
  });
  // Why the broker refused each monitor, for the onboarding screen (bounded; this node's counts).
  const refusals = createDeviceRefusals({ now });
  const ingest = createIngestService({
    writer,
    logger,
    now,
    onRefused: (deviceId, code) =>
      refusals.count(deviceId, code === 'foreign_topic' ? 'topic' : 'payload', code),
  });
  let mqttPort = 0;
  const devices = createDevicesService({
    repository: devicesRepository,
    systems,
    audit,
    brokerPort: () => mqttPort,
    brokerUrl: () => brokerUrl,
    onCredentialsChanged: (deviceId) => {
      brokerPolicy.credentialsChanged(deviceId);
      refusals.forget(deviceId);
    },
  });
  const brokerPolicy = createBrokerPolicy({ devices, ingest, logger, refusals });
  const broker = await startMqttBroker({
    host: config.HOST,
    port: config.MQTT_PORT,
    policy: brokerPolicy,
    logger,
    mq: cluster?.broker.mq,
    persistence: cluster?.broker.persistence,
  });
  mqttPort = broker.port;
  const brokerHost = config.PUBLIC_URL ? new URL(config.PUBLIC_URL).hostname : config.HOST;
  const brokerUrl = config.MQTT_PUBLIC_URL?.replace(/\/$/, '') ?? `mqtt://${brokerHost}:${mqttPort}`;
  const onboarding = createOnboardingService({
    repository: createOnboardingRepository(sequelize),
    accounts: accountsRepository,
    links,
    devices: devicesRepository,
    refusals,
    systems,
    audit,
    mailer,
    publicUrl: () => publicUrl,
    now,
    logger,
    onAccessRevoked: (systemId) => onAccessRevoked(systemId),
  });
  acceptWaitingSystems = (email, userId) => onboarding.acceptWaiting(email, userId);
  const accessRequests = createAccessRequestsService({
    repository: createAccessRequestsRepository(sequelize),
    accounts: accountsRepository,
    systems,
    grants,
    audit,
    limits: createShareCodeLimits(),
    mailer,
    publicUrl: () => publicUrl,
    now,
    logger,
  });

  const signedInRouters: Record<string, Router> = { '/api/me': createPreferencesRoutes(settings) };
  // Each person sees only the captured mail addressed to them; with a real SMTP service the list is empty.
  signedInRouters['/api/dev/mail'] = createMailOutboxRoutes(mailCatcher);
  signedInRouters['/api/handovers'] = createHandoverRoutes(onboarding);
  signedInRouters['/api/access-requests'] = createAccessRequestsRoutes(accessRequests);
  const app = createApp({
    sequelize,
    logger,
    jwtSecret: config.JWT_SECRET,
    accountsRepository,
    accounts,
    invitations,
    passwordReset,
    companyMembers: createCompanyMembersService({ accounts: accountsRepository, links, sessions: accounts }),
    trustProxy: config.TRUST_PROXY,
    signInLimits: {
      perAccount: config.SIGN_IN_LIMIT_PER_ACCOUNT,
      perAccountGlobal: config.SIGN_IN_LIMIT_PER_ACCOUNT_GLOBAL,
      perAddress: config.SIGN_IN_LIMIT_PER_ADDRESS,
      windowSeconds: config.SIGN_IN_LIMIT_WINDOW_SECONDS,
      store: cluster?.signInStore,
    },
    systems,
    grants,
    devices,
    audit,
    readings,
    ingest,
    signedInRouters,
    systemRouters: [
      createReadingsCsvRoutes(
        createReadingsCsvService({ systems, repository: readingsRepository, audit, now }),
      ),
      createAlertsRoutes({
        alerts,
        systems,
        analytics,
        monitors: (systemId) => devicesRepository.monitorsWithLatest(systemId),
      }),
      createSettingsRoutes(settings),
      installerRoutes,
      installRegister.routes,
      createOnboardingRoutes(onboarding),
      createSystemShareRoutes(accessRequests),
      batteryHealth.routes,
    ],
    corsOrigins: config.CORS_ORIGINS.split(',')
      .map((o) => o.trim())
      .filter(Boolean),
    webDist: config.WEB_DIST,
  });
  const http = createServer(app);
  http.on('clientError', (_error, socket) => socket.destroy());
  const stream = attachLiveStream({ server: http, accounts, sessions, systems, hub, logger, now });
  // Through the hub, so a revoke on one node ends the streams on every node.
  onAccessRevoked = (systemId) => hub.accessChanged(systemId);
  const stopAccessSignal = hub.onAccessChanged((systemId) => stream.accessChanged(systemId));
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(config.PORT, config.HOST, () => resolve());
  });
  const httpPort = (http.address() as AddressInfo).port;
  publicUrl ||= `http://${config.HOST}:${httpPort}`;

  return {
    httpPort,
    mqttPort,
    http,
    ingest,
    mailCatcher,
    async stop() {
      clearInterval(silenceSweep);
      await batteryHealth.stop();
      checks.close();
      installRegister.close();
      stopAccessSignal();
      stream.close();
      await new Promise<void>((resolve) => http.close(() => resolve()));
      http.closeAllConnections();
      await broker.close();
      writer.close();
      mailer.close();
      await mailCatcher?.stop();
      await cluster?.close();
      await reader?.close();
      await sequelize.close();
    },
  };
}
