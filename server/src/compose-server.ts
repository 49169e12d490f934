import { EventEmitter } from 'node:events';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createGrantsService } from './access/grants-service';
import { createAccessRequestsService } from './access-requests/access-requests-service';
import { createShareCodeLimits } from './access-requests/share-code-limits';
import { createAccountsComponent } from './accounts/accounts-component';
import { createAlertsComponent } from './alerts/alerts-component';
import { createApp } from './app';
import { createAuditService } from './audit/audit-service';
import { startBatteryHealth } from './battery-health/battery-health-component';
import { createBrokerPolicy } from './broker/broker-policy';
import { createDeviceRefusals } from './broker/device-refusals';
import { startMqttBroker } from './broker/mqtt-broker';
import type { Config } from './config';
import { createDevicesService } from './devices/devices-service';
import { createSeenThrottle } from './devices/seen-throttle';
import { createBatchWriter } from './ingest/batch-writer';
import { createIngestService } from './ingest/ingest-service';
import { createStoredReadingsFanout } from './ingest/stored-readings-fanout';
import { createInstallRegisterComponent } from './install-register/install-register-component';
import { createInstallerComponent } from './installer/installer-component';
import type { Logger } from './logger';
import type { MailCatcher } from './mail/mail-catcher';
import { createOnboardingService } from './onboarding/onboarding-service';
import { createRepositories, openStores } from './open-stores';
import { createPublicAddresses } from './public-addresses';
import { createRoutesTable } from './routes-table';
import { createSettingsService } from './settings/settings-service';
import { attachLiveStream } from './stream/live-stream-server';
import { createSystemsService } from './systems/systems-service';
import { createReadingsCsvService } from './telemetry/readings-csv-service';
import { createReadingsHub } from './telemetry/readings-hub';
import { createReadingsService } from './telemetry/readings-service';

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

/**
 * The composition root, read top to bottom: open the stores, create each component's services after the ones
 * it uses, start the entry points (MQTT broker, HTTP API and dashboard, live stream), and stop in reverse.
 * It holds no logic of its own: what runs after a batch is stored is `ingest/stored-readings-fanout.ts`.
 */
