import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { startTestServer } from '../support/test-server';
import { ownerSystems, startBrowserNode } from './browser-node';
import { launchChromium } from './launch-chromium';

// Real Chromium against a real node: the owner exports the van's last hour through the dashboard, imports
// the downloaded file into the cabin, sees how many readings were stored, and that a second import stores none.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let vanId: string;
let cabinId: string;
const READINGS = 60;

beforeAll(async () => {
  ({ node, chromium } = await startBrowserNode());
  const systems = await ownerSystems(node.baseUrl);
  vanId = systems.van.id;
  cabinId = systems.cabin.id;
  // One reading every 45 s over most of the van's last hour, as its monitor would have sent them.
  const end = Math.floor(Date.now() / 1000) * 1000 - 60_000;
  await createReadingsRepository(node.database).insertBatch(
    Array.from({ length: READINGS }, (_, i) => ({
      systemId: vanId,
      deviceId: 'cw-demo-van',
      reading: {
        measuredAt: end - i * 45_000,
        voltage: 13.1 - i * 0.002,
        current: -4.5,
        temperature: -3.5,
        stateOfCharge: 80 - i * 0.1,
      },
    })),
  );
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function signedIn(path: string): Promise<Page> {
  const context = await chromium.browser.newContext({
    viewport: { width: 1280, height: 900 },
    acceptDownloads: true,
  });
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(path)}`);
  await page.getByLabel('E-mail').fill(demo.users[0].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  if (!page.url().endsWith(path)) await page.goto(`${node.baseUrl}${path}`);
  return page;
}

it("exports the van's last hour and imports the file into the cabin, all rows once", async () => {
  const page = await signedIn(`/systems/${vanId}`);
  await page
    .getByRole('navigation', { name: /^Pages of/ })
    .getByRole('link', { name: 'CSV' })
    .click();
  await page.getByRole('heading', { name: 'Readings as CSV' }).waitFor();

  await page.getByRole('radio', { name: 'Last hour' }).click();
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Download CSV' }).click(),
  ]);
  await page.getByText(/^Saved cellwarden-readings-.*\.csv/).waitFor();
  const file = await download.path();
  const lines = readFileSync(file, 'utf8').trim().split('\n');
  expect(lines[0]).toBe('measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w');
  expect(lines).toHaveLength(READINGS + 1);

  await page.goto(`${node.baseUrl}/systems/${cabinId}/readings-transfer`);
  await page.getByLabel('CSV file of readings').setInputFiles(file);
  const preview = page.getByRole('table', { name: 'First rows of the file' });
  // The oldest reading comes first: 13.1 V − 59 × 0.002 V.
  await preview.getByRole('cell', { name: '12.982 V' }).first().waitFor();
  await page.getByRole('button', { name: 'Import file' }).click();
  await page.getByText(`Stored ${READINGS} readings.`).waitFor();
  expect(await createReadingsRepository(node.database).countForSystem(cabinId)).toBe(READINGS);

  // The same file again: every reading is already there, so nothing more is stored.
  await page.getByRole('button', { name: 'Import file' }).click();
  await page.getByText(`Stored 0 readings; ${READINGS} were already stored and were skipped.`).waitFor();
  expect(await createReadingsRepository(node.database).countForSystem(cabinId)).toBe(READINGS);
  await page.context().close();
});

it('stores nothing from an edited file and names the line and column', async () => {
  const page = await signedIn(`/systems/${cabinId}/readings-transfer`);
  const before = await createReadingsRepository(node.database).countForSystem(cabinId);
  const header = 'measured_at,voltage_v,current_a,temperature_c,state_of_charge_pct,power_w';
  const at = (minutes: number) => new Date(Date.now() - minutes * 60_000).toISOString();
  await page.getByLabel('CSV file of readings').setInputFiles({
    name: 'edited.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from([header, `${at(90)},26.4,-3,18,55,`, `${at(89)},26.4,-3,180,55,`].join('\n')),
  });
  await page.getByText(/^Column temperature_c:/).waitFor();
  await page.getByRole('button', { name: 'Import file' }).click();
  await page.getByText(/^Nothing stored: line 3, column temperature_c:/).waitFor();
  expect(await createReadingsRepository(node.database).countForSystem(cabinId)).toBe(before);
  await page.context().close();
});
