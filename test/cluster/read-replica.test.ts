import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import type { BatteryReading } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { DEMO_DEVICES, seedDemoScenario } from '../../db/seeders/demo-scenario';
import { migrateToLatest } from '../../db/migrator';
import { connectDatabase } from '../../server/src/database/connect-database';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { createClusterDevice } from '../support/cluster-device';
import { percentile, startClusterNode, type ClusterNode } from '../support/cluster-nodes';
import { createReplicaPair } from '../support/cluster-replica';
import { signInAs, until } from '../support/http-session';

jest.setTimeout(180000);

// A primary and replica of this test's own (never the shared test cluster).
// Fixed ports below Linux's ephemeral range (32768–60999), so no client socket or port-0 listener of another
// test can be holding them when the clusters start.
const pair = createReplicaPair({ name: 'pg-cluster', primaryPort: 26341, replicaPort: 26342 });
const DATABASE = 'cellwarden';
const cabin = DEMO_DEVICES.find((d) => d.system === 'cabin')!;
const HOUR = 3600_000;
let primary: Sequelize;
let replica: Sequelize;
let onReplica: ClusterNode;
let onPrimary: ClusterNode;
let token: string;
let cabinId: string;

beforeAll(async () => {
  pair.destroy();
  pair.startPrimary(DATABASE);
  primary = connectDatabase(pair.primaryUrl(DATABASE));
  await migrateToLatest(primary);
  await seedDemoScenario(primary);
  pair.startReplica();
  replica = connectDatabase(pair.replicaUrl(DATABASE));
  onReplica = await startClusterNode({
    DATABASE_URL: pair.primaryUrl(DATABASE),
    DATABASE_READ_URL: pair.replicaUrl(DATABASE),
  });
  onPrimary = await startClusterNode({ DATABASE_URL: pair.primaryUrl(DATABASE) });
  token = (await signInAs(onReplica.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const [row] = await primary.query<{ id: string }>('SELECT system_id AS id FROM devices WHERE id = :id', {
    replacements: { id: cabin.id },
    type: QueryTypes.SELECT,
  });
  cabinId = row.id;
});
afterAll(async () => {
  await onReplica?.stop();
  await onPrimary?.stop();
  await replica?.close();
  await primary?.close();
  pair.destroy();
});

const lsnOf = async (db: Sequelize, sql: string) =>
  (await db.query<{ lsn: string }>(sql, { type: QueryTypes.SELECT }))[0].lsn;
const replayed = async (lsn: string) =>
  (
    await replica.query<{ done: boolean }>('SELECT pg_last_wal_replay_lsn() >= :lsn::pg_lsn AS done', {
      replacements: { lsn },
      type: QueryTypes.SELECT,
    })
  )[0].done;
const caughtUp = async () =>
  until(async () => replayed(await lsnOf(primary, 'SELECT pg_current_wal_lsn() AS lsn')));

const get = (node: ClusterNode, path: string) =>
  request(node.baseUrl).get(path).set('Authorization', `Bearer ${token}`);

function syntheticReadings(from: number, count: number, stepMs: number): BatteryReading[] {
  return Array.from({ length: count }, (_, i) => ({
    measuredAt: from + i * stepMs,
    voltage: 13.1 + 0.2 * Math.sin(i / 50),
    current: 6 * Math.cos(i / 80),
    temperature: 18 + (i % 7) * 0.1,
    stateOfCharge: 60 + (i % 30),
    power: 80 * Math.cos(i / 80),
    sourceCurrents: { solar: Math.max(0, 9 * Math.sin(i / 120)) },
  }));
}

it('serves history, the fleet list and the export from the replica, equal to the primary', async () => {
  const start = Date.now() - 6 * HOUR;
  const device = createClusterDevice([onReplica.mqttUrl]);
  const args = ['--scenario', 'driving-day', '--interval', '5', '--count', '300'];
  const { code, stderr } = await device.run(cabin, [...args, '--start', new Date(start).toISOString()]);
  expect({ code, stderr }).toEqual({ code: 0, stderr: '' });
  await caughtUp();

  const ranges = [
    [start, start + 300 * 5000], // raw readings
    [Date.now() - 48 * HOUR, Date.now()], // minute rollups
  ].map(([from, to]) => `from=${new Date(from).toISOString()}&to=${new Date(to).toISOString()}`);
  const paths = [
    ...ranges.map((q) => `/api/systems/${cabinId}/readings?${q}`),
    `/api/systems/${cabinId}/readings.csv?${ranges[0]}`,
    '/api/systems',
  ];
  for (const path of paths) {
    const [fromReplica, fromPrimary] = [await get(onReplica, path), await get(onPrimary, path)];
    expect([fromReplica.status, fromPrimary.status]).toEqual([200, 200]);
    expect(fromReplica.text).toEqual(fromPrimary.text);
  }
  const history = (await get(onReplica, paths[0])).body;
  expect(history.columns.measuredAt).toHaveLength(300);
});

it('keeps writes on the primary while the replica is down, and reads then fail rather than fall back', async () => {
  pair.stopReplica();
  try {
    const path = `/api/systems/${cabinId}/readings`;
    expect((await get(onReplica, path)).status).toBeGreaterThanOrEqual(500);
    expect((await get(onPrimary, path)).status).toBe(200);
    const repository = createReadingsRepository(primary);
    const before = await repository.countForSystem(cabinId);
    const device = createClusterDevice([onReplica.mqttUrl]);
    const start = new Date(Date.now() - 2 * HOUR).toISOString();
    const run = await device.run(cabin, ['--scenario', 'driving-day', '--count', '10', '--start', start]);
    expect(run).toEqual({ code: 0, stderr: '' });
    expect((await repository.countForSystem(cabinId)) - before).toBe(10);
  } finally {
    pair.startReplica();
  }
  await caughtUp();
  expect((await get(onReplica, `/api/systems/${cabinId}/readings`)).status).toBe(200);
});

it('measures replica lag, batch ingest rate and the stored size of a reading', async () => {
  const repository = createReadingsRepository(primary);
  const lags: number[] = [];
  for (let i = 0; i < 20; i++) {
    const [reading] = syntheticReadings(Date.now() - 3 * HOUR + i * 1000, 1, 1000);
    await repository.insertBatch([{ systemId: cabinId, deviceId: cabin.id, reading }]);
    const lsn = await lsnOf(primary, 'SELECT pg_current_wal_lsn() AS lsn');
    const committedAt = performance.now();
    // Polled without a pause: the lag on loopback is far below the 20 ms step of `until`.
    while (!(await replayed(lsn))) await new Promise((resolve) => setImmediate(resolve));
    lags.push(performance.now() - committedAt);
  }
  const ms = (p: number) => percentile(lags, p).toFixed(1);
  console.log(`replica lag (commit to replayed on the replica): p50 ${ms(50)} ms, p95 ${ms(95)} ms`);

  // One writer, batches of 500 with the rollups kept up to date in the same transaction, fsync on.
  const rows = syntheticReadings(Date.now() - 40 * 24 * HOUR, 20000, 10_000);
  const began = Date.now();
  for (let i = 0; i < rows.length; i += 500)
    await repository.insertBatch(
      rows.slice(i, i + 500).map((reading) => ({ systemId: cabinId, deviceId: cabin.id, reading })),
    );
  const seconds = (Date.now() - began) / 1000;
  console.log(
    `batch ingest: ${rows.length} readings in ${seconds.toFixed(1)} s = ${Math.round(rows.length / seconds)} readings/s per writer`,
  );

  await primary.query('VACUUM ANALYZE readings, rollups_1m');
  const [size] = await primary.query<{
    rows: string;
    bytes: string;
    minuteRows: string;
    minuteBytes: string;
  }>(
    `SELECT (SELECT count(*) FROM readings) AS rows,
       (SELECT sum(pg_total_relation_size(inhrelid)) FROM pg_inherits WHERE inhparent = 'readings'::regclass) AS bytes,
       (SELECT count(*) FROM rollups_1m) AS "minuteRows", pg_total_relation_size('rollups_1m') AS "minuteBytes"`,
    { type: QueryTypes.SELECT },
  );
  const perRow = (bytes: string, count: string) => (Number(bytes) / Number(count)).toFixed(0);
  console.log(
    `readings storage: ${size.rows} rows in ${size.bytes} bytes = ${perRow(size.bytes, size.rows)} bytes per row ` +
      `with its index; minute rollups ${size.minuteRows} rows = ${perRow(size.minuteBytes, size.minuteRows)} bytes per row`,
  );
  expect(Number(size.rows)).toBeGreaterThanOrEqual(rows.length + 300);
});
