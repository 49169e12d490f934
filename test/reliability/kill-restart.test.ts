import { DEMO_DEVICES, seedDemoScenario } from '../../db/seeders/demo-scenario';
import { migrateToLatest } from '../../db/migrator';
import { connectDatabase } from '../../server/src/database/connect-database';
import { mulberry32 } from '../../simulator/src/mulberry32';
import { createFaultCluster } from '../support/fault-cluster';
import { createProcessServer, freePort, healthStatus, type ProcessServer } from '../support/process-server';
import { createTestDatabase } from '../support/test-database';
import { until } from '../support/http-session';
import { compareDelivery, createDeliveryLedger, runSimulatedDevice, storedTimes } from './delivery-ledger';

jest.setTimeout(120000);

const cabin = DEMO_DEVICES.find((d) => d.system === 'cabin')!;
const INTERVAL_SECONDS = 5;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

// A --count run goes as fast as the broker acknowledges; starting in the past keeps every reading plausible.
const simulatorArgs = (count: number) => [
  '--scenario',
  'driving-day',
  '--interval',
  String(INTERVAL_SECONDS),
  '--count',
  String(count),
  '--start',
  new Date(Date.now() - 2 * count * INTERVAL_SECONDS * 1000).toISOString(),
];

async function startOnFreePorts(databaseUrl: string): Promise<ProcessServer> {
  const server = createProcessServer({
    databaseUrl,
    httpPort: await freePort(),
    mqttPort: await freePort(),
    env: { INGEST_FLUSH_MS: '10' },
  });
  server.start();
  await server.ready();
  return server;
}

it('stores every reading exactly once across three kill -9 restarts of the server', async () => {
  const database = await createTestDatabase();
  const seeding = connectDatabase(database.url);
  await seedDemoScenario(seeding);
  const server = await startOnFreePorts(database.url);
  try {
    const ledger = createDeliveryLedger();
    const device = runSimulatedDevice(ledger, {
      broker: server.mqttUrl,
      device: cabin,
      args: simulatorArgs(1200),
    });
    // Seeded, so a failing run can be replayed with the same moments.
    const rng = mulberry32(20261202);
    let kills = 0;
    for (; kills < 3; kills++) {
      const before = ledger.acked.size;
      await until(() => ledger.acked.size >= before + 50, 30000);
      await sleep(Math.round(rng() * 1500));
      await server.kill();
      server.start();
      await server.ready();
    }
    const { code, stderr } = await device;
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const stored = await storedTimes(seeding, cabin.id);
    const { lost, extra, duplicated } = compareDelivery(ledger.sent, stored);
    console.log(
      `kill-restart: ${kills} kills, ${ledger.sent.size} readings sent, ${stored.times.size} stored, ` +
        `${lost} lost, ${duplicated} duplicated, ${ledger.packets - ledger.sent.size} redelivered`,
    );
    expect(ledger.sent.size).toBe(1200);
    expect({ lost, extra, duplicated }).toEqual({ lost: 0, extra: 0, duplicated: 0 });
  } finally {
    await server.kill();
    await seeding.close();
    await database.drop();
  }
});

// A cluster of this test's own (never the shared test cluster), stopped and started under a running server.
const faultCluster = createFaultCluster({ name: 'pg-reliability', port: 54339 });

async function outage(
  server: ProcessServer,
  ledger: ReturnType<typeof createDeliveryLedger>,
  mode: 'fast' | 'immediate',
) {
  const before = ledger.acked.size;
  await until(() => ledger.acked.size >= before + 100, 30000);
  faultCluster.stop(mode);
  const ackedAtStop = new Set(ledger.acked);
  await until(async () => (await healthStatus(server.baseUrl)) === 503, 10000);
  const stalled = ledger.acked.size;
  await sleep(3000);
  const duringOutage = { health: await healthStatus(server.baseUrl), acked: ledger.acked.size - stalled };
  faultCluster.start();
  // Nobody restarts the server or pokes it: it must notice by itself.
  await until(async () => (await healthStatus(server.baseUrl)) === 200, 20000);
  await until(() => ledger.acked.size >= stalled + 50, 30000);
  return { mode, ...duringOutage, ackedAtStop };
}

it('waits out PostgreSQL stopping fast and immediate, then resumes ingest with nothing acknowledged lost', async () => {
  faultCluster.destroy();
  try {
    faultCluster.start('cellwarden');
    const url = faultCluster.url('cellwarden');
    const setup = connectDatabase(url);
    await migrateToLatest(setup);
    await seedDemoScenario(setup);
    await setup.close();
    const server = await startOnFreePorts(url);
    try {
      const ledger = createDeliveryLedger();
      const device = runSimulatedDevice(ledger, {
        broker: server.mqttUrl,
        device: cabin,
        args: simulatorArgs(1500),
      });
      const outages = [await outage(server, ledger, 'fast'), await outage(server, ledger, 'immediate')];
      const { code, stderr } = await device;
      const check = connectDatabase(url);
      const stored = await storedTimes(check, cabin.id).finally(() => check.close());
      const { lost, extra, duplicated } = compareDelivery(ledger.sent, stored);
      for (const o of outages) {
        const ackedLost = compareDelivery(o.ackedAtStop, stored).lost;
        console.log(
          `pg-restart (${o.mode}): health ${o.health} while down, ${o.acked} acknowledged while down, ` +
            `${o.ackedAtStop.size} acknowledged before the stop, ${ackedLost} of them lost`,
        );
        expect({ health: o.health, acked: o.acked, ackedLost }).toEqual({
          health: 503,
          acked: 0,
          ackedLost: 0,
        });
      }
      console.log(
        `pg-restart: ${ledger.sent.size} readings sent, ${stored.times.size} stored, ${lost} lost, ` +
          `${duplicated} duplicated, ${ledger.packets - ledger.sent.size} redelivered`,
      );
      expect(stderr).toBe('');
      expect(code).toBe(0);
      expect({ lost, extra, duplicated }).toEqual({ lost: 0, extra: 0, duplicated: 0 });
    } finally {
      await server.kill();
    }
  } finally {
    faultCluster.destroy();
  }
});
