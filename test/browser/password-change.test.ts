import AxeBuilder from '@axe-core/playwright';
import type { Browser, BrowserContext } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startBrowserNode } from './browser-node';

// The owner changes their password on the account page in real Chromium: the page stays signed in, the same
// person's sign-in in another browser ends at once, and the new password is the one that works from then on.
// axe-core checks the page at phone and desktop width.

let harness: Awaited<ReturnType<typeof startBrowserNode>>;
const owner = demo.users[0];
const NEW_PASSWORD = 'frost on the skylight at dawn';

beforeAll(async () => {
  harness = await startBrowserNode();
}, 60_000);
afterAll(async () => {
  await harness?.chromium.close();
  await harness?.node.stop();
});

async function signedIn(browser: Browser, width: number, password: string): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width, height: 900 } });
  const page = await context.newPage();
  await page.goto(`${harness.node.baseUrl}/sign-in?returnUrl=${encodeURIComponent('/account')}`);
  await page.getByLabel('E-mail').fill(owner.email);
  await page.getByLabel('Password').fill(password);
  await page.keyboard.press('Enter');
  await page.getByRole('heading', { name: 'Your account', level: 1 }).waitFor();
  return context;
}

it('changes the password, keeps this sign-in, ends the other one, and the new password works', async () => {
  const phone = await signedIn(harness.chromium.browser, 390, demo.password);
  const desk = await signedIn(harness.chromium.browser, 1280, demo.password);
  const [page] = phone.pages();
  for (const context of [phone, desk]) {
    const axe = await new AxeBuilder({ page: context.pages()[0] })
      .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
      .analyze();
    expect(
      axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`),
    ).toEqual([]);
  }

  const form = page.getByRole('form', { name: 'Change your password' });
  await form.getByLabel('Current password').fill('not the password');
  await form.getByLabel('New password', { exact: true }).fill(NEW_PASSWORD);
  await form.getByLabel('Repeat the new password').fill(NEW_PASSWORD);
  await form.getByRole('button', { name: 'Change password' }).click();
  await form.getByText('Current password is not correct').waitFor();

  await form.getByLabel('Current password').fill(demo.password);
  await form.getByRole('button', { name: 'Change password' }).click();
  await page.getByText('Your password is changed. Your other sign-ins have ended.').waitFor();

  // This browser stays signed in across a reload; the other one is sent to sign in again.
  await page.reload();
  await page.getByRole('heading', { name: 'Your account', level: 1 }).waitFor();
  const other = desk.pages()[0];
  await other.reload();
  await other.waitForURL((url) => url.pathname === '/sign-in', { timeout: 15_000 });
  await other.getByLabel('E-mail').fill(owner.email);
  await other.getByLabel('Password').fill(demo.password);
  await other.keyboard.press('Enter');
  await other.getByRole('alert').waitFor();
  await desk.close();
  const again = await signedIn(harness.chromium.browser, 1280, NEW_PASSWORD);
  await again.close();
  await phone.close();
}, 90_000);
