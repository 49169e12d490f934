import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createAccountsRepository } from './accounts/accounts-repository';
import { createAccountsService } from './accounts/accounts-service';
import { createApp } from './app';
import { createBrokerPolicy } from './broker/broker-policy';
import { startMqttBroker } from './broker/mqtt-broker';
import type { Config } from './config';
import { connectDatabase } from './database/connect-database';
import { createDevicesRepository } from './devices/devices-repository';
import { createDevicesService } from './devices/devices-service';
import { createBatchWriter } from './ingest/batch-writer';
import { createIngestService } from './ingest/ingest-service';
import type { Logger } from './logger';
import { attachLiveStream } from './stream/live-stream-server';
import { createSystemsRepository } from './systems/systems-repository';
import { createSystemsService } from './systems/systems-service';
import { createReadingsHub } from './telemetry/readings-hub';
import { createReadingsRepository } from './telemetry/readings-repository';
import { createReadingsService } from './telemetry/readings-service';
import { migrateToLatest } from '../../db/migrator';

/** A running Cellwarden node: HTTP (API, dashboard, stream) and the MQTT broker. */
export interface RunningServer {
  httpPort: number;
  mqttPort: number;
  http: Server;
  ingest: ReturnType<typeof createIngestService>;
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
  const accountsRepository = createAccountsRepository(sequelize);
  const accounts = createAccountsService({
    repository: accountsRepository,
    jwtSecret: config.JWT_SECRET,
    tokenTtlSeconds: config.ACCESS_TOKEN_TTL_SECONDS,
  });
  const systems = createSystemsService(createSystemsRepository(sequelize));
  const readingsRepository = createReadingsRepository(sequelize);
  const readings = createReadingsService({ systems, repository: readingsRepository, now });
  const hub = createReadingsHub();
  const writer = createBatchWriter({
    repository: readingsRepository,
    logger,
    batchSize: config.INGEST_BATCH_SIZE,
    flushMs: config.INGEST_FLUSH_MS,
    queueLimit: config.INGEST_QUEUE_LIMIT,
    onStored: (rows) => rows.forEach(({ systemId, reading }) => hub.publish({ systemId, reading })),
  });
  const ingest = createIngestService({ writer, logger, now });
  const devices = createDevicesService(createDevicesRepository(sequelize));
  const broker = await startMqttBroker({
    host: config.HOST,
    port: config.MQTT_PORT,
    policy: createBrokerPolicy({ devices, ingest, logger }),
    logger,
  });

  const app = createApp({
    sequelize,
    logger,
    jwtSecret: config.JWT_SECRET,
    accountsRepository,
    accounts,
    systems,
    readings,
    ingest,
    webDist: config.WEB_DIST,
  });
  const http = createServer(app);
  http.on('clientError', (_error, socket) => socket.destroy());
  const stream = attachLiveStream({ server: http, accounts, systems, hub, logger });
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(config.PORT, config.HOST, () => resolve());
  });

  return {
    httpPort: (http.address() as AddressInfo).port,
    mqttPort: broker.port,
    http,
    ingest,
    async stop() {
      stream.close();
      await new Promise<void>((resolve) => http.close(() => resolve()));
      http.closeAllConnections();
      await broker.close();
      writer.close();
      await sequelize.close();
    },
  };
}
