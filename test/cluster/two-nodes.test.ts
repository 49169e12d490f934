import request from 'supertest';
import type { StreamMessage } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { DEMO_DEVICES } from '../../db/seeders/demo-scenario';
import { compareDelivery, storedTimes } from '../reliability/delivery-ledger';
import { createClusterDevice } from '../support/cluster-device';
import { runFleetBenchmark } from '../support/cluster-fleet';
import {
  createSharedDatabase,
  percentile,
  startClusterNode,
  type ClusterNode,
} from '../support/cluster-nodes';
import { useTestRedis, type TestRedis } from '../support/cluster-redis';
import { subscribedStream, systemIdOf } from '../support/cluster-session';
import { signInAs, until } from '../support/http-session';
import { createProcessServer, freePort, type ProcessServer } from '../support/process-server';

jest.setTimeout(120000);

const cabin = DEMO_DEVICES.find((d) => d.system === 'cabin')!;
const [owner, , support] = demo.users;
let redis: TestRedis;
let database: Awaited<ReturnType<typeof createSharedDatabase>>;

// Every test on Redis is in this one file, so they run one after another: brokers on one Redis hear each
// other, and two tests with the same demo device would take each other's sessions over.
beforeAll(async () => {
  redis = await useTestRedis();
});
afterAll(async () => {
  await redis?.stop();
});

it('takes percentiles by the nearest-rank method', () => {
  // Nearest-rank worked example (Wikipedia, "Percentile", nearest-rank method): of 15, 20, 35, 40, 50
  // the 30th and 40th percentiles are 20, the 50th is 35 and the 100th is 50.
  const list = [50, 15, 40, 20, 35];
  expect([30, 40, 50, 100].map((p) => percentile(list, p))).toEqual([20, 20, 35, 50]);
});

describe('two nodes in this process sharing Redis and PostgreSQL', () => {
  let nodeA: ClusterNode;
  let nodeB: ClusterNode;
  beforeAll(async () => {
    await redis.flush();
    database = await createSharedDatabase();
    // Three failures per account: low enough to see two nodes counting together.
    const env = { DATABASE_URL: database.url, REDIS_URL: redis.url, SIGN_IN_LIMIT_PER_ACCOUNT: '3' };
    nodeA = await startClusterNode(env);
    nodeB = await startClusterNode(env);
  });
  afterAll(async () => {
    await nodeA?.stop();
    await nodeB?.stop();
    await database?.drop();
  });

  it('streams on node B the readings a device publishes on node A, each stored once', async () => {
    const { accessToken } = await signInAs(nodeB.baseUrl, owner.email, demo.password);
    const cabinId = await systemIdOf(nodeB.baseUrl, accessToken, 'cabin');
    const stream = await subscribedStream(nodeB.server.httpPort, accessToken, [cabinId]);
    const seenAt = new Map<number, number>();
    let liveReadings = 0;
    stream.socket.on('message', (data) => {
      const message = JSON.parse(data.toString()) as StreamMessage;
      if (message.type !== 'reading' || message.systemId !== cabinId) return;
      liveReadings++;
      seenAt.set(message.reading.measuredAt, Date.now());
    });

    const count = 100;
    const device = createClusterDevice([nodeA.mqttUrl]);
    // Paced at 20 readings a second, all measured in the past so every one is plausible.
    const start = new Date(Date.now() - 600_000).toISOString();
    const args = ['--scenario', 'driving-day', '--interval', '1', '--count', String(count), '--speed', '20'];
    const { code, stderr } = await device.run(cabin, [...args, '--start', start]);
    expect({ code, stderr }).toEqual({ code: 0, stderr: '' });
    await until(() => seenAt.size >= count, 10000);
    stream.socket.close();

    const stored = await storedTimes(database.sequelize, cabin.id);
    const latencies = [...seenAt].map(([measuredAt, at]) => at - device.sentAt.get(measuredAt)!);
    console.log(`fan-out: ${device.ledger.sent.size} readings sent on node A, ${stored.rows} rows stored`);
    console.log(
      `fan-out latency A→Redis→B stream: p50 ${percentile(latencies, 50)} ms, p95 ${percentile(latencies, 95)} ms, ` +
        `max ${Math.max(...latencies)} ms over ${latencies.length} readings`,
    );
    expect(device.ledger.sent.size).toBe(count);
    expect(compareDelivery(device.ledger.sent, stored)).toEqual({ lost: 0, extra: 0, duplicated: 0 });
    // Each reading went live exactly once on B, although both nodes hear every event on the bus.
    expect({ liveReadings, distinct: seenAt.size }).toEqual({ liveReadings: count, distinct: count });
    expect([...seenAt.keys()].sort()).toEqual([...device.ledger.sent].sort());
    // Only the node the device is connected to stores; the other never sees the PUBLISH as ingest.
    expect([nodeA.server.ingest.stats().stored, nodeB.server.ingest.stats().stored]).toEqual([count, 0]);
  });

  it('ends a stream on node B at once when the grant behind it is revoked on node A', async () => {
    const ownerSession = await signInAs(nodeA.baseUrl, owner.email, demo.password);
    const supportSession = await signInAs(nodeB.baseUrl, support.email, demo.password);
    const vanId = await systemIdOf(nodeA.baseUrl, ownerSession.accessToken, 'van');
    const stream = await subscribedStream(nodeB.server.httpPort, supportSession.accessToken, [vanId]);
    const auth = { Authorization: `Bearer ${ownerSession.accessToken}` };
    const grants = (await request(nodeA.baseUrl).get(`/api/systems/${vanId}/grants`).set(auth)).body.grants;
    const active = grants.find((g: { revokedAt?: unknown }) => !g.revokedAt);
    const revoked = await request(nodeA.baseUrl)
      .delete(`/api/systems/${vanId}/grants/${active.id}`)
      .set(auth);
    expect(revoked.status).toBe(204);
    await until(() => stream.messages.some((m) => m.type === 'access-ended'));
    expect(stream.messages.filter((m) => m.type === 'access-ended')).toEqual([
      { type: 'access-ended', systemIds: [vanId] },
    ]);
    stream.socket.close();
  });

  it('counts failed sign-ins for one account across both nodes', async () => {
    const attempt = (node: ClusterNode) =>
      request(node.baseUrl)
        .post('/api/auth/sign-in')
        .send({ email: 'guess.target@nowhere.example', password: 'not-the-password' })
        .then((r) => r.status);
    const statuses = [await attempt(nodeA), await attempt(nodeB), await attempt(nodeA), await attempt(nodeB)];
    // Limit 3 per account: the fourth failure is refused whichever node it reaches.
    expect(statuses).toEqual([401, 401, 401, 429]);
  });
});

