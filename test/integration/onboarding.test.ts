import { connectAsync } from 'mqtt';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { examplePayload, readingsTopic, type MonitorStatus } from '@cellwarden/shared';
import { signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// Setting up a system through the API: validation, an installer's system for a customer changing hands on
// acceptance, the owner ending the installer's rights, and a new monitor's first reading (or why not), with
// the real broker and real MQTT clients.

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let installer: string;
let owner: string;
const [ownerPerson, installerPerson, supportPerson] = demo.users;

const api = (token: string) => ({
  get: (path: string) => request(node.baseUrl).get(path).set('Authorization', `Bearer ${token}`),
  post: (path: string, body: object = {}) =>
    request(node.baseUrl).post(path).set('Authorization', `Bearer ${token}`).send(body),
  delete: (path: string) => request(node.baseUrl).delete(path).set('Authorization', `Bearer ${token}`),
});
const system = (overrides: Record<string, unknown> = {}) => ({
  name: 'Sea-otter van',
  kind: 'van',
  nominalVoltage: 12,
  chemistry: 'lifepo4',
  ratedCapacityAh: 280,
  usableCapacityAh: 250,
  bmsContinuousDischargeA: 200,
  bmsPeakDischargeA: 350,
  coldChargeCutoff: true,
  timeZone: 'Europe/Oslo',
  ...overrides,
});
const auditOf = (systemId: string) =>
  node.database.query<{ action: string; detail: string }>(
    `SELECT action, detail FROM audit_entries WHERE system_id = :systemId ORDER BY id`,
    { replacements: { systemId }, type: QueryTypes.SELECT },
  );
const mailTo = (address: string, subject: RegExp) =>
  node.server.mailCatcher!.waitFor((m) => m.to.includes(address) && subject.test(m.subject), 5000);

beforeAll(async () => {
  node = await startTestServer({ env: { MQTT_PUBLIC_URL: 'mqtt://monitors.cellwarden.example:1883' } });
  installer = (await signInAs(node.baseUrl, installerPerson.email, demo.password)).accessToken;
  owner = (await signInAs(node.baseUrl, ownerPerson.email, demo.password)).accessToken;
});
afterAll(() => node.stop());

describe('creating a system', () => {
  it('names every wrong field at once and stores nothing', async () => {
    const before = await api(owner).get('/api/systems');
    const response = await api(owner).post(
      '/api/systems',
      system({ nominalVoltage: 36, chemistry: 'nimh', timeZone: 'Mars/Olympus', ratedCapacityAh: -1 }),
    );
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe('nominalVoltage');
    for (const field of ['nominalVoltage', 'chemistry', 'ratedCapacityAh', 'timeZone'])
      expect(response.body.error.message).toContain(`${field}:`);
    expect((await api(owner).get('/api/systems')).body.systems).toHaveLength(before.body.systems.length);
  });

  it('refuses offsets for a time zone, usable above rated and a peak below the continuous rating', async () => {
    const offset = await api(owner).post('/api/systems', system({ timeZone: '+01:00' }));
    expect([offset.status, offset.body.error.field]).toEqual([400, 'timeZone']);
    const usable = await api(owner).post('/api/systems', system({ usableCapacityAh: 300 }));
    expect([usable.status, usable.body.error.field]).toEqual([400, 'usableCapacityAh']);
    const peak = await api(owner).post('/api/systems', system({ bmsPeakDischargeA: 100 }));
    expect([peak.status, peak.body.error.field]).toEqual([400, 'bmsPeakDischargeA']);
    const garbage = await request(node.baseUrl)
      .post('/api/systems')
      .set('Authorization', `Bearer ${owner}`)
      .set('Content-Type', 'application/json')
      .send('[1,2');
    expect(garbage.status).toBe(400);
  });

  it('lets an owner set one up for themselves, with its BMS figures stored', async () => {
    const response = await api(owner).post('/api/systems', system({ name: 'Shed bank', kind: 'cabin' }));
    expect(response.status).toBe(201);
    expect(response.body.handover).toBeNull();
    const id = response.body.system.id;
    const [row] = await node.database.query<Record<string, unknown>>(
      `SELECT owner_id, installer_company_id, bms_peak_discharge_a, bms_cold_charge_cutoff, time_zone
       FROM systems WHERE id = :id`,
      { replacements: { id }, type: QueryTypes.SELECT },
    );
    expect(row).toMatchObject({
      installer_company_id: null,
      bms_peak_discharge_a: 350,
      bms_cold_charge_cutoff: true,
      time_zone: 'Europe/Oslo',
    });
    expect((await auditOf(id)).map((e) => e.action)).toEqual(['system.created']);
  });

  it('refuses support staff, and an installer who names no customer', async () => {
    const support = (await signInAs(node.baseUrl, supportPerson.email, demo.password)).accessToken;
    expect((await api(support).post('/api/systems', system())).status).toBe(403);
    const missing = await api(installer).post('/api/systems', system());
    expect([missing.status, missing.body.error.field]).toEqual([400, 'ownerEmail']);
  });
});

describe('an installer setting up a system for a customer', () => {
  it('answers alike for an address with and without an account', async () => {
    const known = await api(installer).post(
      '/api/systems',
      system({ name: 'For Ilse', ownerEmail: ownerPerson.email }),
    );
    const unknown = await api(installer).post(
      '/api/systems',
      system({ name: 'For a stranger', ownerEmail: 'nobody-yet@customer.example' }),
    );
    expect([known.status, unknown.status]).toEqual([201, 201]);
    const shape = (body: { system: object; handover: object }) => ({
      keys: Object.keys(body).sort(),
      system: Object.keys(body.system).sort(),
      handover: Object.keys(body.handover).sort(),
    });
    expect(shape(known.body)).toEqual(shape(unknown.body));
    // Each address gets its own kind of mail: a sign-in link for the new one, "accept it" for the known one.
    expect((await mailTo('nobody-yet@customer.example', /For a stranger/)).text).toMatch(/\/invitation\/\S+/);
    expect((await mailTo(ownerPerson.email, /For Ilse/)).text).toContain('/requests');
  });

  it('makes a new customer the owner when they accept the invitation, and the company keeps installer rights', async () => {
    const email = 'marit.solberg@customer.example';
    const created = await api(installer).post(
      '/api/systems',
      system({ name: 'Marit’s van', ownerEmail: email }),
    );
    const systemId = created.body.system.id;
    const mail = await mailTo(email, /Marit/);
    const token = /\/invitation\/([\w-]+)/.exec(mail.text)![1];
    const accepted = await request(node.baseUrl)
      .post('/api/auth/invitations/accept')
      .send({ token, displayName: 'Marit Solberg', password: 'a long enough pass 42' });
    expect(accepted.status).toBe(200);
    const marit = accepted.body.accessToken as string;
    // The new owner may do everything an owner does: the grants list is the owner's alone.
    expect((await api(marit).get(`/api/systems/${systemId}/grants`)).status).toBe(200);
    expect((await api(installer).get(`/api/systems/${systemId}/grants`)).status).toBe(403);
    expect((await api(installer).get(`/api/systems/${systemId}/devices`)).status).toBe(200);
    expect((await auditOf(systemId)).map((e) => e.action)).toEqual([
      'system.created',
      'ownership.offered',
      'ownership.accepted',
    ]);

    // The owner ends the installer company's rights; the installer no longer sees the system.
    expect((await api(installer).delete(`/api/systems/${systemId}/installer`)).status).toBe(403);
    expect((await api(marit).delete(`/api/systems/${systemId}/installer`)).status).toBe(204);
    expect((await api(installer).get(`/api/systems/${systemId}`)).status).toBe(404);
    expect((await api(marit).delete(`/api/systems/${systemId}/installer`)).status).toBe(404);
    expect((await auditOf(systemId)).at(-1)).toEqual({
      action: 'installer.removed',
      detail: expect.any(String),
    });
  });

  it('lets an existing account accept the system in the product, once', async () => {
    const created = await api(installer).post(
      '/api/systems',
      system({ name: 'Ilse’s boat', kind: 'boat', ownerEmail: ownerPerson.email }),
    );
    const systemId = created.body.system.id;
    const support = (await signInAs(node.baseUrl, supportPerson.email, demo.password)).accessToken;
    expect((await api(support).get('/api/handovers')).body.handovers).toEqual([]);
    const offers = (await api(owner).get('/api/handovers')).body.handovers;
    const offer = offers.find((h: { systemId: string }) => h.systemId === systemId);
    expect(offer).toMatchObject({ systemName: 'Ilse’s boat', offeredBy: installerPerson.displayName });
    expect((await api(support).post(`/api/handovers/${offer.id}/accept`)).status).toBe(404);
    expect((await api(owner).post(`/api/handovers/${offer.id}/accept`)).body).toEqual({ systemId });
    expect((await api(owner).post(`/api/handovers/${offer.id}/accept`)).status).toBe(404);
    expect((await api(owner).get(`/api/systems/${systemId}/grants`)).status).toBe(200);
    expect((await api(owner).post('/api/handovers/not-a-uuid/accept')).status).toBe(404);
  });
});

describe('a new monitor', () => {
  let systemId: string;
  beforeAll(async () => {
    systemId = (await api(owner).post('/api/systems', system({ name: 'Monitor bench', nominalVoltage: 24 })))
      .body.system.id;
  });
  const status = async (deviceId: string): Promise<MonitorStatus> =>
    (await api(owner).get(`/api/systems/${systemId}/devices/${deviceId}/status`)).body;
  const add = async (id: string) =>
    (await api(owner).post(`/api/systems/${systemId}/devices`, { id, label: 'Shunt' })).body;

  it('is shown with the broker URL from the configuration, and its first reading is seen to arrive', async () => {
    const credentials = await add('bench-shunt-1');
    expect(credentials.brokerUrl).toBe('mqtt://monitors.cellwarden.example:1883');
    expect(credentials.mqttTopic).toBe(readingsTopic('bench-shunt-1'));
    expect(await status('bench-shunt-1')).toMatchObject({ state: 'waiting', latestReading: null });

    const client = await connectAsync(node.mqttUrl, {
      username: 'bench-shunt-1',
      password: credentials.mqttPassword,
      clientId: 'bench-shunt-1',
      reconnectPeriod: 0,
    });
    await client.publishAsync(credentials.mqttTopic, examplePayload('bench-shunt-1', 24), { qos: 1 });
    await client.endAsync();
    const arrived = await status('bench-shunt-1');
    expect(arrived.state).toBe('arrived');
    expect(arrived.latestReading).toMatchObject({ voltage: 26.4, current: 1.5, temperature: 18 });
  });

  it('says the credentials were refused when the secret is wrong', async () => {
    await add('bench-shunt-2');
    await expect(
      connectAsync(node.mqttUrl, {
        username: 'bench-shunt-2',
        password: 'not-the-secret',
        clientId: 'bench-shunt-2',
        reconnectPeriod: 0,
      }),
    ).rejects.toThrow();
    const refused = await status('bench-shunt-2');
    expect(refused.state).toBe('refused');
    expect(refused.refusals).toMatchObject({ credentials: 1, topic: 0, payload: 0 });
    expect(refused.refusals.last).toMatchObject({ kind: 'credentials', code: 'bad_credentials' });
  });

  it('says the topic was wrong, and the payload was bad, each with its code', async () => {
    const credentials = await add('bench-shunt-3');
    const connect = () =>
      connectAsync(node.mqttUrl, {
        username: 'bench-shunt-3',
        password: credentials.mqttPassword,
        clientId: 'bench-shunt-3',
        reconnectPeriod: 0,
      });
    const client = await connect();
    const closed = new Promise<void>((resolve) => client.once('close', () => resolve()));
    client.publish('cellwarden/v1/devices/someone-else/readings', examplePayload('bench-shunt-3', 24), {
      qos: 1,
    });
    await closed;
    await until(async () => (await status('bench-shunt-3')).refusals.topic === 1);
    expect((await status('bench-shunt-3')).state).toBe('refused');

    const again = await connect();
    await again.publishAsync(credentials.mqttTopic, '[{"n":"voltage","v":26}]', { qos: 1 });
    await again.endAsync();
    const bad = await status('bench-shunt-3');
    expect(bad.refusals.payload).toBe(1);
    expect(bad.refusals.last?.kind).toBe('payload');
    expect(bad.state).toBe('refused');
  });

  it('answers 404 for a device of another system and hides the system from people without device rights', async () => {
    const support = (await signInAs(node.baseUrl, supportPerson.email, demo.password)).accessToken;
    expect((await api(support).get(`/api/systems/${systemId}/devices/bench-shunt-1/status`)).status).toBe(
      404,
    );
    expect((await api(owner).get(`/api/systems/${systemId}/devices/cw-demo-van/status`)).status).toBe(404);
  });
});
