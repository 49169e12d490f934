// The bench itself (run through `npm run bench`, which provides the cluster): ceilings and product side by side.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { migrateToLatest } from '../db/migrator';
import { seedDemoScenario } from '../db/seeders/demo-scenario';
import { connectDatabase } from '../server/src/database/connect-database';
import { coresBusyDuring, cpuMeter, postmasterPid } from './cpu-meter';
import { copyCeiling, insertCeiling, productStorage, syntheticRows } from './database-ceilings';
import { timeBatteryHealth } from './battery-health-timing';
import { timeDashboard } from './dashboard-timing';
import { seedHistory, timeHistory } from './history-timing';
import { connectFleet, publishAtOneHertz, sendBacklog, type Fleet } from './monitor-fleet';
import { createFleet, signIn, startProduct, type Monitor, type ProductNode } from './product-node';
import { listenToStream } from './stream-listener';
import { printTable, type Row } from './bench-table';

const quick = process.argv.includes('--quick');
const profile = process.argv.includes('--profile');
// `--only=storage,e2e,latency,restart,history,health,dashboard` runs just those parts (restart needs latency):
// the whole bench loads a shared 2-core machine for minutes, a change is usually measured on the parts it touches.
const only = process.argv
  .find((a) => a.startsWith('--only='))
  ?.slice('--only='.length)
  .split(',');
const runs = (part: string) => !only || only.includes(part);
const root = join(__dirname, '..');
const url = process.env.CW_BENCH_DATABASE_URL;
if (!url) throw new Error('run through `npm run bench`, which starts the cluster');
const sequelize = connectDatabase(url);
const DAY = 86_400_000;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const rows: Row[] = [];
const percentile = (values: number[], p: number) =>
  values.length
    ? [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(values.length * p))]
    : NaN;

async function countReadings(): Promise<number> {
  const [{ count }] = await sequelize.query<{ count: string }>('SELECT count(*) FROM readings', {
    type: QueryTypes.SELECT,
  });
  return Number(count);
}

async function storageCeilings(systemIds: string[]) {
  const count = quick ? 30_000 : 200_000;
  const data = syntheticRows(systemIds, count, Date.now() - 20 * DAY);
  const copy = await copyCeiling(url!, data);
  // The ceiling's own CPU: whether PostgreSQL alone already fills the cores the whole product shares.
  const { result: insert, cores } = await coresBusyDuring(() => insertCeiling(url!, data));
  const product = await productStorage(url!, sequelize, data);
  await sequelize.query('TRUNCATE readings, rollups_1m, rollups_1h');
  rows.push(
    { what: 'PostgreSQL COPY into readings', value: `${copy} rows/s`, against: '', ratio: '' },
    {
      what: 'multi-row INSERT … ON CONFLICT, 500 × 2 lanes',
      value: `${insert} rows/s`,
      against: '',
      ratio: '',
    },
    {
      what: '  … CPU while it ran (whole machine)',
      value: `${cores.toFixed(2)} cores busy = ${((cores * 1000 * 1000) / insert).toFixed(0)} ms per 1,000 rows`,
      against: `${cpus().length} cores`,
      ratio: '',
    },
    {
      what: "product's storage step (insert + rollups)",
      value: `${product} rows/s`,
      against: 'INSERT',
      ratio: (product / insert).toFixed(2),
    },
  );
  return insert;
}

/** A bare aedes broker in its own process; resolves with its URL and its stop. */
async function startBareBroker() {
  const child = spawn(join(root, 'node_modules', '.bin', 'tsx'), ['bench/bare-broker.ts'], { cwd: root });
  const port = await new Promise<string>((resolve) =>
    child.stdout.once('data', (d) => resolve(String(d).trim())),
  );
  return {
    url: `mqtt://127.0.0.1:${port}`,
    pid: child.pid!,
    stop: () => new Promise((resolve) => child.once('exit', resolve).kill('SIGTERM')),
  };
}

async function backlogRun(
  brokerUrl: string,
  monitors: Monitor[],
  start: number,
  meter: ReturnType<typeof cpuMeter>,
) {
  const fleet = await connectFleet(brokerUrl, monitors, quick ? 2000 : Math.max(2000, monitors.length * 10));
  const connectMs = await fleet.allConnected(120_000);
  const packs = quick ? 10 : monitors.length >= 1000 ? 6 : 30;
  meter.start();
  const result = await sendBacklog(fleet, monitors, { packs, packSize: 10, window: 4, start });
  const cpu = meter.stop();
  const disconnects = fleet.disconnects();
  await fleet.close();
  return { ...result, connectMs, disconnects, cpu };
}

