import AxeBuilder from '@axe-core/playwright';
import { connectAsync } from 'mqtt';
import { join } from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import request from 'supertest';
import { encodeReadingPack, readingsTopic, type BatteryReading, type SystemStatus } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { ownerSystems, startBrowserNode } from './browser-node';
import { launchChromium } from './launch-chromium';

// The first glance: web/src/session-head-start.js paints a system's latest values from its status before the
// dashboard's code has run, and the live view replaces it with its own tiles. The van's pack is being charged
// below freezing, so the first glance must say so as text, not show calm numbers.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let vanId: string;
let vanName: string;
let token: string;
const [van] = demo.devices;

const frozenCharging = (count: number, endAt: number): BatteryReading[] =>
  Array.from({ length: count }, (_, i) => ({
    measuredAt: endAt - (count - 1 - i) * 5000,
    voltage: 13.35,
    current: 9.5,
    temperature: -7.5,
    stateOfCharge: 58,
  }));

beforeAll(async () => {
  ({ node, chromium } = await startBrowserNode());
  ({ id: vanId, name: vanName } = (await ownerSystems(node.baseUrl)).van);
  const signIn = await request(node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: demo.users[0].email, password: demo.password });
  token = signIn.body.accessToken;
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

/** The van's monitor reports half a minute of charging at −7.5 °C, ending now; answers the status after it. */
async function chargedCold(): Promise<SystemStatus> {
  const device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/glance-${Date.now()}`,
  });
  await device.publishAsync(
    readingsTopic(van.id),
    JSON.stringify(encodeReadingPack(van.id, frozenCharging(6, Date.now()))),
    { qos: 1 },
  );
  await device.endAsync();
  const answer = await request(node.baseUrl)
    .get(`/api/systems/${vanId}/status`)
    .set('Authorization', `Bearer ${token}`);
  return answer.body.status;
}

/** A signed-in owner's browser (the refresh cookie set, as after signing in) in a German locale. */
async function signedIn(
  width: number,
  colorScheme: 'light' | 'dark' = 'light',
  locale = 'de-DE',
): Promise<BrowserContext> {
  const context = await chromium.browser.newContext({
    viewport: { width, height: 800 },
    colorScheme,
    locale,
  });
  const answer = await context.request.post(`${node.baseUrl}/api/auth/sign-in`, {
    data: { email: demo.users[0].email, password: demo.password },
  });
  expect(answer.status()).toBe(200);
  // Records whether a first glance was ever painted, and whether it ever stood beside the live view's tiles.
  await context.addInitScript(() => {
    const seen = { painted: false, besideTiles: false };
    (window as unknown as { cwGlanceSeen: typeof seen }).cwGlanceSeen = seen;
    new MutationObserver(() => {
      const glance = document.getElementById('cw-first-glance');
      if (glance) seen.painted = true;
      if (glance && document.querySelector('.tiles .tile dd')) seen.besideTiles = true;
    }).observe(document, { childList: true, subtree: true });
  });
  return context;
}

/** Holds the dashboard's own code back, so the first glance stays on screen as long as a test needs. */
async function withoutAngular(page: Page): Promise<void> {
  await page.route(/\/main-[A-Z0-9]+\.js$/, () => undefined);
}

/**
 * Lets the dashboard start (its shell, with the main landmark and navigation) but holds back every lazy chunk, the
 * live view's among them: the first glance then stands over a running shell, as it does while the view loads.
 */
async function withoutLiveView(page: Page): Promise<void> {
  // The first download: the scripts index.html names and every chunk they import statically, however deep.
  const index = (await request(node.baseUrl).get('/')).text;
  const initial = new Set<string>();
  const queue = [...index.matchAll(/src="([^"]+\.js)"/g)].map((m) => `/${m[1]}`);
  for (let path = queue.pop(); path; path = queue.pop()) {
    if (initial.has(path)) continue;
    initial.add(path);
    const code = (await request(node.baseUrl).get(path)).text;
    for (const m of code.matchAll(/(?:from|import)\s*"\.\/(chunk-[A-Z0-9]+\.js)"/g)) queue.push(`/${m[1]}`);
  }
  // Each lazy chunk arrives but never finishes running (a top-level await that never settles): a request left
  // unanswered would hold one of the browser's six connections, and the status would queue behind them.
  await page.route(/\.js$/, async (route) => {
    if (initial.has(new URL(route.request().url()).pathname)) return route.continue();
    const chunk = await route.fetch();
    await route.fulfill({ response: chunk, body: `await new Promise(() => {});\n${await chunk.text()}` });
  });
}

async function axeViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
    .analyze();
  return result.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

const seen = (page: Page) =>
  page.evaluate(
    () => (window as unknown as { cwGlanceSeen: { painted: boolean; besideTiles: boolean } }).cwGlanceSeen,
  );

it("paints the status's values in the viewer's locale, with the cold-charging flag as text", async () => {
  const status = await chargedCold();
  const context = await signedIn(1280);
  const page = await context.newPage();
  await withoutAngular(page);
  await page.goto(`${node.baseUrl}/systems/${vanId}`, { waitUntil: 'commit' });
  const glance = page.getByRole('region', { name: vanName });
  await glance.waitFor();
  const reading = status.latestReading!;
  const soc = status.derived?.stateOfCharge ?? reading.stateOfCharge!;
  // German writes a decimal comma (the dashboard carries "de" data and picks it for de-DE).
  const de = (value: number, digits: number) =>
    new Intl.NumberFormat('de', { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(
      value,
    );
  const tile = (name: string) => glance.locator('div', { has: page.locator('dt', { hasText: name }) });
  await expect(tile('State of charge').locator('dd').textContent()).resolves.toBe(`${de(soc, 0)} %`);
  await expect(tile('Voltage').locator('dd').textContent()).resolves.toBe('13,35 V');
  await expect(tile('Current').locator('.cw-first-glance-value').textContent()).resolves.toBe('9,5 A');
  await expect(tile('Current').getByText('into the pack').isVisible()).resolves.toBe(true);
  await expect(glance.getByText('Critical: Charging a battery that is too cold').isVisible()).resolves.toBe(
    true,
  );
  const when = new Intl.DateTimeFormat('de', { dateStyle: 'medium', timeStyle: 'short' }).format(
    reading.measuredAt,
  );
  await expect(glance.getByText(when, { exact: false }).isVisible()).resolves.toBe(true);
  // A temperature needs the person's °C/°F choice, which only the server knows: none is shown yet.
  await expect(glance.getByText('°').count()).resolves.toBe(0);
  await context.close();
});

it('is clean for axe and holds nothing a keyboard can land on, at 390 px dark and 1280 px light', async () => {
  for (const [width, scheme] of [
    [390, 'dark'],
    [1280, 'light'],
  ] as const) {
    await chargedCold();
    // en-US: its number and date data are built in, so the held-back lazy chunks do not hold bootstrap.
    const context = await signedIn(width, scheme, 'en-US');
    const page = await context.newPage();
    await withoutLiveView(page);
    await page.goto(`${node.baseUrl}/systems/${vanId}`, { waitUntil: 'commit' });
    await page.locator('#cw-first-glance').waitFor();
    // The shell is up around it (its main landmark and toolbar), the live view still on its way.
    await page.locator('main#main').waitFor();
    await page.getByText('Cellwarden watches your battery').waitFor();
    await expect(axeViolations(page)).resolves.toEqual([]);
    await expect(
      page.locator('#cw-first-glance').locator('a, button, input, [tabindex]').count(),
    ).resolves.toBe(0);
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    await page.screenshot({ path: join(__dirname, '..', '..', '.data', `first-glance-${width}.png`) });
    // A key press hands the page back at once: the first glance covers nothing anyone wants to reach.
    await page.keyboard.press('Tab');
    await expect(page.locator('#cw-first-glance').count()).resolves.toBe(0);
    await context.close();
  }
});

it("is replaced by the live view's tiles, never beside them", async () => {
  await chargedCold();
  const context = await signedIn(390);
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/systems/${vanId}`);
  await page.locator('.tiles .tile dd').first().waitFor();
  await expect(page.locator('#cw-first-glance').count()).resolves.toBe(0);
  await expect(seen(page)).resolves.toEqual({ painted: true, besideTiles: false });
  await context.close();
});

it('paints nothing on a system the person may not see, nor without a session', async () => {
  const context = await signedIn(1280);
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/systems/7a0d4f52-3b8e-4c3a-9d55-2f1c0b6e9a41`);
  await page.getByText('Your access to this system has ended, or it no longer exists').waitFor();
  await expect(seen(page)).resolves.toEqual({ painted: false, besideTiles: false });
  await context.close();

  const stranger = await chromium.browser.newContext();
  const other = await stranger.newPage();
  await other.goto(`${node.baseUrl}/systems/${vanId}`);
  await other.waitForURL(/\/sign-in/);
  await expect(other.locator('#cw-first-glance').count()).resolves.toBe(0);
  await stranger.close();
});
