import { connectAsync, type MqttClient } from 'mqtt';
import type { Page } from 'playwright-core';
import request from 'supertest';
import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { workshopReadings } from '../support/workshop-readings';
import { ownerSystems, startBrowserNode } from './browser-node';

// The installer's DC-DC check in real Chromium: a 60 A charger on 25 mm² cable passes, the same charger on a
// 2.5 mm² cable fails with the cause named. The readings are the simulator's, published over MQTT as the van's
// monitor would, so the check, the pipeline and the screen are the product's own.

let harness: Awaited<ReturnType<typeof startBrowserNode>>;
let device: MqttClient;
let vanId: string;
const van = demo.devices[0];

beforeAll(async () => {
  harness = await startBrowserNode();
  vanId = (await ownerSystems(harness.node.baseUrl)).van.id;
  const fitter = await request(harness.node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: demo.users[1].email, password: demo.password });
  const auth = { Authorization: `Bearer ${fitter.body.accessToken}` };
  const settings = (await request(harness.node.baseUrl).get(`/api/systems/${vanId}/settings`).set(auth)).body
    .settings;
  const put = await request(harness.node.baseUrl)
    .put(`/api/systems/${vanId}/settings`)
    .set(auth)
    .send({
      ...settings,
      thresholdDefaults: undefined,
      chargeSources: [{ id: 'dcdc', kind: 'dc-dc', label: 'DC-DC charger', ratedCurrentA: 60 }],
    });
  expect(put.status).toBe(200);
  device = await connectAsync(harness.node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/bench-${Date.now()}`,
  });
}, 60_000);
afterAll(async () => {
  await device?.endAsync();
  await harness?.chromium.close();
  await harness?.node.stop();
});

async function commissioningPage(): Promise<Page> {
  const page = await harness.chromium.browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(
    `${harness.node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(`/systems/${vanId}/commissioning`)}`,
  );
  await page.getByLabel('E-mail').fill(demo.users[1].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Commissioning', level: 1 }).waitFor();
  return page;
}

/** Starts a check from the form, then lets the monitor report two minutes of the scenario, one reading a second. */
async function runCheckThrough(page: Page, scenario: 'charger-commissioning' | 'thin-cable') {
  const form = page.getByRole('form', { name: 'Start a commissioning check' });
  // The sources arrive with the settings: until then the field is a plain text box.
  const source = form.getByRole('combobox', { name: 'Charge source' });
  await source.waitFor();
  await source.focus();
  await page.keyboard.press('Enter');
  await page.getByRole('option', { name: /DC-DC charger \(60 A\)/ }).click();
  await form.getByLabel('Watch for').fill('60');
  await form.getByRole('button', { name: 'Start check' }).click();
  await page.getByRole('heading', { name: 'Check running' }).waitFor();
  const readings = workshopReadings(scenario);
  for (let i = 0; i < readings.length; i += 20)
    await device.publishAsync(
      readingsTopic(van.id),
      JSON.stringify(encodeReadingPack(van.id, readings.slice(i, i + 20))),
      {
        qos: 1,
      },
    );
  await page.getByRole('heading', { name: 'Latest check' }).waitFor({ timeout: 20_000 });
}

it('passes the charger on its proper cable and shows the measured bulk current', async () => {
  const page = await commissioningPage();
  await runCheckThrough(page, 'charger-commissioning');
  const latest = page.getByRole('region', { name: 'Latest check' });
  await latest.getByText(/Passed: dcdc rated 60 A/).waitFor();
  // The mean the check measured in bulk, from the source's own current.
  await latest.getByText('60.0 A', { exact: true }).first().waitFor();
  await page.close();
}, 60_000);

it('fails the charger on the thin cable and says the current stayed below its rating', async () => {
  const page = await commissioningPage();
  await runCheckThrough(page, 'thin-cable');
  const latest = page.getByRole('region', { name: 'Latest check' });
  await latest.getByText(/Failed: dcdc rated 60 A/).waitFor();
  const reasons = await latest.getByRole('list', { name: 'Reasons' }).innerText();
  expect(reasons).toMatch(/below|taper/i);
  expect(reasons).not.toMatch(/nearly full/i);
  await page.close();
}, 60_000);
