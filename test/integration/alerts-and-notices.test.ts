import { connectAsync } from 'mqtt';
import request from 'supertest';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { openStream, signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// The flag engine on the live path: readings in over MQTT, an alert event stored, pushed on the stream,
// e-mailed to the owner through the local SMTP catcher, listed, acknowledged, and cleared.

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let owner: Awaited<ReturnType<typeof signInAs>>;
let vanId: string;
const [van] = demo.devices;

beforeAll(async () => {
  node = await startTestServer();
  owner = await signInAs(node.baseUrl, demo.users[0].email, demo.password);
  const systems = await request(node.baseUrl)
    .get('/api/systems')
    .set('Authorization', `Bearer ${owner.accessToken}`);
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
});
afterAll(() => node.stop());

const auth = () => ({ Authorization: `Bearer ${owner.accessToken}` });

/** A pack at `temperature` °C taking `current` A, one reading every 5 s ending now. */
function series(count: number, endAt: number, temperature: number, current: number): BatteryReading[] {
  return Array.from({ length: count }, (_, i) => ({
    measuredAt: endAt - (count - 1 - i) * 5000,
    voltage: 13.4,
    current,
    temperature,
    stateOfCharge: 64,
  }));
}

it('flags charging below 0 °C, pushes it live, e-mails the owner, and records its end', async () => {
  const stream = openStream(node.server.httpPort, owner.accessToken);
  await stream.opened;
  stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds: [vanId] }));
  await until(() => stream.messages.some((m) => m.type === 'subscribed'));

  const device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/alerts-${Date.now()}`,
  });
  const now = Date.now();
  // Two minutes of 15 A into a pack at −6 °C: past the flag's 30 s minimum duration.
  const cold = series(25, now - 1_000_000, -6, 15);
  await device.publishAsync(readingsTopic(van.id), JSON.stringify(encodeReadingPack(van.id, cold)), {
    qos: 1,
  });

  await until(() => stream.messages.some((m) => m.type === 'alert' && m.alert.kind === 'cold-charging'));
  const started = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/alerts`)
    .query({ active: 'true' })
    .set(auth());
  const alert = started.body.alerts.find((a: { kind: string }) => a.kind === 'cold-charging');
  expect(alert).toMatchObject({ severity: expect.any(String), endedAt: null, unit: '°C' });
  expect(alert.peakValue).toBeCloseTo(-6, 5);

  const mail = await node.server.mailCatcher!.waitFor(
    (m) => m.to.includes(demo.users[0].email) && /cold/i.test(m.subject),
    5000,
  );
  expect(mail.text).toMatch(/does not replace/i);

  const status = await request(node.baseUrl).get(`/api/systems/${vanId}/status`).set(auth());
  expect(status.body.status.derived.activeFlags.map((f: { kind: string }) => f.kind)).toContain(
    'cold-charging',
  );
  expect(status.body.status.derived.stateOfChargeSource).toBe('reported');

  const ack = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/alerts/${alert.id}/acknowledge`)
    .set(auth())
    .send({ note: 'Charger switched off; heater warming the pack' });
  expect(ack.status).toBe(200);
  expect(ack.body.alert).toMatchObject({
    note: 'Charger switched off; heater warming the pack',
    acknowledgedBy: { displayName: 'Ilse Varga' },
  });

  // The pack warmed and the charger stopped: the flag ends and the end is e-mailed too.
  // Warm and discharging for longer than the flag's 15-minute release delay.
  const warm = series(200, now, 6, -2);
  await device.publishAsync(readingsTopic(van.id), JSON.stringify(encodeReadingPack(van.id, warm)), {
    qos: 1,
  });
  await until(async () => {
    const listed = await request(node.baseUrl).get(`/api/systems/${vanId}/alerts`).set(auth());
    return listed.body.alerts.some(
      (a: { id: string; endedAt: number | null }) => a.id === alert.id && a.endedAt !== null,
    );
  });
  await node.server.mailCatcher!.waitFor(
    (m) => m.to.includes(demo.users[0].email) && /cleared/i.test(m.subject),
    5000,
  );
  await device.endAsync();
  stream.socket.close();
});

it('refuses an acknowledgement note with control characters, naming the field', async () => {
  const response = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/alerts/00000000-0000-4000-8000-000000000000/acknowledge`)
    .set(auth())
    .send({ note: 'ok\r\nBcc: someone@example.com' });
  expect(response.status).toBe(400);
  expect(response.body.error.field).toBe('note');
});

