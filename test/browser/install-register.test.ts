import { join } from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';
import { ownerSystems } from './browser-node';

// Real Chromium against a real node: the installer registers a circuit on the demo van and sees its verdict
// with the rule cited, fixes it, and the screen is axe-clean at phone and desktop width.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let vanId: string;

beforeAll(async () => {
  node = await startTestServer({ webDist: join(__dirname, '..', '..', 'dist', 'web', 'browser') });
  chromium = await launchChromium();
  vanId = (await ownerSystems(node.baseUrl)).van.id;
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function installerPage(width: number, theme: 'light' | 'dark' = 'light'): Promise<Page> {
  // A page of its own context: axe's builder needs one.
  const context = await chromium.browser.newContext({
    colorScheme: theme,
    viewport: { width, height: 900 },
    reducedMotion: 'reduce',
  });
  await context.addInitScript((mode) => localStorage.setItem('cellwarden.theme', mode), theme);
  const page = await context.newPage();
  const path = `/systems/${vanId}/install`;
  await page.goto(`${node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(path)}`);
  await page.getByLabel('E-mail').fill(demo.users[1].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => url.pathname === path);
  await page.getByRole('heading', { level: 1, name: 'Install register' }).waitFor();
  await page.getByRole('region', { name: 'Circuits and their verdicts' }).waitFor();
  return page;
}

async function pick(page: Page, label: string, option: string): Promise<void> {
  await page.getByLabel(label, { exact: true }).click();
  await page.getByRole('option', { name: option, exact: true }).click();
}

/** The circuits table's row for a circuit, by its name. */
const circuitRow = (page: Page, name: string) =>
  page
    .getByRole('region', { name: 'Circuits and their verdicts' })
    .getByRole('row')
    .filter({ has: page.getByRole('rowheader', { name, exact: true }) });

it('registers a fridge circuit with its fuse far from the battery, sees it fail with the rule, then moves the fuse and sees it pass', async () => {
  const page = await installerPage(1280);
  const form = page.getByRole('form', { name: 'Add a circuit' });
  await form.getByLabel('Circuit name').fill('Fridge feed');
  await pick(page, 'Feeds', 'Compressor fridge');
  await pick(page, 'Conductor (AWG)', '14 AWG');
  await form.getByLabel('Length one way (m)').fill('4');
  await form.getByLabel('Rating (A)').fill('10');
  await form.getByLabel('Type (e.g. MRBF, ANL, blade)').fill('blade');
  // Not a distance: the form names the field before anything is sent.
  await form.getByLabel('Fuse distance from the battery (m)').fill('-2');
  await form.getByRole('button', { name: 'Add circuit' }).click();
  await form.getByText('Fuse distance must be at least 0.').waitFor();
  await form.getByLabel('Fuse distance from the battery (m)').fill('2');
  await form.getByRole('button', { name: 'Add circuit' }).click();
  const row = circuitRow(page, 'Fridge feed');
  // 33 CFR 183.455(b): 2 m unsheathed is beyond 7 in (178 mm) and beyond 40 in (1.02 m)
  await row.getByText('Fails').waitFor();
  await row.getByText(/Rule: 33 CFR 183\.455\(b\)/).waitFor();
  await row.getByText(/2 m from the battery leaves that conductor unprotected/).waitFor();

  await row.getByRole('button', { name: 'Edit Fridge feed' }).click();
  const edit = page.getByRole('form', { name: 'Edit circuit' });
  await edit.getByLabel('Fuse distance from the battery (m)').fill('0.1');
  await edit.getByRole('button', { name: 'Save circuit' }).click();
  await circuitRow(page, 'Fridge feed').getByText('Passes').waitFor();
  await page
    .getByRole('status')
    .getByText(/Fridge feed saved: it passes/)
    .waitFor();
  await page.context().close();
}, 90_000);

it('is axe-clean at phone and desktop width in both themes, the tables reachable by keyboard', async () => {
  const found: Record<string, string[]> = {};
  for (const [width, theme] of [
    [390, 'light'],
    [1280, 'light'],
    [390, 'dark'],
    [1280, 'dark'],
  ] as const) {
    const page = await installerPage(width, theme);
    await page.getByRole('heading', { name: 'Design against measured' }).waitFor();
    await page.waitForLoadState('networkidle');
    const result = await new AxeBuilder({ page })
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
      .analyze();
    found[`${width} ${theme}`] = result.violations.map(
      (v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`,
    );
    // The circuits table scrolls sideways on a phone: its region takes focus from the keyboard.
    await page.getByRole('region', { name: 'Circuits and their verdicts' }).focus();
    await expect(page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).resolves.toBe(
      'Circuits and their verdicts',
    );
    await page.context().close();
  }
  expect(found).toEqual({ '390 light': [], '1280 light': [], '390 dark': [], '1280 dark': [] });
}, 150_000);
