import { connectAsync } from 'mqtt';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { seedDemoScenario } from '../../db/seeders/demo-scenario';
import { connectDatabase } from '../../server/src/database/connect-database';
import { signInAs } from '../support/http-session';
import { createProcessServer, freePort, type ProcessServer } from '../support/process-server';
import { createTestDatabase } from '../support/test-database';
import { compareDelivery, createDeliveryLedger, runSimulatedDevice, storedTimes } from './delivery-ledger';

jest.setTimeout(120000);

const FLEET = 50;
const READINGS_PER_DEVICE = 40;
const INTERVAL_SECONDS = 10;
// 20 simulated seconds per real second at 10 s a reading: 2 readings/s per device offered, 100/s for the
// fleet, about 20 s of publishing. Each monitor waits for its PUBACK, which comes after the batch commits.
const SPEED = 20;
const OFFERED_PER_SECOND = (FLEET * SPEED) / INTERVAL_SECONDS;

let database: Awaited<ReturnType<typeof createTestDatabase>>;
let sequelize: ReturnType<typeof connectDatabase>;
let server: ProcessServer;
let owner: string;
let cabinId: string;

beforeAll(async () => {
  database = await createTestDatabase();
  sequelize = connectDatabase(database.url);
  await seedDemoScenario(sequelize);
  server = createProcessServer({
    databaseUrl: database.url,
    httpPort: await freePort(),
    mqttPort: await freePort(),
    env: { SIGN_IN_LIMIT_PER_ADDRESS: '100000' },
  });
  server.start();
  await server.ready();
  owner = (await signInAs(server.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const systems = await request(server.baseUrl).get('/api/systems').set('Authorization', `Bearer ${owner}`);
  cabinId = systems.body.systems.find((s: { kind: string }) => s.kind === 'cabin').id;
});
afterAll(async () => {
  await server?.kill();
  await sequelize?.close();
  await database?.drop();
});

const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))];

/** Calls `call` back to back until `done` resolves; returns each call's status and duration. */
async function probe(call: () => Promise<{ status: number }>, done: Promise<unknown>) {
  let finished = false;
  void done.finally(() => (finished = true));
  const samples: { status: number; ms: number }[] = [];
  while (!finished) {
    const started = performance.now();
    const { status } = await call();
    samples.push({ status, ms: performance.now() - started });
  }
  const sorted = samples.map((s) => s.ms).sort((a, b) => a - b);
  const statuses = [...new Set(samples.map((s) => s.status))];
  return { count: samples.length, statuses, p50: percentile(sorted, 0.5), p95: percentile(sorted, 0.95) };
}

