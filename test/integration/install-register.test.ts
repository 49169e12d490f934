import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { connectAsync, type MqttClient } from 'mqtt';
import sharp from 'sharp';
import request from 'supertest';
import {
  encodeReadingPack,
  nearestRankPercentile,
  readingsTopic,
  type BatteryReading,
  type CircuitDesignVsMeasured,
  type InstallRegister,
  type RegisterCircuit,
} from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { countPdfPages, extractPdfText } from '../../server/src/records/pdf-text-reader';
import { SCENARIOS } from '../../simulator/src/scenario-catalog';
import { simulateReadings } from '../../simulator/src/simulate-readings';
import { signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// The demo van's install register end to end on real PostgreSQL, a real broker and real MQTT: the seeded
// circuits and their verdicts, the heater's fuse moved to the battery, bad input and access, measured
// currents of simulator readings published through the pipeline against the ratings with the flag they
// raise, a commissioning check taking the register's rating, and the record's PDF read and rendered.

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let fitter: string;
let support: string;
let vanId: string;
let cabinId: string;
let device: MqttClient;
const [van] = demo.devices;
const execFileAsync = promisify(execFile);

beforeAll(async () => {
  node = await startTestServer();
  fitter = (await signInAs(node.baseUrl, demo.users[1].email, demo.password)).accessToken;
  support = (await signInAs(node.baseUrl, demo.users[2].email, demo.password)).accessToken;
  const systems = await request(node.baseUrl).get('/api/systems').set(auth());
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
  cabinId = systems.body.systems.find((s: { kind: string }) => s.kind === 'cabin').id;
  device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/register-${Date.now()}`,
  });
});
afterAll(async () => {
  await device.endAsync();
  await node.stop();
});

function auth(token = fitter) {
  return { Authorization: `Bearer ${token}` };
}

async function register(): Promise<InstallRegister> {
  const response = await request(node.baseUrl).get(`/api/systems/${vanId}/install`).set(auth());
  expect(response.status).toBe(200);
  return response.body.register;
}

const circuitNamed = (r: InstallRegister, name: string) => r.circuits.find((c) => c.name === name)!;

function wiringOf(circuit: RegisterCircuit) {
  const { id: _id, verdict: _verdict, ...wiring } = circuit;
  return wiring;
}

async function putCircuit(circuit: RegisterCircuit, change: object, token = fitter) {
  return request(node.baseUrl)
    .put(`/api/systems/${vanId}/install/circuits/${circuit.id}`)
    .set(auth(token))
    .send({ ...wiringOf(circuit), ...change });
}

async function publish(readings: BatteryReading[]) {
  for (let i = 0; i < readings.length; i += 20)
    await device.publishAsync(
      readingsTopic(van.id),
      JSON.stringify(encodeReadingPack(van.id, readings.slice(i, i + 20))),
      { qos: 1 },
    );
}

async function storedReadings(): Promise<number> {
  const [row] = (await node.database.query('SELECT count(*)::int AS n FROM readings WHERE system_id = :id', {
    replacements: { id: vanId },
  })) as [{ n: number }[], unknown];
  return row[0].n;
}

it("shows the demo van's register: the 60 A DC-DC on 4 AWG, the inverter feed, the heater's fuse too far", async () => {
  const r = await register();
  expect(r.components.map((c) => c.name)).toEqual(
    expect.arrayContaining(['DC-DC charger 60 A', 'Inverter 2000 W', 'Diesel air heater']),
  );
  const dcdc = circuitNamed(r, 'DC-DC charger output');
  expect(dcdc).toMatchObject({ conductor: { awg: '4' }, protection: { ratingA: 80 }, fuseDistanceM: 0.15 });
  // 33 CFR 183.425 Table 5, 105 °C: 4 AWG 160 A; NEC 210.19(A)(1): 125 % of 60 A = 75 A; 33 CFR 183.455(c)(1)
  expect(dcdc.verdict).toMatchObject({ ok: true, currentA: 60, ampacityA: 160, maximumFuseA: 240 });
  const inverter = circuitNamed(r, 'Inverter feed');
  // 2000 W / (12 V × 0.9) = 185.2 A (arithmetic); 2/0 AWG at 105 °C: 330 A (33 CFR 183.425 Table 5)
  expect(inverter.verdict.currentA).toBeCloseTo(185.19, 2);
  expect(inverter.verdict).toMatchObject({ ok: true, ampacityA: 330 });
  const heater = circuitNamed(r, 'Heater feed');
  expect(heater.verdict.ok).toBe(false);
  // 33 CFR 183.455(b): within 178 mm (7 in), or 1.02 m (40 in) sheathed
  expect(heater.verdict.rule).toMatch(/^33 CFR 183\.455\(b\)/);
  expect(heater.verdict.findings.find((f) => f.code === 'fuse-too-far')).toBeDefined();
  // Budget from the components: heater 1.5 A × 12.8 V × 12 h × 0.6 = 138.24 Wh; fridge 45 W × 24 h × 0.35 =
  // 378 Wh; inverter standby 10 W × 24 h = 240 Wh (arithmetic; LiFePO4 amps at 12.8 V, the budget's convention)
  expect(r.budget!.whOutPerDay).toBeCloseTo(756.24, 6);
});

it('passes the heater circuit once its fuse is moved to within 178 mm of the battery, and stores it', async () => {
  const heater = circuitNamed(await register(), 'Heater feed');
  const moved = await putCircuit(heater, { fuseDistanceM: 0.15 });
  expect(moved.status).toBe(200);
  expect(moved.body.circuit.verdict.ok).toBe(true);
  expect(circuitNamed(await register(), 'Heater feed').verdict.ok).toBe(true);
  const [rows] = await node.database.query('SELECT fuse_distance_m FROM install_circuits WHERE id = :id', {
    replacements: { id: heater.id },
  });
  expect(rows).toEqual([{ fuse_distance_m: 0.15 }]);
});

it('names every wrong field, refuses a component of another system, and keeps to the access policy', async () => {
  const heater = circuitNamed(await register(), 'Heater feed');
  const bad = await putCircuit(heater, { oneWayLengthM: -1, insulationRatingC: 80, conductor: { awg: '5' } });
  expect(bad.status).toBe(400);
  expect(bad.body.error.message).toMatch(/conductor\.awg/);
  expect(bad.body.error.message).toMatch(/oneWayLengthM/);
  expect(bad.body.error.message).toMatch(/insulationRatingC/);
  const both = await putCircuit(heater, { conductor: { awg: '4', mm2: 25 } });
  expect(both.body.error.field).toBe('conductor');
  const cabinComponent = await request(node.baseUrl)
    .post(`/api/systems/${cabinId}/install/components`)
    .set(auth())
    .send({
      name: 'Cabin fridge',
      ratings: { kind: 'fridge', watts: 40, hoursPerDay: 24, dutyCycle: 0.3, ac: false },
    });
  expect(cabinComponent.status).toBe(201);
  const foreign = await putCircuit(heater, { componentId: cabinComponent.body.component.id });
  expect(foreign.status).toBe(400);
  expect(foreign.body.error.field).toBe('componentId');
  const badRatings = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/install/components`)
    .set(auth())
    .send({
      name: 'x',
      ratings: { kind: 'inverter', continuousW: 'lots', surgeW: 1, standbyW: 1, efficiency: 2 },
    });
  expect(badRatings.status).toBe(400);
  expect(badRatings.body.error.message).toMatch(/continuousW.*efficiency|efficiency.*continuousW/);
  expect(
    (await request(node.baseUrl).post(`/api/systems/${vanId}/install/circuits`).set(auth()).send('[')).status,
  ).toBe(400);
  // The support desk holds a view grant on the van: it reads the register but may not change it.
  expect((await request(node.baseUrl).get(`/api/systems/${vanId}/install`).set(auth(support))).status).toBe(
    200,
  );
  expect((await putCircuit(heater, {}, support)).status).toBe(403);
  expect((await request(node.baseUrl).get(`/api/systems/${cabinId}/install`).set(auth(support))).status).toBe(
    404,
  );
  const inUse = await request(node.baseUrl)
    .delete(`/api/systems/${vanId}/install/components/${heater.componentId}`)
    .set(auth());
  expect(inUse.status).toBe(409);
});