it('reads and changes settings with defaults from the chemistry, and refuses usable above rated', async () => {
  const got = await request(node.baseUrl).get(`/api/systems/${vanId}/settings`).set(auth());
  expect(got.status).toBe(200);
  const settings = got.body.settings;
  // LiFePO4 defaults of the flag engine: 20 % warning, 10 % critical (common practice).
  expect(settings.thresholdDefaults).toMatchObject({
    lowChargeWarningPercent: 20,
    lowChargeCriticalPercent: 10,
  });
  const changed = {
    ...settings,
    thresholdDefaults: undefined,
    chargeSources: [{ id: 'dcdc', kind: 'dc-dc', label: 'DC-DC charger', ratedCurrentA: 30 }],
    thresholds: { ...settings.thresholds, lowChargeWarningPercent: 30 },
  };
  const put = await request(node.baseUrl).put(`/api/systems/${vanId}/settings`).set(auth()).send(changed);
  expect(put.status).toBe(200);
  expect(put.body.settings.thresholds.lowChargeWarningPercent).toBe(30);
  expect(put.body.settings.chargeSources).toHaveLength(1);
  const bad = await request(node.baseUrl)
    .put(`/api/systems/${vanId}/settings`)
    .set(auth())
    .send({ ...changed, battery: { ...changed.battery, usableCapacityAh: 999 } });
  expect(bad.status).toBe(400);
  expect(bad.body.error.field).toBe('battery.usableCapacityAh');
  const support = await signInAs(node.baseUrl, demo.users[2].email, demo.password);
  const refused = await request(node.baseUrl)
    .put(`/api/systems/${vanId}/settings`)
    .set('Authorization', `Bearer ${support.accessToken}`)
    .send(changed);
  expect(refused.status).toBe(403);
});

it('keeps preferences per person and refuses an unknown flag kind', async () => {
  const put = await request(node.baseUrl)
    .put('/api/me/preferences')
    .set(auth())
    .send({ temperatureUnit: 'F', emailFlags: ['low-charge'] });
  expect(put.body.preferences).toEqual({ temperatureUnit: 'F', emailFlags: ['low-charge'] });
  const none = await request(node.baseUrl)
    .put('/api/me/preferences')
    .set(auth())
    .send({ temperatureUnit: 'C', emailFlags: [] });
  expect(none.body.preferences.emailFlags).toEqual([]);
  const bad = await request(node.baseUrl)
    .put('/api/me/preferences')
    .set(auth())
    .send({ temperatureUnit: 'C', emailFlags: ['free-beer'] });
  expect(bad.status).toBe(400);
  expect(bad.body.error.field).toMatch(/^emailFlags/);
});

it("records the flags a device's late backlog held, as past alerts on the right times", async () => {
  const device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/late-${Date.now()}`,
  });
  const publish = (readings: BatteryReading[]) =>
    device.publishAsync(readingsTopic(van.id), JSON.stringify(encodeReadingPack(van.id, readings)), {
      qos: 1,
    });
  const now = Date.now();
  await publish(series(5, now, 7, -1.5)); // the live state is at "now" before the backlog arrives
  // Three hours ago, while the van was out of coverage: 20 minutes charging a −5 °C pack, then 30 warm.
  const t0 = now - 3 * 3600_000;
  const backlog = [
    ...series(240, t0 + 20 * 60_000 - 5000, -5, 12),
    ...series(360, t0 + 50 * 60_000 - 5000, 8, -2),
  ];
  for (let i = 0; i < backlog.length; i += 50) await publish(backlog.slice(i, i + 50));
  let past: { startedAt: number; endedAt: number | null } | undefined;
  await until(async () => {
    const listed = await request(node.baseUrl)
      .get(`/api/systems/${vanId}/alerts`)
      .query({ from: new Date(t0 - 60_000).toISOString(), to: new Date(t0 + 3600_000).toISOString() })
      .set(auth());
    past = listed.body.alerts.find((a: { kind: string }) => a.kind === 'cold-charging');
    return past !== undefined;
  }, 10_000);
  // It starts after the flag's 30 s minimum duration and ends 15 min (its release delay) after warming.
  expect(past!.startedAt - t0).toBeGreaterThanOrEqual(30_000);
  expect(past!.startedAt - t0).toBeLessThan(60_000);
  expect(past!.endedAt! - (t0 + 20 * 60_000)).toBeGreaterThanOrEqual(15 * 60_000);
  await device.endAsync();
});
