import AxeBuilder from '@axe-core/playwright';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { seedDemoBatteryYear } from '../../db/seeders/demo-battery-year';
import { extractPdfText } from '../../server/src/records/pdf-text-reader';
import { startTestServer } from '../support/test-server';
import { ownerSystems, startBrowserNode } from './browser-node';
import { launchChromium } from './launch-chromium';

// Real Chromium against a real node: the owner opens the van's battery health, reads the words and the
// charts, downloads the report; axe-core finds nothing at phone and desktop width.

let node: Awaited<ReturnType<typeof startTestServer>>;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let vanId: string;

beforeAll(async () => {
  ({ node, chromium } = await startBrowserNode());
  vanId = (await ownerSystems(node.baseUrl)).van.id;
  // A shorter year than the demo's keeps the test quick; the path is the same.
  await seedDemoBatteryYear(node.database, { end: Date.now(), days: 90 });
}, 120_000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function signedIn(width: number, path: string): Promise<Page> {
  const context = await chromium.browser.newContext({
    viewport: { width, height: 900 },
    acceptDownloads: true,
    reducedMotion: 'reduce',
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

async function violations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
    .analyze();
  return result.violations.map(
    (v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`,
  );
}

it('shows the owner the words and charts and downloads the PDF report', async () => {
  const page = await signedIn(1280, `/systems/${vanId}`);
  await page
    .getByRole('navigation', { name: /^Pages of/ })
    .getByRole('link', { name: 'Health' })
    .click();
  await page.getByRole('heading', { level: 1, name: 'Battery health' }).waitFor();
  await page.getByRole('heading', { name: 'Usable capacity by month' }).waitFor();
  await expect(page.locator('.headline').innerText()).resolves.toMatch(/\S/);
  await page.getByRole('img', { name: /^Estimated usable capacity by month/ }).waitFor();
  await page.getByRole('img', { name: /^Hours by pack temperature: below 0 °C/ }).waitFor();
  await page.getByRole('img', { name: /^Cycles by depth of discharge/ }).waitFor();
  await page.getByText("Times in the system's time zone, Europe/Helsinki.").waitFor();

  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Download PDF' }).click(),
  ]);
  await page.getByText(/Saved battery-health-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.pdf/).waitFor();
  const text = extractPdfText(readFileSync(await download.path()));
  expect(text).toContain('Cellwarden battery health report');
  expect(text).toContain('not a warranty assessment');
  await page.context().close();
}, 60_000);

it.each([1280, 390])(
  'has nothing for axe-core to find at %i px',
  async (width) => {
    const page = await signedIn(width, `/systems/${vanId}/battery-health`);
    await page.getByRole('heading', { level: 1, name: 'Battery health' }).waitFor();
    await page.getByRole('heading', { name: 'How it has been used' }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(await violations(page)).toEqual([]);
    // Nothing wider than the phone: the page does not scroll sideways.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await page.context().close();
  },
  60_000,
);