it("compares a simulator run's measured peaks and 99th percentiles with the ratings and raises the flag near a fuse", async () => {
  // Simulator scenario: a 60 A DC-DC charger in bulk, one reading every 2 s for the last 20 minutes.
  const { readings } = simulateReadings(SCENARIOS['charger-commissioning'], {
    seed: 3,
    start: Date.now() - 20 * 60_000,
    intervalSeconds: 2,
    count: 580,
  });
  const before = await storedReadings();
  await publish(readings);
  await until(async () => (await storedReadings()) === before + readings.length, 10_000);
  const pack = readings.map((r) => Math.abs(r.current));
  const dcdc = readings.map((r) => Math.abs(r.sourceCurrents!.dcdc));
  const measured = async () => {
    const response = await request(node.baseUrl)
      .get(`/api/systems/${vanId}/install/measured?days=1`)
      .set(auth());
    expect(response.status).toBe(200);
    return response.body.circuits as CircuitDesignVsMeasured[];
  };
  let circuits = await measured();
  const feed = circuits.find((c) => c.circuitName === 'Main battery feed')!;
  const charger = circuits.find((c) => c.circuitName === 'DC-DC charger output')!;
  // The server's figures are the readings' own: the largest magnitude and the nearest-rank 99th percentile.
  expect(feed).toMatchObject({ samples: readings.length, standing: 'within' });
  expect(feed.peakA).toBeCloseTo(Math.max(...pack), 6);
  expect(feed.p99A).toBeCloseTo(nearestRankPercentile(pack, 0.99)!, 6);
  expect(charger.peakA).toBeCloseTo(Math.max(...dcdc), 6);
  expect(charger.peakSeconds).toBeGreaterThanOrEqual(2);
  // 60 A against an 80 A fuse is 75 %, below the 80 % margin; 4 AWG carries 160 A at 105 °C
  expect(charger.standing).toBe('within');
  expect(charger.sentence).toMatch(
    /^DC-DC charger output peaked at 60 A for \d+ s, .* fuse 80 A, conductor 160 A at 105 °C: within limits$/,
  );
  expect(circuits.map((c) => c.circuitName)).not.toContain('Inverter feed');

  // A fuse the peak reaches 90 % of: close (from 80 %); then one below the peak: over; then back: the flag ends.
  const main = circuitNamed(await register(), 'Main battery feed');
  const peak = feed.peakA!;
  const flag = async () =>
    (
      await request(node.baseUrl).get(`/api/systems/${vanId}/alerts?active=true`).set(auth())
    ).body.alerts.find((a: { kind: string }) => a.kind === 'circuit-near-rating');
  expect(await flag()).toBeUndefined();
  await putCircuit(main, { protection: { ...main.protection, ratingA: Math.round((peak / 0.9) * 10) / 10 } });
  circuits = await measured();
  expect(circuits.find((c) => c.circuitName === 'Main battery feed')!.standing).toBe('close');
  expect(await flag()).toMatchObject({ severity: 'warning', unit: '%', endedAt: null });
  await putCircuit(main, { protection: { ...main.protection, ratingA: Math.floor(peak * 0.9) } });
  circuits = await measured();
  expect(circuits.find((c) => c.circuitName === 'Main battery feed')!.sentence).toMatch(
    /over a rating — the peak is 11\d % of the fuse/,
  );
  expect(await flag()).toMatchObject({ severity: 'critical' });
  await putCircuit(main, { protection: main.protection });
  await measured();
  expect(await flag()).toBeUndefined();
});

