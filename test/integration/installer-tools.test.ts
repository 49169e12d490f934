import { connectAsync, type MqttClient } from 'mqtt';
import request from 'supertest';
import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { extractPdfText } from '../../server/src/records/pdf-text-reader';
import { pngSize } from '../support/crafted-images';
import { signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';
import { workshopReadings } from '../support/workshop-readings';

// The installer's tools end to end: a commissioning check watching real simulated readings over MQTT, a photo
// upload, the PDF record (downloaded and e-mailed to the owner), and a saved energy budget compared with the
// rollups of what the system did.

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let fitter: Awaited<ReturnType<typeof signInAs>>;
let vanId: string;
let device: MqttClient;
const [van] = demo.devices;
// A 1×1 PNG (the smallest valid image; its bytes as commonly published, from memory).
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);

beforeAll(async () => {
  node = await startTestServer();
  fitter = await signInAs(node.baseUrl, demo.users[1].email, demo.password);
  const systems = await request(node.baseUrl).get('/api/systems').set(auth());
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
  const settings = (await request(node.baseUrl).get(`/api/systems/${vanId}/settings`).set(auth())).body
    .settings;
  const put = await request(node.baseUrl)
    .put(`/api/systems/${vanId}/settings`)
    .set(auth())
    .send({
      ...settings,
      thresholdDefaults: undefined,
      chargeSources: [{ id: 'dcdc', kind: 'dc-dc', label: 'DC-DC charger 60 A', ratedCurrentA: 60 }],
    });
  expect(put.status).toBe(200);
  device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/installer-${Date.now()}`,
  });
});
afterAll(async () => {
  await device.endAsync();
  await node.stop();
});

function auth() {
  return { Authorization: `Bearer ${fitter.accessToken}` };
}

/** Runs a check while the scenario's readings (the last two minutes, one a second) arrive; returns it finished. */
async function runCheck(scenario: 'charger-commissioning' | 'thin-cable') {
  const started = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/commissioning-checks`)
    .set(auth())
    .send({
      sourceId: 'dcdc',
      ratedCurrentA: 60,
      windowSeconds: 60,
      sourceOutputVoltage: 14.2,
      batteryTerminalVoltage: 14.05,
    });
  expect(started.status).toBe(201);
  expect(started.body.check).toMatchObject({ status: 'running', progress: { phase: 'waiting-for-current' } });
  const readings = workshopReadings(scenario);
  for (let i = 0; i < readings.length; i += 20)
    await device.publishAsync(
      readingsTopic(van.id),
      JSON.stringify(encodeReadingPack(van.id, readings.slice(i, i + 20))),
      {
        qos: 1,
      },
    );
  let check = started.body.check;
  await until(async () => {
    check = (
      await request(node.baseUrl).get(`/api/systems/${vanId}/commissioning-checks/${check.id}`).set(auth())
    ).body.check;
    return check.status !== 'running';
  }, 10_000);
  return check;
}

it('passes a charger that holds its rated current and fails one on an undersized cable, with reasons', async () => {
  const good = await runCheck('charger-commissioning');
  expect(good.status).toBe('passed');
  // Simulator scenario: a 60 A DC-DC charger on 25 mm² cable holds its rating (within the default 10 %).
  expect(good.result.meanCurrentA).toBeGreaterThan(54);
  expect(good.result.cableDropV).toBeCloseTo(0.15, 5);
  const thin = await runCheck('thin-cable');
  expect(thin.status).toBe('failed');
  expect(thin.result.reasons.join(' ')).toMatch(/below|no settled|taper/i);
  const list = await request(node.baseUrl).get(`/api/systems/${vanId}/commissioning-checks`).set(auth());
  expect(list.body.checks.map((c: { status: string }) => c.status)).toEqual(['failed', 'passed']);
});

