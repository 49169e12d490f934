import { mkdtempSync, rmSync } from 'node:fs';
import type { Sequelize } from 'sequelize';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadConfig } from '../../server/src/config';
import { startServer, type RunningServer } from '../../server/src/compose-server';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createMemoryLogger } from '../../server/src/logger';
import { seedDemoScenario } from '../../db/seeders/demo-scenario';
import { createTestDatabase } from './test-database';
import { TEST_JWT_SECRET } from './test-secret';

/** A real Cellwarden node on free ports against its own database, with the demo scenario loaded. */
export async function startTestServer(
  options: {
    webDist?: string;
    env?: Record<string, string>;
    /** Stores what the node should find already there when it starts, as after a restart. */
    beforeStart?: (database: Sequelize) => Promise<void>;
  } = {},
) {
  const database = await createTestDatabase();
  const seeding = connectDatabase(database.url);
  await seedDemoScenario(seeding);
  await options.beforeStart?.(seeding);
  const logger = createMemoryLogger();
  const uploadDir = mkdtempSync(join(tmpdir(), 'cw-uploads-'));
  const config = loadConfig({
    JWT_SECRET: TEST_JWT_SECRET,
    DATABASE_URL: database.url,
    PORT: '0',
    MQTT_PORT: '0',
    WEB_DIST: options.webDist ?? '',
    INGEST_RETRY_MS: '50',
    UPLOAD_DIR: uploadDir,
    ...options.env,
  });
  const server: RunningServer = await startServer(config, logger);
  return {
    server,
    config,
    logger,
    database: seeding,
    baseUrl: `http://127.0.0.1:${server.httpPort}`,
    mqttUrl: `mqtt://127.0.0.1:${server.mqttPort}`,
    async stop() {
      await server.stop();
      await seeding.close();
      await database.drop();
      rmSync(uploadDir, { recursive: true, force: true });
    },
  };
}
