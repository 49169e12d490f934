// Only the battery-health part of the bench, against a database of one's own (`npm run bench` runs it with
// everything else): `CW_BENCH_DATABASE_URL=postgres://… npx tsx bench/battery-health.ts`, or, beside the
// shared dev cluster, with CW_TEST_DATABASE_BASE_URL and CW_TEST_TEMPLATE_DATABASE set (a clone is made and
// dropped afterwards).
import { cpus, totalmem } from 'node:os';
import { migrateToLatest } from '../db/migrator';
import { seedDemoScenario } from '../db/seeders/demo-scenario';
import { connectDatabase } from '../server/src/database/connect-database';
import { createTestDatabase } from '../test/support/test-database';
import { printTable } from './bench-table';
import { timeBatteryHealth } from './battery-health-timing';
import { signIn, startProduct } from './product-node';

async function main() {
  const clone = process.env.CW_BENCH_DATABASE_URL ? undefined : await createTestDatabase();
  const url = process.env.CW_BENCH_DATABASE_URL ?? clone!.url;
  const sequelize = connectDatabase(url);
  const machine = `${cpus().length} vCPU ${cpus()[0]?.model.trim() ?? ''}, ${Math.round(totalmem() / 2 ** 30)} GB`;
  console.log(`Cellwarden battery-health bench on ${machine}`);
  try {
    await migrateToLatest(sequelize);
    await seedDemoScenario(sequelize);
    const product = await startProduct({ databaseUrl: url });
    try {
      const token = await signIn(product.baseUrl);
      printTable(
        await timeBatteryHealth({ sequelize, baseUrl: product.baseUrl, token, repeats: 15, paint: true }),
      );
    } finally {
      await product.stop();
    }
  } finally {
    await sequelize.close();
    await clone?.drop();
  }
}

main().catch((error) => {
  console.error(`battery-health bench failed: ${error?.stack ?? error}`);
  process.exit(1);
});
