import { connectAsync, type MqttClient } from 'mqtt';
import request from 'supertest';
import {
  encodeReadingPack,
  fromHistoryColumns,
  readingsTopic,
  type BatteryReading,
  type StreamMessage,
} from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { openStream, signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// One bank, two monitors: the van's own (the lead, registered first) and a second one added later that reads a
// volt higher. Status lists both, labelled; the stream says which monitor measured each reading; raw history and
// the analytics follow the lead only, so the two never alternate on one line.

let node: Awaited<ReturnType<typeof startTestServer>>;
let token: string;
let vanId: string;
const lead = demo.devices[0];
const clients: MqttClient[] = [];

beforeAll(async () => {
  node = await startTestServer();
  token = (await signInAs(node.baseUrl, demo.users[0].email, demo.password)).accessToken;
  const systems = (await request(node.baseUrl).get('/api/systems').set(auth())).body.systems;
  vanId = systems.find((s: { kind: string }) => s.kind === 'van').id;
});
afterAll(async () => {
  for (const client of clients) await client.endAsync();
  await node.stop();
});

function auth() {
  return { Authorization: `Bearer ${token}` };
}

async function connect(username: string, password: string) {
  const client = await connectAsync(node.mqttUrl, {
    username,
    password,
    clientId: `${username}/two-monitors`,
    reconnectPeriod: 0,
  });
  clients.push(client);
  return client;
}

const reading = (measuredAt: number, voltage: number): BatteryReading => ({
  measuredAt,
  voltage,
  current: -3,
  temperature: 4,
  stateOfCharge: 64,
});

it('shows both monitors labelled and keeps the headline, history and analytics on the lead', async () => {
  const added = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/devices`)
    .set(auth())
    .send({ id: 'moth-second-shunt', label: 'Second shunt' });
  expect(added.status).toBe(201);
  const second = await connect(added.body.mqttUsername, added.body.mqttPassword);
  const first = await connect(lead.id, lead.secret);

  const stream = openStream(Number(new URL(node.baseUrl).port), token);
  await stream.opened;
  stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds: [vanId] }));
  await until(() => stream.messages.some((m) => m.type === 'subscribed'));

  // Interleaved in time, a second apart: lead at 13.2 V, the second monitor at 14.2 V.
  const start = Date.now() - 60_000;
  const leadReadings = Array.from({ length: 10 }, (_, i) => reading(start + i * 2000, 13.2));
  const secondReadings = Array.from({ length: 10 }, (_, i) => reading(start + i * 2000 + 1000, 14.2));
  await first.publishAsync(readingsTopic(lead.id), JSON.stringify(encodeReadingPack(lead.id, leadReadings)), {
    qos: 1,
  });
  await second.publishAsync(
    readingsTopic('moth-second-shunt'),
    JSON.stringify(encodeReadingPack('moth-second-shunt', secondReadings)),
    { qos: 1 },
  );

  const live = () =>
    stream.messages.filter((m): m is Extract<StreamMessage, { type: 'reading' }> => m.type === 'reading');
  await until(() => live().length === 20, 10_000);
  const byDevice = (id: string) => live().filter((m) => m.reading.deviceId === id);
  expect(byDevice(lead.id)).toHaveLength(10);
  expect(byDevice('moth-second-shunt')).toHaveLength(10);
  for (const m of byDevice('moth-second-shunt')) {
    expect(m.reading.voltage).toBe(14.2);
    // Only the lead's readings move the estimator and flags.
    expect(m.derived).toBeNull();
  }
  for (const m of byDevice(lead.id)) expect(m.derived).not.toBeNull();

  const status = (await request(node.baseUrl).get(`/api/systems/${vanId}/status`).set(auth())).body.status;
  expect(
    status.monitors.map((m: { deviceId: string; label: string; lead: boolean }) => [m.deviceId, m.lead]),
  ).toEqual([
    [lead.id, true],
    ['moth-second-shunt', false],
  ]);
  expect(status.monitors[1]).toMatchObject({ label: 'Second shunt', reading: { voltage: 14.2 } });
  expect(status.monitors[0].reading).toMatchObject({ voltage: 13.2, deviceId: lead.id });
  // The second monitor's reading is the newest, yet the headline stays on the lead.
  expect(status.latestReading).toMatchObject({ voltage: 13.2, deviceId: lead.id });

  const history = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/readings`)
    .query({ from: new Date(start - 1000).toISOString(), to: new Date(start + 30_000).toISOString() })
    .set(auth());
  expect(history.status).toBe(200);
  expect(history.body.resolution).toBe('raw');
  const points = fromHistoryColumns(history.body.columns);
  expect(points.length).toBe(10);
  for (const point of points) expect(point.voltage).toBeCloseTo(13.2, 6);
  stream.socket.close();
}, 30_000);
