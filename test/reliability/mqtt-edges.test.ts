import { connect as tcpConnect } from 'node:net';
import { MqttClient, connectAsync, type IClientOptions } from 'mqtt';
import request from 'supertest';
import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// Regression tests for the broker's edges: device secrets checked without stalling the server, guessing
// braked without locking the real monitor out, client ids that cannot knock another device off, packets
// refused by their header, and refusals logged as counts. Each failed before the hardening.

jest.setTimeout(90000);

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
const [van, cabin] = demo.devices;
let ownerToken: string;

beforeAll(async () => {
  node = await startTestServer();
  ownerToken = (await signInAs(node.baseUrl, demo.users[0].email, demo.password)).accessToken;
});
afterAll(() => node.stop());

/** One connect attempt from a chosen loopback address; resolves to the CONNACK code (0 = accepted). */
function attempt(
  options: IClientOptions,
  localAddress = '127.0.0.1',
): Promise<{ code: number; client: MqttClient }> {
  return new Promise((resolve) => {
    const client = new MqttClient(
      () => tcpConnect({ host: '127.0.0.1', port: node.server.mqttPort, localAddress }),
      { reconnectPeriod: 0, connectTimeout: 20000, protocolVersion: 4, ...options },
    );
    client.once('connect', () => resolve({ code: 0, client }));
    client.once('error', (error) => {
      client.end(true);
      resolve({ code: (error as { code?: number }).code ?? -1, client });
    });
  });
}

const percentile = (values: number[], p: number) =>
  [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(p * values.length))];

it('keeps a device to its own client id, so it cannot knock another device off', async () => {
  const real = await connectAsync(node.mqttUrl, {
    username: cabin.id,
    password: cabin.secret,
    clientId: cabin.id,
    reconnectPeriod: 0,
  });
  let knockedOff = false;
  real.on('close', () => (knockedOff = true));
  // The van's valid credentials with the cabin's client id: MQTT 3.1.1 §3.2.2.3 code 2, identifier rejected.
  const impostor = await attempt({ username: van.id, password: van.secret, clientId: cabin.id });
  expect(impostor.code).toBe(2);
  const suffixTrick = await attempt({ username: van.id, password: van.secret, clientId: `${cabin.id}/x` });
  expect(suffixTrick.code).toBe(2);
  await real.publishAsync(
    readingsTopic(cabin.id),
    JSON.stringify(
      encodeReadingPack(cabin.id, [
        { measuredAt: Date.now() - 1000, voltage: 25.9, current: -2, temperature: 8 },
      ]),
    ),
    { qos: 1 },
  );
  expect(knockedOff).toBe(false);
  await real.endAsync();
});

it('refuses a flood of wrong secrets cheaply, answering known and unknown ids alike, while the API carries on', async () => {
  const api: number[] = [];
  let flooding = true;
  const probe = (async () => {
    while (flooding) {
      const started = performance.now();
      const { status } = await request(node.baseUrl)
        .get('/api/systems')
        .set('Authorization', `Bearer ${ownerToken}`);
      expect(status).toBe(200);
      api.push(performance.now() - started);
    }
  })();
  const wrong = (username: string, localAddress: string) =>
    attempt({ username, password: 'definitely-not-the-secret', clientId: username }, localAddress);
  // Ten rounds of twenty at once: known id and unknown ids, each from its own address.
  const codes: number[] = [];
  const unknownCodes: number[] = [];
  for (let round = 0; round < 10; round++) {
    const known = Array.from({ length: 10 }, (_, i) => wrong(van.id, `127.0.1.${round * 10 + i + 1}`));
    const unknown = Array.from({ length: 10 }, (_, i) =>
      wrong(`cw-nobody-${round}-${i}`, `127.0.2.${round * 10 + i + 1}`),
    );
    codes.push(...(await Promise.all(known)).map((r) => r.code));
    unknownCodes.push(...(await Promise.all(unknown)).map((r) => r.code));
  }
  flooding = false;
  await probe;
  // Bad user name or password, the same code whether or not the device exists.
  expect(new Set(unknownCodes)).toEqual(new Set([4]));
  expect(codes.filter((c) => c === 4).length).toBeGreaterThanOrEqual(60);
  expect(codes.every((c) => c === 4)).toBe(true);
  console.log(
    `[mqtt edges] 200 wrong-secret connects: API p50 ${percentile(api, 0.5).toFixed(0)} ms, p95 ${percentile(api, 0.95).toFixed(0)} ms over ${api.length} requests`,
  );
  // The real van, from its own address, still gets in (slowed, never refused) after 100 guesses at its id.
  const real = await attempt({ username: van.id, password: van.secret, clientId: van.id }, '127.0.3.1');
  expect(real.code).toBe(0);
  real.client.end(true);
});

it('refuses a guesser on one address after ten tries at one id, without refusing that id elsewhere', async () => {
  const codes: number[] = [];
  for (let i = 0; i < 12; i++)
    codes.push(
      (await attempt({ username: cabin.id, password: `guess-${i}`, clientId: cabin.id }, '127.0.4.1')).code,
    );
  expect(codes.slice(0, 10)).toEqual(Array(10).fill(4));
  // Server unavailable: no secret is checked for this address and id for the rest of the minute.
  expect(codes.slice(10)).toEqual([3, 3]);
  const elsewhere = await attempt(
    { username: cabin.id, password: cabin.secret, clientId: cabin.id },
    '127.0.4.2',
  );
  expect(elsewhere.code).toBe(0);
  elsewhere.client.end(true);
});

it('closes a connection whose packet announces more than the limit, before reading its body', async () => {
  const socket = tcpConnect({ host: '127.0.0.1', port: node.server.mqttPort });
  await new Promise((resolve) => socket.once('connect', resolve));
  let written = 0;
  const closed = new Promise<void>((resolve) => socket.once('close', () => resolve()));
  socket.on('error', () => undefined);
  // PUBLISH, remaining length 50 MB as an MQTT variable byte integer (§2.2.3), then the start of its body.
  const length = 50 * 1024 * 1024;
  const header = [0x30];
  for (let x = length; x > 0; x = Math.floor(x / 128)) header.push((x % 128) | (x >= 128 ? 0x80 : 0));
  socket.write(Buffer.from(header));
  const chunk = Buffer.alloc(64 * 1024, 0x41);
  const feeding = (async () => {
    while (!socket.destroyed && written < 8 * 1024 * 1024) {
      if (!socket.write(chunk)) await new Promise((resolve) => setTimeout(resolve, 5));
      written += chunk.length;
    }
  })();
  await closed;
  await feeding;
  expect(written).toBeLessThan(8 * 1024 * 1024);
  expect((await request(node.baseUrl).get('/api/health')).status).toBe(200);
});

it('logs refused readings as a count per device, not a line per message', async () => {
  const device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/garbage`,
    reconnectPeriod: 0,
  });
  const before = node.server.ingest.stats().refusals[van.id]?.payload_not_json ?? 0;
  await Promise.all(
    Array.from({ length: 300 }, (_, i) =>
      device.publishAsync(readingsTopic(van.id), `not json ${i}`, { qos: 1 }),
    ),
  );
  await device.endAsync();
  expect(node.server.ingest.stats().refusals[van.id].payload_not_json - before).toBe(300);
  const lines = node.logger.entries.filter(
    (e) => e.message === 'reading refused' && e.fields.deviceId === van.id,
  );
  expect(lines.length).toBeLessThanOrEqual(1);
});