describe('two node processes sharing Redis and PostgreSQL', () => {
  let a: ProcessServer;
  let b: ProcessServer;
  const startNode = async () => {
    const node = createProcessServer({
      databaseUrl: database.url,
      httpPort: await freePort(),
      mqttPort: await freePort(),
      env: { REDIS_URL: redis.url, INGEST_RETRY_MS: '10' },
    });
    node.start();
    await node.ready();
    return node;
  };
  beforeAll(async () => {
    await redis.flush();
    database = await createSharedDatabase();
    [a, b] = [await startNode(), await startNode()];
  });
  afterAll(async () => {
    await a?.kill();
    await b?.stop();
    await database?.drop();
  });

  it('ingests a fleet spread over both nodes and streams all of it to one dashboard (benchmark)', async () => {
    const { accessToken } = await signInAs(b.baseUrl, owner.email, demo.password);
    const bench = await runFleetBenchmark({
      sequelize: database.sequelize,
      brokers: [a.mqttUrl, b.mqttUrl],
      dashboardPort: Number(new URL(b.baseUrl).port),
      token: accessToken,
      template: cabin,
      devices: 40,
      perDevice: 500,
    });
    console.log(
      `fleet benchmark: ${bench.devices} devices over 2 node processes, ${bench.readings} readings in packs of 20 ` +
        `in ${bench.seconds.toFixed(1)} s = ${Math.round(bench.readings / bench.seconds)} readings/s; ` +
        `${bench.storedRows} rows stored, ${bench.liveOnDashboard} live on one dashboard on B`,
    );
    expect({ stored: bench.storedRows, live: bench.liveOnDashboard }).toEqual({
      stored: bench.readings,
      live: bench.readings,
    });
  });

  it('loses nothing acknowledged when node A is killed -9 and the device moves to node B', async () => {
    const device = createClusterDevice([a.mqttUrl, b.mqttUrl]);
    const count = 800;
    // As fast as the broker acknowledges, QoS 1, measured in the past so every reading is plausible.
    const start = new Date(Date.now() - 2 * count * 5000).toISOString();
    const args = ['--scenario', 'driving-day', '--interval', '5', '--count', String(count), '--start', start];
    const running = device.run(cabin, args);
    const { acked } = device.ledger;
    await until(() => acked.size >= 200, 30000);
    await a.kill();
    const killedAt = Date.now();
    const ackedAtKill = new Set(acked);
    await until(() => acked.size > ackedAtKill.size, 30000);
    const movedMs = Date.now() - killedAt;
    const { code, stderr } = await running;
    expect({ code, stderr }).toEqual({ code: 0, stderr: '' });

    const stored = await storedTimes(database.sequelize, cabin.id);
    const all = compareDelivery(device.ledger.sent, stored);
    const ackedLost = compareDelivery(ackedAtKill, stored).lost;
    console.log(
      `kill -9: ${device.ledger.sent.size} readings sent, ${stored.rows} rows stored, ${ackedAtKill.size} ` +
        `acknowledged by A before the kill (${ackedLost} of them lost), ${all.lost} lost, ${all.duplicated} ` +
        `duplicated, ${device.ledger.packets - device.ledger.sent.size} redelivered, ` +
        `first acknowledgement by B ${movedMs} ms after the kill`,
    );
    expect(device.ledger.sent.size).toBe(count);
    expect({ ...all, ackedLost }).toEqual({ lost: 0, extra: 0, duplicated: 0, ackedLost: 0 });
  });
});