export async function startServer(
  config: Config,
  logger: Logger,
  now: () => number = Date.now,
): Promise<RunningServer> {
  // 1. Stores.
  const stores = await openStores(config, logger);
  const { sequelize, cluster, mailer, mailCatcher } = stores;
  const repositories = createRepositories(stores);
  const addresses = createPublicAddresses(config);
  const publicUrl = addresses.publicUrl;
  // Live readings, alerts and access changes; through the cluster's bus when there is one, so a revoke on one
  // node ends the streams on every node.
  const hub = cluster?.hub ?? createReadingsHub();
  const accessChanged = (systemId: string) => hub.accessChanged(systemId);

  // 2. Services, each after the ones it uses.
  const systems = createSystemsService({
    repository: repositories.systems,
    grants: repositories.grants,
    now,
  });
  const audit = createAuditService({ repository: repositories.audit, systems, logger });
  // Why the broker refused each monitor, for the onboarding screen (bounded; this node's counts).
  const refusals = createDeviceRefusals({ now });
  const onboarding = createOnboardingService({
    repository: repositories.onboarding,
    accounts: repositories.accounts,
    links: repositories.links,
    devices: repositories.devices,
    refusals,
    systems,
    audit,
    mailer,
    publicUrl,
    now,
    logger,
    onAccessRevoked: accessChanged,
  });
  const people = createAccountsComponent({
    repository: repositories.accounts,
    sessions: repositories.sessions,
    links: repositories.links,
    mailer,
    jwtSecret: config.JWT_SECRET,
    tokenTtlSeconds: config.ACCESS_TOKEN_TTL_SECONDS,
    publicUrl,
    logger,
    now,
    onAccountCreated: async (email, userId) => {
      await repositories.grants.attachWaiting(email, userId);
      // Systems an installer set up for this address become the new account's (onboarding).
      await onboarding.acceptWaiting(email, userId);
    },
  });
  const grants = createGrantsService({
    repository: repositories.grants,
    accounts: repositories.accounts,
    systems,
    audit,
    now,
    onAccessRevoked: accessChanged,
  });
  const readings = createReadingsService({ systems, repository: repositories.readings, audit, now });
  const readingsCsv = createReadingsCsvService({ systems, repository: repositories.readings, audit, now });
  const alerting = createAlertsComponent({
    repository: repositories.alerts,
    settings: repositories.settings,
    readings: repositories.readings,
    systems,
    audit,
    hub,
    mailer,
    logger,
    now,
    silenceCheckSeconds: config.SILENCE_CHECK_SECONDS,
  });
  const settings = createSettingsService({
    repository: repositories.settings,
    systems,
    audit,
    onChanged: (systemId) => alerting.analytics.settingsChanged(systemId),
  });
  const installRegister = createInstallRegisterComponent({
    sequelize,
    systems,
    audit,
    settings: repositories.settings,
    alerts: alerting.alerts,
    alertsRepository: repositories.alerts,
    logger,
    now,
  });
  const installer = await createInstallerComponent({
    sequelize,
    repository: repositories.commissioning,
    uploads: repositories.uploads,
    settings: repositories.settings,
    readings: repositories.readings,
    accounts: repositories.accounts,
    systems,
    audit,
    installRegister,
    mailer,
    uploadDir: config.UPLOAD_DIR,
    logger,
    now,
  });
  const batteryHealth = startBatteryHealth({
    sequelize,
    systems,
    settings: repositories.settings,
    audit,
    logger,
    now,
  });
  const accessRequests = createAccessRequestsService({
    repository: repositories.accessRequests,
    accounts: repositories.accounts,
    systems,
    grants,
    audit,
    limits: createShareCodeLimits(),
    mailer,
    publicUrl,
    now,
    logger,
  });
  // A revoked device or a rotated secret makes the broker check that monitor's open connections again.
  const credentialChanges = new EventEmitter();
  const devices = createDevicesService({
    repository: repositories.devices,
    systems,
    audit,
    brokerPort: addresses.brokerPort,
    brokerUrl: addresses.brokerUrl,
    onCredentialsChanged: (deviceId) => credentialChanges.emit('changed', deviceId),
  });

  // 3. Entry points: readings in over MQTT, then HTTP and the live stream.
  // last_seen_at at most once per device per 30 s, not on every flush (see seen-throttle.ts).
  const seen = createSeenThrottle({
    write: (lastSeen) => repositories.devices.markSeen(lastSeen),
    onError: (error) => logger.warn('last seen not updated', { error: String(error) }),
    now,
  });
  const writer = createBatchWriter({
    repository: repositories.readings,
    logger,
    batchSize: config.INGEST_BATCH_SIZE,
    retryMs: config.INGEST_RETRY_MS,
    queueLimit: config.INGEST_QUEUE_LIMIT,
    onStored: createStoredReadingsFanout({
      checks: installer.checks,
      analytics: alerting.analytics,
      hub,
      devices: seen,
      logger,
      now,
    }),
  });
  const ingest = createIngestService({
    writer,
    logger,
    now,
    onRefused: (deviceId, code) =>
      refusals.count(deviceId, code === 'foreign_topic' ? 'topic' : 'payload', code),
  });
  const brokerPolicy = createBrokerPolicy({ devices, ingest, logger, refusals });
  credentialChanges.on('changed', (deviceId: string) => {
    brokerPolicy.credentialsChanged(deviceId);
    refusals.forget(deviceId);
  });
  const broker = await startMqttBroker({
    host: config.HOST,
    port: config.MQTT_PORT,
    policy: brokerPolicy,
    logger,
    mq: cluster?.broker.mq,
    persistence: cluster?.broker.persistence,
  });
  addresses.brokerListening(broker.port);

  const app = createApp({
    logger,
    trustProxy: config.TRUST_PROXY,
    corsOrigins: config.CORS_ORIGINS.split(',')
      .map((o) => o.trim())
      .filter(Boolean),
    webDist: config.WEB_DIST,
    // Every API router in one table, in mounting order (routes-table.ts).
    routes: createRoutesTable({
      sequelize,
      jwtSecret: config.JWT_SECRET,
      signInLimits: {
        perAccount: config.SIGN_IN_LIMIT_PER_ACCOUNT,
        perAccountGlobal: config.SIGN_IN_LIMIT_PER_ACCOUNT_GLOBAL,
        perAddress: config.SIGN_IN_LIMIT_PER_ADDRESS,
        windowSeconds: config.SIGN_IN_LIMIT_WINDOW_SECONDS,
        store: cluster?.signInStore,
      },
      people,
      accountsRepository: repositories.accounts,
      systems,
      grants,
      devices,
      audit,
      readings,
      readingsCsv,
      alerting,
      monitors: (systemId) => repositories.devices.monitorsWithLatest(systemId),
      settings,
      onboarding,
      accessRequests,
      componentRouters: {
        installer: installer.routes,
        installRegister: installRegister.routes,
        batteryHealth: batteryHealth.routes,
      },
      mailCatcher,
    }),
  });
  const http = createServer(app);
  http.on('clientError', (_error, socket) => socket.destroy());
  const stream = attachLiveStream({
    server: http,
    accounts: people.accounts,
    sessions: repositories.sessions,
    systems,
    hub,
    logger,
    now,
  });
  const stopAccessSignal = hub.onAccessChanged((systemId) => stream.accessChanged(systemId));
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(config.PORT, config.HOST, () => resolve());
  });
  const httpPort = (http.address() as AddressInfo).port;
  addresses.httpListening(httpPort);

  // 4. Stop in reverse: timers and jobs, the stream and HTTP, the broker and the writer, then the stores.
  return {
    httpPort,
    mqttPort: broker.port,
    http,
    ingest,
    mailCatcher,
    async stop() {
      alerting.stop();
      await batteryHealth.stop();
      installer.checks.close();
      installRegister.close();
      stopAccessSignal();
      stream.close();
      await new Promise<void>((resolve) => http.close(() => resolve()));
      http.closeAllConnections();
      await broker.close();
      writer.close();
      await seen.close();
      await stores.close();
    },
  };
}
