import { connectAsync, type MqttClient } from 'mqtt';
import { join } from 'node:path';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { ownerSystems, startBrowserNode } from './browser-node';
import { launchChromium } from './launch-chromium';

// The van dweller's night, in a real browser at phone width and in the dark theme: readings arrive over
// MQTT while the live view is open, and the flag for charging a frozen LiFePO4 pack appears with its advice.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let device: MqttClient;
let vanId: string;
const [van] = demo.devices;

beforeAll(async () => {
  ({ node, chromium } = await startBrowserNode());
  vanId = (await ownerSystems(node.baseUrl)).van.id;
  device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/browser-${Date.now()}`,
  });
}, 60000);
afterAll(async () => {
  await device?.endAsync();
  await chromium?.close();
  await node?.stop();
});

const frozenCharging = (count: number, endAt: number): BatteryReading[] =>
  Array.from({ length: count }, (_, i) => ({
    measuredAt: endAt - (count - 1 - i) * 5000,
    voltage: 13.35,
    current: 9.5,
    temperature: -7.5,
    stateOfCharge: 58,
    sourceCurrents: { shore: 9.9 },
  }));

it('shows live values and the cold-charging flag with what to do, at 375 px in the dark theme', async () => {
  const page = await chromium.browser.newPage({ viewport: { width: 375, height: 812 }, colorScheme: 'dark' });
  const policyViolations: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy/.test(message.text())) policyViolations.push(message.text());
  });
  await page.goto(`${node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(`/systems/${vanId}`)}`);
  await page.getByLabel('E-mail').fill(demo.users[0].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.keyboard.press('Enter');
  await page.waitForURL(new RegExp(`/systems/${vanId}$`));
  await page.getByText('Live: connected').waitFor();

  await device.publishAsync(
    readingsTopic(van.id),
    JSON.stringify(encodeReadingPack(van.id, frozenCharging(20, Date.now()))),
    {
      qos: 1,
    },
  );
  await page.getByText('13.35 V', { exact: true }).waitFor();
  await page.getByText('into the pack').waitFor();
  const flag = page.locator('article.flag', { hasText: 'Charging a battery that is too cold' });
  await flag.waitFor();
  await expect(flag.getByText('What to do:').isVisible()).resolves.toBe(true);
  // Nothing wider than the phone: no sideways scrolling.
  const overflow = await page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  expect(overflow).toBeLessThanOrEqual(0);
  // Icons come from the bundled icon font (never a CDN), and nothing on the page breaks the CSP.
  const fonts = await page.evaluate(() => {
    const loaded: string[] = [];
    document.fonts.forEach((f) => {
      if (f.status === 'loaded') loaded.push(f.family);
    });
    return loaded;
  });
  expect(fonts).toContain('Material Icons');
  expect(policyViolations).toEqual([]);
  await page.screenshot({ path: join(__dirname, '..', '..', '.data', 'cold-night.png'), fullPage: true });
  await page.close();
});
