import { connectAsync, type MqttClient } from 'mqtt';
import request from 'supertest';
import WebSocket from 'ws';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { run } from '../../simulator/src/run';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { startTestServer } from '../support/test-server';

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let ownerToken: string;
let vanId: string;
let cabinId: string;
const [van, cabin] = demo.devices;

const deviceClient = (device: { id: string; secret: string }) =>
  connectAsync(node.mqttUrl, {
    username: device.id,
    password: device.secret,
    clientId: `${device.id}/test-${Math.random()}`,
    reconnectPeriod: 0,
  });

const reading = (measuredAt: number): BatteryReading => ({
  measuredAt,
  voltage: 13.2,
  current: -4.1,
  temperature: -3.5,
  stateOfCharge: 71,
});
const count = (systemId: string) => createReadingsRepository(node.database).countForSystem(systemId);

beforeAll(async () => {
  node = await startTestServer();
  const signIn = await request(node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: demo.users[0].email, password: demo.password });
  ownerToken = signIn.body.accessToken;
  const systems = (
    await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${ownerToken}`)
  ).body.systems;
  vanId = systems.find((s: { kind: string }) => s.kind === 'van').id;
  cabinId = systems.find((s: { kind: string }) => s.kind === 'cabin').id;
});
afterAll(async () => {
  await node.stop();
});

it('stores exactly N rows for a simulator run of N readings at QoS 1', async () => {
  const before = await count(cabinId);
  const code = await run(
    [
      '--broker',
      node.mqttUrl,
      '--device',
      `${cabin.id}:${cabin.secret}`,
      '--scenario',
      'driving-day',
      '--count',
      '25',
      '--start',
      new Date(Date.now() - 3600_000).toISOString(),
    ],
    {
      connect: connectAsync,
      now: Date.now,
      stdout: () => undefined,
      stderr: () => undefined,
    },
  );
  expect(code).toBe(0);
  expect((await count(cabinId)) - before).toBe(25);
});

it('stores a reading published twice only once', async () => {
  const client = await deviceClient(van);
  const payload = JSON.stringify(encodeReadingPack(van.id, [reading(Date.now() - 120_000)]));
  const before = await count(vanId);
  await client.publishAsync(readingsTopic(van.id), payload, { qos: 1 });
  await client.publishAsync(readingsTopic(van.id), payload, { qos: 1 });
  await client.endAsync();
  expect((await count(vanId)) - before).toBe(1);
});

it('refuses and counts malformed payloads while the broker keeps serving', async () => {
  const client = await deviceClient(van);
  for (const bad of ['not json', '[]', '{"bn":1}', JSON.stringify([{ n: 'voltage', u: 'A', v: 13 }])]) {
    await client.publishAsync(readingsTopic(van.id), bad, { qos: 1 });
  }
  const good = JSON.stringify(encodeReadingPack(van.id, [reading(Date.now() - 60_000)]));
  const before = await count(vanId);
  await client.publishAsync(readingsTopic(van.id), good, { qos: 1 });
  await client.endAsync();
  expect((await count(vanId)) - before).toBe(1);
  const refused = node.server.ingest.stats().refusals[van.id];
  expect(Object.values(refused).reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(4);
});

it("refuses a device publishing to another device's topic and stores nothing", async () => {
  const client: MqttClient = await deviceClient(van);
  const before = await count(cabinId);
  const closed = new Promise<void>((resolve) => client.once('close', () => resolve()));
  client.publish(
    readingsTopic(cabin.id),
    JSON.stringify(encodeReadingPack(cabin.id, [reading(Date.now() - 30_000)])),
    { qos: 1 },
  );
  await closed;
  client.end(true);
  expect(await count(cabinId)).toBe(before);
  expect(node.server.ingest.stats().refusals[van.id].foreign_topic).toBe(1);
});

it('refuses a device with a wrong secret at connect', async () => {
  await expect(deviceClient({ id: van.id, secret: 'wrong' })).rejects.toBeDefined();
});

it('streams live readings to a subscriber of a system it may see, and nothing of one it may not', async () => {
  const supportSignIn = await request(node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: demo.users[2].email, password: demo.password });
  const open = (token: string) =>
    new Promise<{ socket: WebSocket; messages: { type: string; systemId?: string; systemIds?: string[] }[] }>(
      (resolve, reject) => {
        const socket = new WebSocket(`ws://127.0.0.1:${node.server.httpPort}/api/stream`, [
          'cellwarden.v1',
          `bearer.${token}`,
        ]);
        const messages: { type: string }[] = [];
        // The dashboard reads text frames only.
        socket.on('message', (data, isBinary) =>
          messages.push(isBinary ? { type: 'binary' } : JSON.parse(data.toString())),
        );
        socket.on('open', () => {
          socket.send(JSON.stringify({ type: 'subscribe', systemIds: [cabinId] }));
          resolve({ socket, messages });
        });
        socket.on('error', reject);
      },
    );
  const owner = await open(ownerToken);
  // A second tab of the same person: each reading is serialised once and sent to both.
  const ownerAgain = await open(ownerToken);
  const stranger = await open(supportSignIn.body.accessToken);
  const until = async (check: () => boolean) => {
    for (let i = 0; i < 100 && !check(); i++) await new Promise((r) => setTimeout(r, 50));
  };
  await until(() => owner.messages.some((m) => m.type === 'subscribed'));
  await until(() => stranger.messages.some((m) => m.type === 'subscribed'));
  const client = await deviceClient(cabin);
  await client.publishAsync(
    readingsTopic(cabin.id),
    JSON.stringify(encodeReadingPack(cabin.id, [reading(Date.now() - 1000)])),
    { qos: 1 },
  );
  await client.endAsync();
  await until(() => owner.messages.some((m) => m.type === 'reading'));
  await until(() => ownerAgain.messages.some((m) => m.type === 'reading'));
  expect(owner.messages.find((m) => m.type === 'reading')?.systemId).toBe(cabinId);
  expect(ownerAgain.messages.filter((m) => m.type === 'reading')).toEqual(
    owner.messages.filter((m) => m.type === 'reading'),
  );
  expect(owner.messages.some((m) => m.type === 'binary')).toBe(false);
  expect(stranger.messages.find((m) => m.type === 'subscribed')?.systemIds).toEqual([]);
  expect(stranger.messages.some((m) => m.type === 'reading')).toBe(false);
  owner.socket.close();
  ownerAgain.socket.close();
  stranger.socket.close();
});

it('refuses a stream upgrade without a valid token', async () => {
  const status = await new Promise<number>((resolve) => {
    const socket = new WebSocket(`ws://127.0.0.1:${node.server.httpPort}/api/stream`, [
      'cellwarden.v1',
      'bearer.forged',
    ]);
    socket.on('unexpected-response', (_req, res) => resolve(res.statusCode ?? 0));
    socket.on('error', () => undefined);
  });
  expect(status).toBe(401);
});

it('keeps a history series within the point budget for a long range', async () => {
  const response = await request(node.baseUrl)
    .get(`/api/systems/${cabinId}/readings`)
    .query({ from: new Date(Date.now() - 365 * 24 * 3600_000).toISOString(), to: new Date().toISOString() })
    .set('Authorization', `Bearer ${ownerToken}`);
  expect(response.status).toBe(200);
  // Sent as columns: every column holds one entry per point.
  const { measuredAt, voltage } = response.body.columns;
  expect(measuredAt.length).toBeGreaterThan(0);
  expect(measuredAt.length).toBeLessThanOrEqual(2000);
  expect(voltage).toHaveLength(measuredAt.length);
});
