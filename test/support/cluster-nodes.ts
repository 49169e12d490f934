import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Sequelize } from 'sequelize';
import { seedDemoScenario } from '../../db/seeders/demo-scenario';
import { startServer, type RunningServer } from '../../server/src/compose-server';
import { loadConfig } from '../../server/src/config';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createMemoryLogger } from '../../server/src/logger';
import { createTestDatabase } from './test-database';
import { TEST_JWT_SECRET } from './test-secret';

/** One database for every node of a test cluster, cloned from the template and seeded with the demo. */
export async function createSharedDatabase(): Promise<{
  url: string;
  sequelize: Sequelize;
  drop(): Promise<void>;
}> {
  const database = await createTestDatabase();
  const sequelize = connectDatabase(database.url);
  await seedDemoScenario(sequelize);
  return {
    url: database.url,
    sequelize,
    async drop() {
      await sequelize.close();
      await database.drop();
    },
  };
}

/** A Cellwarden node in this process on free ports, against a shared database (and Redis, when given). */
export async function startClusterNode(env: Record<string, string>) {
  const logger = createMemoryLogger();
  const uploadDir = mkdtempSync(join(tmpdir(), 'cw-uploads-'));
  const config = loadConfig({
    JWT_SECRET: TEST_JWT_SECRET,
    PORT: '0',
    MQTT_PORT: '0',
    WEB_DIST: '',
    INGEST_RETRY_MS: '20',
    UPLOAD_DIR: uploadDir,
    ...env,
  });
  const server: RunningServer = await startServer(config, logger);
  return {
    server,
    logger,
    baseUrl: `http://127.0.0.1:${server.httpPort}`,
    mqttUrl: `mqtt://127.0.0.1:${server.mqttPort}`,
    async stop() {
      await server.stop();
      rmSync(uploadDir, { recursive: true, force: true });
    },
  };
}

/** A node started by startClusterNode. */
export type ClusterNode = Awaited<ReturnType<typeof startClusterNode>>;

/** The p-th percentile (0–100) by the nearest-rank method; NaN for no values. */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.max(0, Math.ceil((p / 100) * sorted.length) - 1)];
}
