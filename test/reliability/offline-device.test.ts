import { connectAsync } from 'mqtt';
import { QueryTypes } from 'sequelize';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import { DEMO_DEVICES } from '../../db/seeders/demo-scenario';
import { startTestServer } from '../support/test-server';
import { compareDelivery, createDeliveryLedger, runSimulatedDevice, storedTimes } from './delivery-ledger';
import { expectedBuckets, mismatchedBuckets, rawReadings, storedBuckets } from './rollup-reference';

jest.setTimeout(120000);

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let cabinSystemId: string;
const cabin = DEMO_DEVICES.find((d) => d.system === 'cabin')!;
const MINUTE = 60_000;
const HOUR = 3_600_000;

beforeAll(async () => {
  node = await startTestServer();
  const [row] = await node.database.query<{ systemId: string }>(
    'SELECT system_id AS "systemId" FROM devices WHERE id = :id',
    { replacements: { id: cabin.id }, type: QueryTypes.SELECT },
  );
  cabinSystemId = row.systemId;
});
afterAll(async () => {
  await node.stop();
});

it('computes the reference energy of a hand-worked example', () => {
  // Hand-worked (Q = I·t, E = V·I·t, general reference): the first reading has no reading before it, so it
  // counts nothing; 36 A for the next 10 s is 0.1 Ah, ×12.5 V = 1.25 Wh.
  const [first, second, third] = expectedBuckets(
    [
      { measuredAt: 0, voltage: 12.5, current: 10 },
      { measuredAt: 10_000, voltage: 12.5, current: 36 },
      // 20 min later: a silence longer than 300 s, so this reading counts nothing …
      { measuredAt: 1_210_000, voltage: 12, current: -7.2 },
      // … and the next, 60 s on, counts −7.2 A·60 s = 0.12 Ah out, ×12 V = 1.44 Wh.
      { measuredAt: 1_270_000, voltage: 12, current: -7.2 },
    ],
    MINUTE,
  );
  expect({ bucketStart: first.bucketStart, readingCount: first.readingCount }).toEqual({
    bucketStart: 0,
    readingCount: 2,
  });
  expect(first.ahIn).toBeCloseTo(0.1, 12);
  expect(first.whIn).toBeCloseTo(1.25, 12);
  expect([second.ahOut, second.whOut]).toEqual([0, 0]);
  expect(third.ahOut).toBeCloseTo(0.12, 12);
  expect(third.whOut).toBeCloseTo(1.44, 12);
});