it("runs a commissioning check at the register's rating and puts the chosen check, its chart and the register in the record", async () => {
  const settings = (await request(node.baseUrl).get(`/api/systems/${vanId}/settings`).set(auth())).body
    .settings;
  const put = await request(node.baseUrl)
    .put(`/api/systems/${vanId}/settings`)
    .set(auth())
    .send({
      ...settings,
      thresholdDefaults: undefined,
      chargeSources: [{ id: 'dcdc', kind: 'dc-dc', label: 'DC-DC charger', ratedCurrentA: 45 }],
    });
  expect(put.status).toBe(200);
  // The request says 45 A; the register's DC-DC charger is rated 60 A, and the check takes that.
  const started = await request(node.baseUrl)
    .post(`/api/systems/${vanId}/commissioning-checks`)
    .set(auth())
    .send({ sourceId: 'dcdc', ratedCurrentA: 45, windowSeconds: 60 });
  expect(started.status).toBe(201);
  expect(started.body.check.ratedCurrentA).toBe(60);
  // The scenario's engine runs from :00 to :45 of every hour (simulator/src/scenario-catalog.ts ENGINE_RUNS):
  // the readings start at the last :20 at least three minutes ago, so the charger is in bulk whatever the clock.
  const hour = 3_600_000;
  const start = Math.floor((Date.now() - 23 * 60_000) / hour) * hour + 20 * 60_000;
  const { readings } = simulateReadings(SCENARIOS['charger-commissioning'], {
    seed: 7,
    start,
    intervalSeconds: 1,
    count: 110,
  });
  await publish(readings);
  let check = started.body.check;
  await until(async () => {
    check = (
      await request(node.baseUrl).get(`/api/systems/${vanId}/commissioning-checks/${check.id}`).set(auth())
    ).body.check;
    return check.status !== 'running';
  }, 10_000);
  expect(check.status).toBe('passed');
  const choices = (
    await request(node.baseUrl).get(`/api/systems/${vanId}/commissioning-record/choices`).set(auth())
  ).body.choices;
  expect(choices).toEqual([
    expect.objectContaining({ checkId: check.id, byDefault: true, leftOutBecause: null }),
  ]);

  const pdf = await download(`/api/systems/${vanId}/commissioning-record.pdf`);
  const text = extractPdfText(pdf);
  expect(text).toContain('System: Winter van');
  expect(text).toContain(`Owner: ${demo.users[0].displayName}`);
  expect(text).toContain('Installer company: Kestrel Hollow Vanfitters');
  expect(text).toContain('Time zone: Europe/Helsinki');
  expect(text).toContain('Inverter 2000 W (inverter): 2000 W continuous, 4000 W surge, 10 W standby');
  expect(text).toContain('Heater feed');
  expect(text).toContain('Rule: 33 CFR 183.425 Table 5');
  expect(text).toContain('1. DC-DC charger: PASS');
  expect(text).toContain('Settings: 60 A, tolerance ±10 %');
  expect(text).toContain('Current (A)');
  expect(text).toContain('Signature');
  // Picked by the installer: none of the checks.
  const without = extractPdfText(await download(`/api/systems/${vanId}/commissioning-record.pdf?checks=`));
  expect(without).toMatch(/no checks were recorded/i);
  const wrong = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/commissioning-record.pdf?checks=not-an-id`)
    .set(auth());
  expect(wrong.status).toBe(400);
  expect(wrong.body.error.field).toBe('checks.0');

  // One page rendered to an image by pdf.js on @napi-rs/canvas: the checks' page carries the copper current line.
  const folder = mkdtempSync(join(tmpdir(), 'cw-record-'));
  try {
    writeFileSync(join(folder, 'record.pdf'), pdf);
    const checksPage = countPdfPages(pdf) >= 3 ? 3 : 2;
    const { stdout } = await execFileAsync(process.execPath, [
      join(__dirname, '../support/render-pdf-page.mjs'),
      join(folder, 'record.pdf'),
      String(checksPage),
      join(folder, 'page.png'),
    ]);
    // A4 is 595 × 842 pt (ISO 216); at scale 1.5 that is 893 × 1263 px
    expect(JSON.parse(stdout)).toMatchObject({ width: 893, height: 1263 });
    const { data, info } = await sharp(readFileSync(join(folder, 'page.png')))
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    let copper = 0;
    for (let i = 0; i < data.length; i += info.channels)
      if (
        Math.abs(data[i] - 0xb0) < 24 &&
        Math.abs(data[i + 1] - 0x62) < 24 &&
        Math.abs(data[i + 2] - 0x2d) < 24
      )
        copper++;
    expect(copper).toBeGreaterThan(200);
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
});

async function download(path: string): Promise<Buffer> {
  const response = await request(node.baseUrl)
    .get(path)
    .set(auth())
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
  expect(response.status).toBe(200);
  return response.body as Buffer;
}
