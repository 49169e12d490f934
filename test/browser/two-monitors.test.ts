import AxeBuilder from '@axe-core/playwright';
import { connectAsync, type MqttClient } from 'mqtt';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { ownerSystems, startBrowserNode } from './browser-node';

// The demo cabin's bank carries two monitors. In real Chromium, with both reporting interleaved a second apart,
// the headline stays on the lead (its shunt) and a labelled list shows each monitor's own values, at phone and
// desktop width, with axe-core finding nothing; the morning headline speaks of the cabin's own clock.

let harness: Awaited<ReturnType<typeof startBrowserNode>>;
let cabinId: string;
const clients: MqttClient[] = [];
const shunt = demo.devices.find((d) => d.id === 'cw-demo-cabin')!;
const bmsLink = demo.devices.find((d) => d.id === 'cw-demo-cabin-bms')!;

beforeAll(async () => {
  harness = await startBrowserNode();
  cabinId = (await ownerSystems(harness.node.baseUrl)).cabin.id;
  for (const device of [shunt, bmsLink])
    clients.push(
      await connectAsync(harness.node.mqttUrl, {
        username: device.id,
        password: device.secret,
        clientId: `${device.id}/browser-${Date.now()}`,
        reconnectPeriod: 0,
      }),
    );
}, 60_000);
afterAll(async () => {
  for (const client of clients) await client.endAsync();
  await harness?.chromium.close();
  await harness?.node.stop();
});

const readings = (count: number, endAt: number, offsetMs: number, voltage: number): BatteryReading[] =>
  Array.from({ length: count }, (_, i) => ({
    measuredAt: endAt - (count - 1 - i) * 2000 - offsetMs,
    voltage,
    current: -1.0,
    temperature: 6,
    stateOfCharge: 61,
  }));

async function publishBoth() {
  const now = Date.now();
  await clients[0].publishAsync(
    readingsTopic(shunt.id),
    JSON.stringify(encodeReadingPack(shunt.id, readings(10, now, 1000, 25.61))),
    { qos: 1 },
  );
  await clients[1].publishAsync(
    readingsTopic(bmsLink.id),
    JSON.stringify(encodeReadingPack(bmsLink.id, readings(10, now, 0, 25.84))),
    { qos: 1 },
  );
}

it.each([
  { width: 390, height: 844 },
  { width: 1280, height: 900 },
])(
  'shows both monitors labelled and keeps the headline on the lead at $width px',
  async (viewport) => {
    // A viewer in another zone than the cabin's (Europe/Oslo): the morning headline names the system's clock.
    // axe-core needs a page of its own context.
    const context = await harness.chromium.browser.newContext({
      viewport,
      timezoneId: 'America/Halifax',
      locale: 'en-GB',
    });
    const page = await context.newPage();
    await page.goto(`${harness.node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(`/systems/${cabinId}`)}`);
    await page.getByLabel('E-mail').fill(demo.users[0].email);
    await page.getByLabel('Password').fill(demo.password);
    await page.keyboard.press('Enter');
    await page.getByText('Live: connected').waitFor();
    await publishBoth();

    const list = page.getByRole('region', { name: 'Monitors on this bank' });
    await list.getByRole('listitem', { name: 'Pack BMS link' }).getByText('25.84 V').waitFor();
    await list.getByRole('listitem', { name: 'Main shunt' }).getByText('25.61 V').waitFor();
    await list.getByText('The figures above come from Main shunt').waitFor();
    // The voltage tile shows the shunt's value and never the BMS link's, though the BMS link reported last.
    const tile = page.locator('.tiles .tile', { hasText: 'Voltage' });
    await expect(tile.innerText()).resolves.toContain('25.61 V');
    // "Will it last until morning?" answered on the cabin's own clock, its zone named for this far-away viewer.
    await page
      .locator('.headline', { hasText: /Lasts until 07:00 \(system time, .+\) with \d+ % to spare/ })
      .waitFor();

    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    const axe = await new AxeBuilder({ page })
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
      .analyze();
    expect(
      axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`),
    ).toEqual([]);
    await context.close();
  },
  60_000,
);