/** CPU per 1,000 readings by party, and the rate the machine's cores would allow at that cost. */
function cpuRow(cpu: Record<string, number>, readings: number) {
  const perThousand = Object.fromEntries(Object.entries(cpu).map(([k, ms]) => [k, (ms * 1000) / readings]));
  const total = Object.values(perThousand).reduce((a, b) => a + b, 0);
  return {
    what: '  … CPU per 1,000 readings',
    value: Object.entries(perThousand)
      .map(([k, ms]) => `${k} ${ms.toFixed(0)} ms`)
      .join(', '),
    against: `${cpus().length} cores`,
    ratio: `≤ ${Math.round((cpus().length * 1000 * 1000) / total)} r/s`,
  };
}

async function endToEnd(product: ProductNode, monitors: Monitor[], insertCeilingRate: number) {
  const bare = await startBareBroker();
  const [{ directory }] = await sequelize.query<{ directory: string }>(
    'SELECT current_setting($1) AS directory',
    {
      bind: ['data_directory'],
      type: QueryTypes.SELECT,
    },
  );
  const bareMeter = cpuMeter({ load: { pid: process.pid }, broker: { pid: bare.pid, withChildren: true } });
  const productMeter = cpuMeter({
    load: { pid: process.pid },
    server: { pid: product.child.pid! },
    PostgreSQL: { pid: postmasterPid(directory), withChildren: true },
  });
  try {
    for (const size of quick ? [100] : [100, 1000]) {
      const fleet = monitors.slice(0, size);
      const start = Date.now() - (size === 100 ? 10 : 5) * DAY;
      const base = await backlogRun(bare.url, fleet, start, bareMeter);
      const before = await countReadings();
      const run = await backlogRun(product.mqttUrl, fleet, start, productMeter);
      const stored = (await countReadings()) - before;
      const perSecond = Math.round((run.readings * 1000) / run.ms);
      rows.push(
        {
          what: `bare aedes, ${size} monitors, QoS 1 packs of 10`,
          value: `${Math.round((base.messages * 1000) / base.ms)} msg/s`,
          against: '',
          ratio: '',
        },
        cpuRow(base.cpu, base.readings),
        {
          what: `product end to end, ${size} monitors, QoS 1`,
          value: `${Math.round((run.messages * 1000) / run.ms)} msg/s = ${perSecond} readings/s`,
          against: 'bare aedes msg/s',
          ratio: (run.messages / run.ms / (base.messages / base.ms)).toFixed(2),
        },
        {
          what: `  … readings stored vs INSERT ceiling`,
          value: `${stored} of ${run.readings} stored, ${run.disconnects} disconnects`,
          against: 'INSERT',
          ratio: (perSecond / insertCeilingRate).toFixed(2),
        },
        cpuRow(run.cpu, run.readings),
      );
    }
  } finally {
    await bare.stop();
  }
}

async function latencyAt(product: ProductNode, monitors: Monitor[], seconds: number, fleet?: Fleet) {
  const own = fleet ?? (await connectFleet(product.mqttUrl, monitors, Math.max(1000, monitors.length * 10)));
  await own.allConnected(120_000);
  const sent = new Map<string, number>();
  const received = new Map<string, number>();
  const listener = await listenToStream(
    product.baseUrl,
    await signIn(product.baseUrl),
    monitors.map((m) => m.systemId),
    received,
  );
  const before = await countReadings();
  const disconnectsBefore = own.disconnects();
  const { published, acknowledged } = await publishAtOneHertz(own, monitors, seconds, sent);
  await sleep(2000);
  listener.close();
  const latencies = [...sent].flatMap(([key, at]) => (received.has(key) ? [received.get(key)! - at] : []));
  const stored = (await countReadings()) - before;
  rows.push({
    what: `publish → WebSocket, ${monitors.length} monitors × 1 Hz, ${seconds} s`,
    value: `p50 ${percentile(latencies, 0.5).toFixed(0)} / p95 ${percentile(latencies, 0.95).toFixed(0)} / p99 ${percentile(latencies, 0.99).toFixed(0)} ms`,
    against: '',
    ratio: `${stored}/${published} stored, ${acknowledged} acked, ${latencies.length} live, ${own.disconnects() - disconnectsBefore} disc.`,
  });
  return own;
}

/** Every monitor reconnecting at once after a restart: time until all are back, then a checked minute of 1 Hz. */
async function connectStorm(product: ProductNode, monitors: Monitor[], fleet: Fleet) {
  await product.stop();
  const restarted = await startProduct({
    databaseUrl: url!,
    httpPort: product.httpPort,
    mqttPort: product.mqttPort,
  });
  const absorbedMs = await fleet.allConnected(120_000);
  rows.push({
    what: `restart with ${monitors.length} monitors connected`,
    value: `all reconnected ${(absorbedMs / 1000).toFixed(1)} s after the server was ready`,
    against: '',
    ratio: '',
  });
  await latencyAt(restarted, monitors, quick ? 10 : 20, fleet);
  return restarted;
}

