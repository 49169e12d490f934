import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import { DEMO_DEVICES, seedDemoScenario } from '../../db/seeders/demo-scenario';
import { migrateToLatest } from '../../db/migrator';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createFaultCluster, type FaultCluster } from '../support/fault-cluster';
import { until } from '../support/http-session';
import { createProcessServer, freePort, healthStatus } from '../support/process-server';
import { compareDelivery, createDeliveryLedger, storedTimes } from './delivery-ledger';

jest.setTimeout(120000);

const van = DEMO_DEVICES.find((d) => d.system === 'van')!;
const QUEUE_LIMIT = 100;
const OFFERED = 300;

// A cluster of this file's own, as in kill-restart.test.ts.
let faultCluster: FaultCluster;
beforeAll(async () => {
  faultCluster = createFaultCluster({ name: `pg-queue-${process.pid}`, port: await freePort() });
});
afterAll(() => faultCluster.destroy());

it('holds at most the queue limit while PostgreSQL is away, and stores every reading once it is back', async () => {
  faultCluster.start('cellwarden');
  const url = faultCluster.url('cellwarden');
  const setup = connectDatabase(url);
  await migrateToLatest(setup);
  await seedDemoScenario(setup);
  await setup.close();
  const server = createProcessServer({
    databaseUrl: url,
    httpPort: await freePort(),
    mqttPort: await freePort(),
    env: { INGEST_QUEUE_LIMIT: String(QUEUE_LIMIT), INGEST_RETRY_MS: '10' },
  });
  server.start();
  try {
    await server.ready();
    const ledger = createDeliveryLedger();
    const client = await ledger.connect(server.mqttUrl, {
      username: van.id,
      password: van.secret,
      clientId: `${van.id}/queue`,
      clean: false,
      // While PostgreSQL is away a reconnect is refused with CONNACK 3 (server unavailable); mqtt.js gives up
      // after a refused CONNACK unless told otherwise, and a monitor must keep trying.
      reconnectOnConnackError: true,
    });
    let closes = 0;
    const refusals: string[] = [];
    client.on('close', () => closes++);
    client.on('error', (error) => refusals.push(error.message));
    faultCluster.stop('fast');
    await until(async () => (await healthStatus(server.baseUrl)) === 503, 10000);
    // A device with a deep buffer sends it all at once, as mqtt.js does on reconnect: more than the queue holds.
    const start = Date.now() - 2 * 3600_000;
    const publishes = Array.from({ length: OFFERED }, (_, i) =>
      client.publishAsync(
        readingsTopic(van.id),
        JSON.stringify(
          encodeReadingPack(van.id, [
            { measuredAt: start + i * 10_000, voltage: 13.1, current: -2, temperature: 4 },
          ]),
        ),
        { qos: 1 },
      ),
    );
    await until(() => closes > 0 && refusals.includes('Connection refused: Server unavailable'), 20000);
    const whileDown = { closes, refusals: [...new Set(refusals)], acked: ledger.acked.size };
    faultCluster.start();
    await until(() => ledger.acked.size === OFFERED, 60000).catch((error) => {
      throw new Error(`${ledger.acked.size} of ${OFFERED} acknowledged, ${closes} disconnects`, {
        cause: error,
      });
    });
    await Promise.all(publishes);
    await client.endAsync();
    const check = connectDatabase(url);
    const stored = await storedTimes(check, van.id).finally(() => check.close());
    const delivery = compareDelivery(ledger.sent, stored);
    console.log(
      `queue-limit: ${OFFERED} offered against a queue of ${QUEUE_LIMIT} while down: ${whileDown.acked} acknowledged, ` +
        `${whileDown.closes} disconnects, refused as ${JSON.stringify(whileDown.refusals)}`,
    );
    console.log(
      `queue-limit: after the restart ${stored.rows} stored, ${delivery.lost} lost, ${delivery.duplicated} duplicated, ` +
        `${closes} disconnects in all`,
    );
    // Past the limit the broker drops the connection rather than hold more; reconnects wait out the outage.
    expect(whileDown).toEqual({
      closes: expect.any(Number),
      refusals: expect.arrayContaining(['Connection refused: Server unavailable']),
      acked: 0,
    });
    expect(whileDown.closes).toBeGreaterThan(0);
    expect(delivery).toEqual({ lost: 0, extra: 0, duplicated: 0 });
  } finally {
    await server.kill();
  }
});