it('refuses a check for a charge source the system does not have, naming the field', async () => {
  const response = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/commissioning-checks`)
    .set(auth())
    .send({ sourceId: 'wind', ratedCurrentA: 20, windowSeconds: 60 });
  expect(response.status).toBe(400);
  expect(response.body.error.field).toBe('sourceId');
});

it('stores a photo, refuses a disguised file, and puts both checks and the photo in the PDF record', async () => {
  const photo = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set(auth())
    .field('kind', 'photo')
    .field('caption', 'Fuse holder beside the battery')
    .attach('file', PNG, { filename: 'fuse.png', contentType: 'image/png' });
  expect(photo.status).toBe(201);
  expect(photo.body.upload).toMatchObject({ kind: 'photo', fileName: 'fuse.png', bytes: expect.any(Number) });
  const disguised = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/uploads`)
    .set(auth())
    .field('kind', 'photo')
    .attach('file', Buffer.from('MZ not an image'), { filename: 'x.png', contentType: 'image/png' });
  expect(disguised.status).toBe(400);
  expect(disguised.body.error.field).toBe('file');
  const back = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/uploads/${photo.body.upload.id}`)
    .set(auth());
  expect(back.headers['x-content-type-options']).toBe('nosniff');
  // What is stored is a re-encoded copy of the decoded image, not the bytes sent: still a 1×1 PNG.
  expect(pngSize(back.body as Buffer)).toEqual({ width: 1, height: 1 });
  expect((back.body as Buffer).subarray(1, 4).toString('latin1')).toBe('PNG');

  const pdf = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/commissioning-record.pdf`)
    .set(auth())
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
  expect(pdf.headers['content-type']).toBe('application/pdf');
  const text = extractPdfText(pdf.body as Buffer);
  expect(text).toContain('Winter van');
  expect(text).toContain('PASS');
  expect(text).toContain('FAIL');
  expect(text).toContain('Fuse holder beside the battery');
  expect(text).not.toContain('could not be read');

  const mailed = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/commissioning-record/email`)
    .set(auth());
  expect(mailed.status).toBe(202);
  const mail = await node.server.mailCatcher!.waitFor(
    (m) => m.to.includes(demo.users[0].email) && m.attachments.length > 0,
    5000,
  );
  expect(mail.attachments[0]).toMatchObject({
    filename: 'commissioning-record.pdf',
    contentType: 'application/pdf',
  });
});

it('saves an energy budget, refuses an impossible one, and compares it with the measured days', async () => {
  const budget = {
    loads: [
      { name: 'Diesel air heater', amps: 1.5, hoursPerDay: 10, dutyCycle: 1, ac: false },
      { name: 'Laptop', watts: 60, hoursPerDay: 3, dutyCycle: 1, ac: true },
    ],
    sources: [{ kind: 'solar', watts: 200, peakSunHours: 1.5 }],
    system: {
      nominalVoltage: 12,
      inverterEfficiency: 0.9,
      inverterRatedW: 1000,
      bmsContinuousA: 150,
      usableFraction: 0.9,
      daysOfAutonomy: 2,
    },
  };
  const saved = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/energy-budgets`)
    .set(auth())
    .send({ name: 'Winter week', budget });
  expect(saved.status).toBe(201);
  const bad = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/energy-budgets`)
    .set(auth())
    .send({ name: 'Broken', budget: { ...budget, loads: [{ ...budget.loads[0], dutyCycle: 3 }] } });
  expect(bad.status).toBe(400);
  expect(bad.body.error.field).toBe('loads[0].dutyCycle');
  const compared = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/energy-budgets/${saved.body.budget.id}/comparison`)
    .query({ days: 7 })
    .set(auth());
  expect(compared.status).toBe(200);
  // Heater 1.5 A × 12 V × 10 h = 180 Wh; laptop 60 W × 3 h / 0.9 = 200 Wh: 380 Wh out a day (arithmetic).
  expect(compared.body.comparison.budget.whOutPerDay).toBeCloseTo(380, 5);
  expect(compared.body.comparison.days).toBe(7);
});