it('holds sign-in and history answers while a fleet of monitors publishes, storing every reading', async () => {
  const devices = [];
  for (let k = 1; k <= FLEET; k++) {
    const id = `cw-load-${String(k).padStart(2, '0')}`;
    const added = await request(server.baseUrl)
      .post(`/api/systems/${cabinId}/devices`)
      .set('Authorization', `Bearer ${owner}`)
      .send({ id, label: `Load monitor ${k}` });
    expect(added.status).toBe(201);
    devices.push({ id, secret: added.body.mqttPassword as string });
  }
  const ledger = createDeliveryLedger();
  // All monitors share the cabin system, whose readings are keyed by measured time: each starts k ms apart.
  const start = Date.now() - 2 * READINGS_PER_DEVICE * INTERVAL_SECONDS * 1000;
  const startedAt = performance.now();
  const fleet = Promise.all(
    devices.map((device, k) =>
      runSimulatedDevice(ledger, {
        broker: server.mqttUrl,
        device,
        args: [
          ...['--scenario', 'driving-day', '--seed', String(k), '--interval', String(INTERVAL_SECONDS)],
          ...['--count', String(READINGS_PER_DEVICE), '--speed', String(SPEED)],
          ...['--start', new Date(start + k).toISOString()],
        ],
      }),
    ),
  );
  const fleetDone = fleet.then(() => performance.now() - startedAt);
  const from = new Date(start - 3600_000).toISOString();
  const [signIns, history] = await Promise.all([
    probe(
      () =>
        request(server.baseUrl)
          .post('/api/auth/sign-in')
          .send({ email: demo.users[1].email, password: demo.password }),
      fleetDone,
    ),
    probe(
      () =>
        request(server.baseUrl)
          .get(`/api/systems/${cabinId}/readings`)
          .query({ from, to: new Date().toISOString() })
          .set('Authorization', `Bearer ${owner}`),
      fleetDone,
    ),
  ]);
  const elapsedMs = await fleetDone;
  const results = await fleet;
  const stored = { times: new Set<number>(), rows: 0 };
  for (const device of devices) {
    const own = await storedTimes(sequelize, device.id);
    own.times.forEach((t) => stored.times.add(t));
    stored.rows += own.rows;
  }
  const delivery = compareDelivery(ledger.sent, stored);
  const rate = stored.rows / (elapsedMs / 1000);
  console.log(
    `load-held: ${FLEET} devices, ${ledger.sent.size} readings sent, ${stored.rows} stored in ${(elapsedMs / 1000).toFixed(1)} s: ${rate.toFixed(0)} readings/s achieved of ${OFFERED_PER_SECOND} offered`,
  );
  console.log(
    `load-held: sign-in ${signIns.count} answered ${JSON.stringify(signIns.statuses)}, p50 ${signIns.p50.toFixed(0)} ms, p95 ${signIns.p95.toFixed(0)} ms`,
  );
  console.log(
    `load-held: history ${history.count} answered ${JSON.stringify(history.statuses)}, p50 ${history.p50.toFixed(0)} ms, p95 ${history.p95.toFixed(0)} ms`,
  );
  expect(results.map((r) => r.code)).toEqual(devices.map(() => 0));
  expect(ledger.sent.size).toBe(FLEET * READINGS_PER_DEVICE);
  expect(delivery).toEqual({ lost: 0, extra: 0, duplicated: 0 });
  expect({ signIn: signIns.statuses, history: history.statuses }).toEqual({ signIn: [200], history: [200] });
});

// Readings are keyed by (system, measured time, device): two monitors of one system measuring in the same
// millisecond are two readings, not a duplicate.
it('stores the readings of two monitors of one system measured at the same time', async () => {
  const at = Date.now() - 60_000;
  const [a, b] = [demo.devices.find((d) => d.system === 'cabin')!, { id: 'cw-load-01', secret: '' }];
  const [row] = await sequelize.query<{ n: string }>(
    'SELECT count(*) AS n FROM devices WHERE system_id = :cabinId',
    {
      replacements: { cabinId },
      type: QueryTypes.SELECT,
    },
  );
  expect(Number(row.n)).toBeGreaterThan(1);
  const rotated = await request(server.baseUrl)
    .post(`/api/systems/${cabinId}/devices/${b.id}/rotate`)
    .set('Authorization', `Bearer ${owner}`);
  b.secret = rotated.body.mqttPassword;
  for (const device of [a, b]) {
    const client = await connectAsync(server.mqttUrl, {
      username: device.id,
      password: device.secret,
      clientId: `${device.id}/same-time`,
      reconnectPeriod: 0,
    });
    const pack = encodeReadingPack(device.id, [
      { measuredAt: at, voltage: 13.2, current: 2, temperature: 11 },
    ]);
    await client.publishAsync(readingsTopic(device.id), JSON.stringify(pack), { qos: 1 });
    await client.endAsync();
  }
  const stored = await sequelize.query<{ device: string }>(
    'SELECT device_id AS device FROM readings WHERE system_id = :cabinId AND measured_at = :at',
    { replacements: { cabinId, at: new Date(at) }, type: QueryTypes.SELECT },
  );
  console.log(`load-held: two monitors, one measured time: ${stored.length} of 2 readings stored`);
  expect(stored.map((r) => r.device).sort()).toEqual([a.id, b.id].sort());
});