async function main() {
  console.log(
    `Cellwarden bench${quick ? ' (quick)' : ''} on ${process.env.CW_BENCH_MACHINE}; PostgreSQL, broker, server and load on one machine`,
  );
  await migrateToLatest(sequelize);
  await seedDemoScenario(sequelize);
  const ceilingSystems = await sequelize.query<{ id: string }>(
    `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id)
     SELECT 'Ceiling ' || n, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id
     FROM (SELECT * FROM systems LIMIT 1) s, generate_series(1, 100) n RETURNING id`,
    { type: QueryTypes.SELECT },
  );
  console.log('storage ceilings …');
  const insertRate =
    runs('storage') || runs('e2e') ? await storageCeilings(ceilingSystems.map((s) => s.id)) : NaN;
  const profileDir = join(root, '.data', 'bench-profiles');
  if (profile) mkdirSync(profileDir, { recursive: true });
  let product = await startProduct({ databaseUrl: url!, profileDir: profile ? profileDir : undefined });
  try {
    const monitors = await createFleet(sequelize, product.baseUrl, quick ? 100 : 1000);
    if (runs('e2e')) {
      console.log('end to end …');
      await endToEnd(product, monitors, insertRate);
    }
    if (runs('latency')) {
      console.log('latency …');
      await latencyAt(product, monitors.slice(0, 5), 10).then((f) => f.close());
      for (const size of quick ? [100] : [100, 500])
        await (await latencyAt(product, monitors.slice(0, size), quick ? 10 : 30)).close();
      const everyone = await latencyAt(product, monitors, quick ? 10 : 30);
      if (runs('restart')) {
        console.log('restart …');
        product = await connectStorm(product, monitors, everyone);
      }
      await everyone.close();
    }
    const token = await signIn(product.baseUrl);
    if (runs('history')) {
      console.log('history …');
      const [history] = await sequelize.query<{ id: string }>(
        `INSERT INTO systems (name, kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id)
       SELECT 'History', kind, chemistry, nominal_voltage, rated_capacity_ah, usable_capacity_ah, owner_id
       FROM systems LIMIT 1 RETURNING id`,
        { type: QueryTypes.SELECT },
      );
      const now = Date.now();
      await seedHistory(sequelize, history.id, quick ? 30 : 365, now);
      for (const h of await timeHistory({
        sequelize,
        baseUrl: product.baseUrl,
        token,
        systemId: history.id,
        now,
        repeats: quick ? 5 : 15,
      }))
        rows.push({
          what: `history API, ${h.label} (${h.points} points)`,
          value: `${h.apiMs.toFixed(1)} ms`,
          against: `its SQL ${h.sqlMs.toFixed(1)} ms`,
          ratio: (h.apiMs / h.sqlMs).toFixed(2),
        });
    }
    if (runs('health')) {
      console.log('battery health …');
      rows.push(
        ...(await timeBatteryHealth({
          sequelize,
          baseUrl: product.baseUrl,
          token,
          repeats: quick ? 5 : 15,
          paint:
            existsSync(join(root, 'dist', 'web', 'browser', 'index.html')) && existsSync('/usr/bin/chromium'),
        })),
      );
    }
    if (
      runs('dashboard') &&
      existsSync(join(root, 'dist', 'web', 'browser', 'index.html')) &&
      existsSync('/usr/bin/chromium')
    ) {
      console.log('dashboard …');
      const d = await timeDashboard({
        baseUrl: product.baseUrl,
        token,
        mqttUrl: product.mqttUrl,
        monitor: monitors[0],
        runs: 3,
      });
      rows.push(
        {
          what: 'dashboard first visit, bytes on the wire',
          value: `${Math.round(d.dashboardBytes / 1024)} kB (JS ${Math.round(d.dashboardScriptBytes / 1024)} kB)`,
          against: '',
          ratio: '',
        },
        {
          what: 'first live value on screen',
          value: `${d.dashboardMs.toFixed(0)} ms`,
          against: `bare page ${d.bareMs.toFixed(0)} ms`,
          ratio: (d.dashboardMs / d.bareMs).toFixed(2),
        },
        {
          what: 'first live value, by the page’s own clock',
          value: `${d.dashboardInPageMs.toFixed(0)} ms`,
          against: `bare page ${d.bareInPageMs.toFixed(0)} ms`,
          ratio: (d.dashboardInPageMs / d.bareInPageMs).toFixed(2),
        },
        {
          what: 'live view complete (its own tiles show values)',
          value: `${d.completeMs.toFixed(0)} ms`,
          against: `by the page’s clock ${d.completeInPageMs.toFixed(0)} ms`,
          ratio: '',
        },
      );
    }
  } finally {
    await product.stop();
    await sequelize.close();
  }
  printTable(rows);
}

main().catch((error) => {
  printTable(rows);
  console.error(`bench failed: ${error?.stack ?? error}`);
  process.exit(1);
});
