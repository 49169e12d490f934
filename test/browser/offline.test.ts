import AxeBuilder from '@axe-core/playwright';
import { connectAsync, type MqttClient } from 'mqtt';
import request from 'supertest';
import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { ownerSystems, startBrowserNode } from './browser-node';
import { launchChromium } from './launch-chromium';

// People in vans and boats lose signal: an installed dashboard still opens, with the last values it
// received, plainly labelled as not live.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let device: MqttClient;
let van: { id: string; name: string };
const [vanDevice] = demo.devices;

beforeAll(async () => {
  ({ node, chromium } = await startBrowserNode());
  van = (await ownerSystems(node.baseUrl)).van;
  device = await connectAsync(node.mqttUrl, {
    username: vanDevice.id,
    password: vanDevice.secret,
    clientId: `${vanDevice.id}/offline-${Date.now()}`,
  });
}, 60000);
afterAll(async () => {
  await device?.endAsync();
  await chromium?.close();
  await node?.stop();
});

it('serves the service worker script and its manifest for revalidation, and links a web app manifest', async () => {
  for (const file of ['/ngsw-worker.js', '/ngsw.json']) {
    const res = await request(node.baseUrl).get(file);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('no-cache');
  }
  const manifest = await request(node.baseUrl).get('/manifest.webmanifest');
  expect(manifest.status).toBe(200);
  expect(JSON.parse(manifest.text)).toMatchObject({ name: 'Cellwarden', display: 'standalone' });
  const index = await request(node.baseUrl).get('/');
  expect(index.text).toContain('rel="manifest"');
});

it('reloads without a connection and shows the shell with the last values, labelled offline', async () => {
  const context = await chromium.browser.newContext({ viewport: { width: 390, height: 800 } });
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(demo.users[0].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('main').getByText(van.name).first().waitFor();
  await page.goto(`${node.baseUrl}/systems/${van.id}`);
  await page.getByRole('heading', { level: 1, name: van.name }).waitFor();
  await page.getByText('Live: connected').waitFor();
  const reading = {
    measuredAt: Date.now(),
    voltage: 12.87,
    current: -4.2,
    temperature: 6.5,
    stateOfCharge: 61,
  };
  await device.publishAsync(
    readingsTopic(vanDevice.id),
    JSON.stringify(encodeReadingPack(vanDevice.id, [reading])),
    {
      qos: 1,
    },
  );
  await page.getByText('12.87 V', { exact: true }).first().waitFor();
  // The worker is active once it has fetched the whole shell.
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  // Nothing is labelled offline while the connection is there.
  await expect(page.getByText(/Offline —/).count()).resolves.toBe(0);

  await context.setOffline(true);
  await page.reload();
  const panel = page.getByRole('region', { name: /Offline — last values from \d/ });
  await panel.waitFor();
  await expect(page.getByRole('banner').getByText('Cellwarden').count()).resolves.toBe(1);
  await expect(panel.getByText(van.name).count()).resolves.toBe(1);
  // The live value that arrived last, not the one the page first loaded.
  await expect(panel.getByText('12.87 V', { exact: true }).count()).resolves.toBe(1);
  await expect(panel.getByText('Not live', { exact: false }).count()).resolves.toBe(1);
  // Nothing on the page claims to be live while the values are old.
  await expect(page.getByText('Live: connected').count()).resolves.toBe(0);
  const axe = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice'])
    .analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual(
    [],
  );

  // Back online, the kept values make way for the live screens.
  await context.setOffline(false);
  await panel.waitFor({ state: 'detached' });
  await context.close();
});

it('forgets the kept values when the person signs out', async () => {
  const context = await chromium.browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(demo.users[0].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('main').getByText(van.name).first().waitFor();
  const kept = () => page.evaluate(() => localStorage.getItem('cellwarden.last-values'));
  await expect(kept()).resolves.toContain(van.name);
  await page.getByRole('button', { name: 'User menu' }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.waitForURL(/sign-in/);
  await expect(kept()).resolves.toBeNull();
  await context.close();
});
