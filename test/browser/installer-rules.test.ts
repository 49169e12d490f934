import { join } from 'node:path';
import type { Page } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';

// Real Chromium against a real node: the installer's wire and fuse check for a 60 A DC-DC charger on 4 AWG and
// the feeder of a 2,000 W inverter on a 12 V bank with a 200 A BMS, started from the energy budget — the
// recommendation, the fuse and the placement verdict must agree end to end.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;

beforeAll(async () => {
  node = await startTestServer({ webDist: join(__dirname, '..', '..', 'dist', 'web', 'browser') });
  chromium = await launchChromium();
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function installerPage(): Promise<Page> {
  const page = await chromium.browser.newPage({ viewport: { width: 1280, height: 900 } });
  await page.goto(`${node.baseUrl}/sign-in?returnUrl=${encodeURIComponent('/installer')}`);
  await page.getByLabel('E-mail').fill(demo.users[1].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname.startsWith('/installer'));
  return page;
}

it('passes the 60 A DC-DC charger on 4 AWG with a 100 A fuse only once the fuse sits near the battery', async () => {
  const page = await installerPage();
  await page.getByLabel('Continuous current').fill('60');
  await page.getByLabel('Run length, one way').fill('2');
  await page.getByLabel('Proposed gauge (optional)').click();
  await page.getByRole('option', { name: '4 AWG', exact: true }).click();
  await page.getByLabel('Proposed fuse (optional)').fill('100');
  const result = page.getByRole('region', { name: 'Wire and fuse result' });
  // 33 CFR 183.455(b): 0.5 m unsheathed is beyond 7 in (178 mm)
  await page.getByLabel('Fuse distance from the battery (optional)').fill('0.5');
  await result.getByText('This pair does not pass').waitFor();
  await result.getByText(/leaves that conductor unprotected/).waitFor();
  await page.getByLabel('Fuse distance from the battery (optional)').fill('0.15');
  await result.getByText('This wire and fuse pair passes').waitFor();
  await result.getByText(/within 178 mm \(7 in\)/).waitFor();
  // Recommended for the load alone: 6 AWG (drop, NEC Table 8 stranded at 20 °C) with an 80 A fuse
  await result.getByText(/Fuse 80 A \(range 75 to 180 A\)/).waitFor();
  await page.close();
});

it('sizes the 2,000 W inverter feeder from the energy budget with a fuse the rules allow', async () => {
  const page = await installerPage();
  await page.getByRole('tab', { name: 'Energy budget' }).click();
  await page.getByLabel('Inverter rating').fill('2000');
  await page.getByLabel('BMS continuous discharge').fill('200');
  await page.getByLabel('Battery capacity (optional)').fill('200');
  await page.getByRole('button', { name: 'Check wire & fuse for Inverter feeder' }).click();
  const check = page.getByRole('region', { name: 'Wire and fuse check for Inverter feeder' });
  // P / (V × η) = 2,000 / (12 × 0.9) = 185.2 A, prefilled
  await expect(check.getByLabel('Continuous current').inputValue()).resolves.toBe('185.2');
  await check.getByLabel('Run length, one way').fill('1.5');
  await check.getByLabel('Fuse distance from the battery (optional)').fill('0');
  await check.getByLabel('Fuse interrupting rating (optional)').fill('20000');
  const result = check.getByRole('region', { name: 'Wire and fuse result' });
  // 1 AWG 245 A ≥ 231.5 A; fuse 250 A allowed to 150 % × 245 A (33 CFR 183.455(c)(1))
  await result.getByText(/Fuse 250 A \(range 231\.5 to 367\.5 A\)/).waitFor();
  await result.getByText('This wire and fuse pair passes').waitFor();
  await page.close();
});