it('stores a device’s hours of buffered readings in order, and its rollups equal the raw readings', async () => {
  const intervalSeconds = 30;
  const count = 1200; // 10 h of simulated time
  const start = Math.floor((Date.now() - 11 * HOUR) / MINUTE) * MINUTE;
  const ledger = createDeliveryLedger();
  // Drops off after 5 h for 4 h: 480 readings buffered, sent in packs of 20 on reconnect.
  const { code, stderr } = await runSimulatedDevice(ledger, {
    broker: node.mqttUrl,
    device: cabin,
    args: [
      ...['--scenario', 'driving-day', '--interval', String(intervalSeconds), '--count', String(count)],
      ...['--start', new Date(start).toISOString(), '--offline-every', '300', '--offline-for', '240'],
    ],
  });
  expect({ code, stderr }).toEqual({ code: 0, stderr: '' });
  const stored = await storedTimes(node.database, cabin.id);
  const delivery = compareDelivery(ledger.sent, stored);
  const raw = await rawReadings(node.database, cabinSystemId);
  const offline = raw.filter(
    (r) => r.measuredAt >= start + 300 * MINUTE && r.measuredAt < start + 540 * MINUTE,
  );
  // Stored in the order measured: each reading received no earlier than the one measured before it.
  const outOfOrder = raw.filter((r, i) => i > 0 && r.receivedAt < raw[i - 1].receivedAt).length;
  const grid = raw.every((r, i) => r.measuredAt === start + i * intervalSeconds * 1000);
  const minutes = mismatchedBuckets(
    await storedBuckets(node.database, 'rollups_1m', cabinSystemId),
    expectedBuckets(raw, MINUTE),
  );
  const hours = mismatchedBuckets(
    await storedBuckets(node.database, 'rollups_1h', cabinSystemId),
    expectedBuckets(raw, HOUR),
  );
  console.log(
    `offline-device: ${ledger.sent.size} sent, ${raw.length} stored, ${offline.length} buffered offline`,
  );
  console.log(
    `offline-device: ${delivery.lost} lost, ${delivery.duplicated} duplicated, ${outOfOrder} out of order`,
  );
  console.log(
    `offline-device: rollups_1m ${minutes.differing.length + minutes.missing.length} of ` +
      `${expectedBuckets(raw, MINUTE).length} minutes wrong; rollups_1h ` +
      `${hours.differing.length + hours.missing.length} of ${expectedBuckets(raw, HOUR).length} hours wrong`,
  );
  expect(delivery).toEqual({ lost: 0, extra: 0, duplicated: 0 });
  expect({ count: raw.length, offline: offline.length, grid, outOfOrder }).toEqual({
    count,
    offline: 480,
    grid: true,
    outOfOrder: 0,
  });
  expect({ minutes: minutes.differing, missing: minutes.missing, extra: minutes.extra }).toEqual({
    minutes: [],
    missing: [],
    extra: 0,
  });
  expect({ hours: hours.differing, missing: hours.missing, extra: hours.extra }).toEqual({
    hours: [],
    missing: [],
    extra: 0,
  });
});

const reading = (measuredAt: number, current: number): BatteryReading => ({
  measuredAt,
  voltage: 13.1,
  current,
  temperature: 8,
});

// A late reading also shortens the gap of the next stored reading, whose minute may be another one: that
// minute's energy must be corrected too (server/src/telemetry/rollups-sql.ts).
it('recomputes the rollup of a later minute when a late reading shortens its gap', async () => {
  const [{ last }] = await node.database.query<{ last: number }>(
    'SELECT (extract(epoch FROM max(measured_at)) * 1000)::float8 AS last FROM readings WHERE system_id = :id',
    { replacements: { id: cabinSystemId }, type: QueryTypes.SELECT },
  );
  const t = Math.ceil((last + 30 * MINUTE) / MINUTE) * MINUTE;
  // Minute 10 arrives first (a silence before it, so it counts nothing); minutes 6–7 arrive late, 150 s before it.
  const later = [0, 1, 2, 3, 4, 5].map((k) => reading(t + 600_000 + k * 20_000, 20));
  const late = [0, 1, 2, 3, 4, 5].map((k) => reading(t + 400_000 + k * 10_000, -5));
  const client = await connectAsync(node.mqttUrl, {
    username: cabin.id,
    password: cabin.secret,
    clientId: `${cabin.id}/late`,
    reconnectPeriod: 0,
  });
  for (const pack of [later, late])
    await client.publishAsync(readingsTopic(cabin.id), JSON.stringify(encodeReadingPack(cabin.id, pack)), {
      qos: 1,
    });
  await client.endAsync();
  const raw = await rawReadings(node.database, cabinSystemId);
  const span = raw.filter((r) => r.measuredAt >= t);
  const minutes = mismatchedBuckets(
    (await storedBuckets(node.database, 'rollups_1m', cabinSystemId)).filter((b) => b.bucketStart >= t),
    expectedBuckets(raw, MINUTE).filter((b) => b.bucketStart >= t),
  );
  console.log(
    `offline-device: late readings ${span.length} stored, ` +
      `${minutes.differing.length} later minute(s) left with a stale gap (${minutes.differing.map((b) => new Date(b.bucketStart).toISOString()).join(', ')})`,
  );
  expect(span.length).toBe(12);
  expect(minutes).toEqual({ missing: [], differing: [], extra: 0 });
});
