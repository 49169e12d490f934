import { join } from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import { connectAsync } from 'mqtt';
import type { BrowserContext, Page } from 'playwright-core';
import request from 'supertest';
import { encodeReadingPack, readingsTopic, type BatteryReading } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';

// axe-core on every screen, as each demo user reaches it, at desktop and phone width, in both themes
// for the screens that carry most colour. The WCAG 2.x A/AA rules and axe's best-practice rules
// (landmarks, heading order) must find nothing.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let vanId: string;

const OWNER = demo.users[0].email;
const INSTALLER = demo.users[1].email;
const SUPPORT = demo.users[2].email;
const ADMIN = demo.users[3].email;
const WIDTHS = [1280, 390] as const;

beforeAll(async () => {
  node = await startTestServer({ webDist: join(__dirname, '..', '..', 'dist', 'web', 'browser') });
  chromium = await launchChromium();
  const signIn = await request(node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: OWNER, password: demo.password });
  const systems = await request(node.baseUrl)
    .get('/api/systems')
    .set('Authorization', `Bearer ${signIn.body.accessToken}`);
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
  // A frozen pack on charge, so the live screen shows a flag and its colours are checked too.
  const [van] = demo.devices;
  const device = await connectAsync(node.mqttUrl, {
    username: van.id,
    password: van.secret,
    clientId: `${van.id}/axe-${Date.now()}`,
  });
  const now = Date.now();
  const frozenCharging: BatteryReading[] = Array.from({ length: 20 }, (_, i) => ({
    measuredAt: now - (19 - i) * 5000,
    voltage: 13.35,
    current: 9.5,
    temperature: -7.5,
    stateOfCharge: 58,
  }));
  await device.publishAsync(
    readingsTopic(van.id),
    JSON.stringify(encodeReadingPack(van.id, frozenCharging)),
    {
      qos: 1,
    },
  );
  await device.endAsync();
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

/** Each rule broken, with the elements that break it, so a failure names what to fix. */
async function violations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
    .analyze();
  return result.violations.map(
    (v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`,
  );
}

/** Only the screens where axe found something, so the failure lists screen, rule and elements. */
function withViolations(found: Record<string, string[]>): Record<string, string[]> {
  return Object.fromEntries(Object.entries(found).filter(([, rules]) => rules.length > 0));
}

async function newContext(width: number, theme: 'light' | 'dark' = 'light'): Promise<BrowserContext> {
  const context = await chromium.browser.newContext({
    viewport: { width, height: 900 },
    colorScheme: theme,
    reducedMotion: 'reduce',
  });
  await context.addInitScript((mode) => localStorage.setItem('cellwarden.theme', mode), theme);
  return context;
}

async function signIn(context: BrowserContext, email: string): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  return page;
}

/** Opens a screen through the app's router and waits until its heading and data have arrived. */
async function open(page: Page, path: string, heading: string | RegExp): Promise<void> {
  await page.goto(`${node.baseUrl}${path}`);
  await page.getByRole('heading', { level: 1, name: heading }).waitFor();
  await page.waitForLoadState('networkidle');
  await expect(page.locator('mat-progress-bar, mat-spinner, mat-progress-spinner').count()).resolves.toBe(0);
}

async function openTab(page: Page, name: string): Promise<void> {
  await page.getByRole('tab', { name }).click();
  await page.getByRole('tabpanel', { name }).waitFor();
  await page.waitForLoadState('networkidle');
  // The panel slides in; axe reads a half-moved panel's labels as hidden.
  await page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'));
  await page.locator('.mat-mdc-tab-body-active .mat-mdc-tab-body-content').waitFor();
}

describe.each(WIDTHS)('at %i px', (width) => {
  it('finds nothing on the screens reached without signing in', async () => {
    const context = await newContext(width);
    const page = await context.newPage();
    const found: Record<string, string[]> = {};
    await open(page, '/sign-in', 'Sign in to Cellwarden');
    found['sign-in'] = await violations(page);
    await open(page, '/password-reset', /password/i);
    found['password reset request'] = await violations(page);
    await open(page, '/password-reset/not-a-real-token', /password/i);
    found['new password'] = await violations(page);
    await open(page, '/invitation/not-a-real-token', 'Join Cellwarden');
    found['invitation'] = await violations(page);
    await context.close();
    expect(withViolations(found)).toEqual({});
  }, 120000);

  it.each(['light', 'dark'] as const)(
    "finds nothing on the owner's screens (%s theme)",
    async (theme) => {
      const context = await newContext(width, theme);
      const page = await signIn(context, OWNER);
      const found: Record<string, string[]> = {};
      await open(page, '/systems', 'Systems');
      found['systems'] = await violations(page);
      await open(page, `/systems/${vanId}`, 'Winter van');
      found['live'] = await violations(page);
      await open(page, `/systems/${vanId}/history`, 'History');
      found['history'] = await violations(page);
      await open(page, `/systems/${vanId}/alerts`, 'Alerts');
      found['alerts'] = await violations(page);
      await open(page, `/systems/${vanId}/settings`, 'Settings');
      found['settings'] = await violations(page);
      await open(page, `/systems/${vanId}/access`, /access/i);
      found['access: grants'] = await violations(page);
      await openTab(page, 'Devices');
      found['access: devices'] = await violations(page);
      await openTab(page, 'Audit trail');
      found['access: audit'] = await violations(page);
      await open(page, `/systems/${vanId}/readings-transfer`, 'Readings as CSV');
      found['readings CSV'] = await violations(page);
      await open(page, `/systems/${vanId}/devices`, 'Device management');
      found['devices'] = await violations(page);
      await open(page, '/mail-outbox', 'Your mail, local copy');
      found['own mail'] = await violations(page);
      await context.close();
      expect(withViolations(found)).toEqual({});
    },
    180000,
  );

  it.each(['light', 'dark'] as const)(
    "finds nothing on the installer's tools (%s theme)",
    async (theme) => {
      const context = await newContext(width, theme);
      const page = await signIn(context, INSTALLER);
      const found: Record<string, string[]> = {};
      await open(page, '/installer', 'Installer tools');
      found['wire & fuse'] = await violations(page);
      // A verdict box in the status colours.
      await page.getByLabel('Continuous current').fill('60');
      await page.getByLabel('Run length, one way').fill('2');
      await page
        .getByRole('region', { name: 'Wire and fuse result' })
        .getByText(/passes|does not/)
        .first()
        .waitFor();
      found['wire & fuse with a result'] = await violations(page);
      await openTab(page, 'Energy budget');
      found['energy budget'] = await violations(page);
      await open(page, `/systems/${vanId}/commissioning`, /commissioning/i);
      found['commissioning and uploads'] = await violations(page);
      await context.close();
      expect(withViolations(found)).toEqual({});
    },
    180000,
  );

  it('finds nothing on the team, received-access and fleet screens of company staff', async () => {
    const context = await newContext(width);
    const admin = await signIn(context, ADMIN);
    const found: Record<string, string[]> = {};
    await open(admin, '/team', 'Team');
    found['team'] = await violations(admin);
    await open(admin, '/systems', 'Systems');
    found['fleet'] = await violations(admin);
    await context.close();
    const supportContext = await newContext(width);
    const support = await signIn(supportContext, SUPPORT);
    await open(support, '/shared-with-me', 'Shared with me');
    found['shared with me'] = await violations(support);
    await supportContext.close();
    expect(withViolations(found)).toEqual({});
  }, 180000);
});

it('shows a visible focus ring on the controls a keyboard user tabs through', async () => {
  const context = await newContext(1280);
  const page = await context.newPage();
  await open(page, '/sign-in', 'Sign in to Cellwarden');
  const unringed: string[] = [];
  for (let step = 0; step < 8; step++) {
    await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el || el === document.body) return null;
      const style = getComputedStyle(el);
      // Material's strong focus indicator is a border drawn by a ::before on the control or its host.
      const indicator = el.matches('.mat-focus-indicator') ? el : el.closest('.mat-focus-indicator');
      const before = indicator ? getComputedStyle(indicator, '::before') : null;
      const ringed =
        (style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0) ||
        (before !== null && before.borderTopStyle !== 'none' && parseFloat(before.borderTopWidth) > 0) ||
        // Material form fields show focus by thickening their outline, drawn on the wrapper.
        !!el.closest('.mat-focused');
      return { name: el.getAttribute('aria-label') ?? el.textContent?.trim() ?? el.tagName, ringed };
    });
    if (focused && !focused.ringed) unringed.push(focused.name);
  }
  await context.close();
  expect(unringed).toEqual([]);
});

it('lets a keyboard user skip to the content, switch theme, open the user menu, pass their account and sign out', async () => {
  const context = await newContext(1280);
  const page = await signIn(context, OWNER);
  await open(page, '/systems', 'Systems');
  await page.keyboard.press('Tab');
  await expect(page.evaluate(() => document.activeElement?.textContent?.trim())).resolves.toBe(
    'Skip to content',
  );
  await page.keyboard.press('Enter');
  await expect(page.evaluate(() => document.activeElement?.id)).resolves.toBe('main');

  await page.getByRole('button', { name: 'Switch to dark theme' }).focus();
  await page.keyboard.press('Enter');
  await page.waitForFunction(() => document.documentElement.classList.contains('cw-dark'));
  await page.getByRole('button', { name: 'Switch to light theme' }).waitFor();

  await page.getByRole('button', { name: 'User menu' }).focus();
  await page.keyboard.press('Enter');
  // The menu opens on its first item, the account page; the arrow key moves on to signing out.
  await expect(
    page.getByRole('menuitem', { name: 'Your account' }).evaluate((el) => el === document.activeElement),
  ).resolves.toBe(true);
  await page.keyboard.press('ArrowDown');
  await expect(
    page.getByRole('menuitem', { name: 'Sign out' }).evaluate((el) => el === document.activeElement),
  ).resolves.toBe(true);
  await page.keyboard.press('Enter');
  await page.waitForURL(/sign-in/);
  await context.close();
});

it('reaches every navigation link by Tab, each with a visible focus ring', async () => {
  const context = await newContext(1280);
  const page = await signIn(context, ADMIN);
  await open(page, '/systems', 'Systems');
  const reached = new Map<string, boolean>();
  for (let step = 0; step < 12; step++) {
    await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el?.classList.contains('nav-link')) return null;
      const style = getComputedStyle(el);
      return {
        name: el.querySelector('span')?.textContent?.trim() ?? '',
        ringed: style.outlineStyle !== 'none',
      };
    });
    if (focused) reached.set(focused.name, focused.ringed);
  }
  await context.close();
  expect(Object.fromEntries(reached)).toEqual(
    expect.objectContaining({ Systems: true, 'Shared with me': true, 'Installer tools': true, Team: true }),
  );
});
