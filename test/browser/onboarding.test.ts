import AxeBuilder from '@axe-core/playwright';
import { connectAsync } from 'mqtt';
import type { BrowserContext, Page } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { examplePayload } from '@cellwarden/shared';
import { startBrowserNode } from './browser-node';

// Real Chromium, a real node and its broker: an installer sets up a system for a customer, the customer's
// invitation arrives in the captured mail, a monitor is added and a real MQTT client publishes the shown
// example with the shown credentials until the screen says the first reading arrived; then a support person
// asks the owner for access and sees the system once the owner approves. axe checks each new screen at
// phone and desktop width.

type Started = Awaited<ReturnType<typeof startBrowserNode>>;
let node: Started['node'];
let chromium: Started['chromium'];
const [owner, installer, support] = demo.users;
const CUSTOMER = 'fenna.dijkstra@customer.example';

beforeAll(async () => {
  ({ node, chromium } = await startBrowserNode());
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function newContext(width: number): Promise<BrowserContext> {
  return chromium.browser.newContext({ viewport: { width, height: 900 }, reducedMotion: 'reduce' });
}

async function signIn(context: BrowserContext, email: string, path: string): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${node.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  await page.goto(`${node.baseUrl}${path}`);
  return page;
}

/** Each rule axe finds broken, with its elements, so a failure names what to fix. */
async function violations(page: Page): Promise<string[]> {
  await page.waitForLoadState('networkidle');
  // Panels and steps slide in (axe reads a half-moved one as hidden); a waiting bar's endless loop is no slide.
  await page.waitForFunction(() =>
    document
      .getAnimations()
      .every((a) => a.playState !== 'running' || a.effect?.getComputedTiming().iterations === Infinity),
  );
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice'])
    .analyze();
  return result.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

const credential = (page: Page, label: string) =>
  page
    .locator('.credentials .row')
    .filter({ has: page.getByText(label, { exact: true }) })
    .locator('code')
    .innerText();

it('installer sets up a system for a customer, adds its monitor, and sees the first reading arrive', async () => {
  const context = await newContext(1280);
  const page = await signIn(context, installer.email, '/systems');
  await page.getByRole('link', { name: 'New system' }).click();
  await page.getByRole('heading', { level: 1, name: 'Set up a system' }).waitFor();
  expect(await violations(page)).toEqual([]);

  await page.getByLabel('System name').fill('Fjord hopper');
  await page.getByRole('radio', { name: '24 V' }).click();
  await page.getByLabel('Rated capacity').fill('200');
  await page.getByLabel('Usable capacity').fill('180');
  await page.getByLabel('Time zone').fill('Europe/Oslo');
  await page.keyboard.press('Escape');
  await page.getByRole('button', { name: 'Next: battery protection' }).click();
  await page.getByLabel('Continuous discharge').fill('150');
  // A peak below the continuous rating is named before anything is sent.
  await page.getByLabel('Peak discharge').fill('100');
  await page.getByLabel('Peak discharge').blur();
  await page.getByText('Peak discharge must be at least the continuous discharge.').waitFor();
  await page.getByLabel('Peak discharge').fill('300');
  await page.getByRole('radio', { name: 'Yes, it has a cold-charge cut-off' }).check();
  await page.getByRole('button', { name: 'Next: owner' }).click();
  await page.getByLabel("Customer's e-mail").fill(CUSTOMER);
  await page.getByRole('button', { name: 'Set up the system' }).click();
  await page.getByText(`An invitation went to ${CUSTOMER}`).waitFor();

  const invitation = await node.server.mailCatcher!.waitFor((m) => m.to.includes(CUSTOMER), 5000);
  expect(invitation.subject).toContain('Fjord hopper');
  const link = /https?:\/\/\S+\/invitation\/[\w-]+/.exec(invitation.text)![0];

  await page.getByLabel('Device id').fill('fjord-shunt-1');
  await page.getByRole('button', { name: 'Add monitor and show its credentials' }).click();
  await page.getByText('Waiting for the first reading').first().waitFor();
  const brokerUrl = await credential(page, 'Broker URL');
  expect(brokerUrl).toBe(node.mqttUrl);
  expect(await credential(page, 'Topic to publish to')).toBe('cellwarden/v1/devices/fjord-shunt-1/readings');
  expect(await page.getByLabel('Example command').innerText()).toContain("-u 'fjord-shunt-1'");

  const monitor = await connectAsync(brokerUrl, {
    username: await credential(page, 'Client id and username'),
    password: await credential(page, 'Password'),
    clientId: 'fjord-shunt-1',
    reconnectPeriod: 0,
  });
  await monitor.publishAsync(
    await credential(page, 'Topic to publish to'),
    examplePayload('fjord-shunt-1', 24),
    { qos: 1 },
  );
  await monitor.endAsync();
  await page.getByText('First reading arrived').waitFor({ timeout: 15000 });
  await page.getByText(/26\.40 V/).waitFor();
  expect(await violations(page)).toEqual([]);
  await context.close();

  // The customer accepts the invitation and finds the system theirs.
  const customerContext = await newContext(390);
  const customer = await customerContext.newPage();
  await customer.goto(link);
  await customer.getByLabel('Display name').fill('Fenna Dijkstra');
  await customer.getByLabel('Password', { exact: true }).fill('a long enough pass 42');
  await customer.getByLabel('Repeat the password').fill('a long enough pass 42');
  await customer.getByRole('button', { name: 'Accept and sign in' }).click();
  await customer
    .getByRole('link', { name: /Fjord hopper/ })
    .first()
    .waitFor();
  // The invitation is in the new owner's own captured-mail outbox too.
  await customer.goto(`${node.baseUrl}/mail-outbox`);
  await customer.getByText('Your battery system “Fjord hopper” on Cellwarden').first().waitFor();
  await customerContext.close();
}, 120000);

it('lets an owner set up a system for themselves on a phone and shows the monitor step, axe-clean', async () => {
  const context = await newContext(390);
  const page = await signIn(context, owner.email, '/systems/new');
  await page.getByRole('heading', { level: 1, name: 'Set up a system' }).waitFor();
  expect(await violations(page)).toEqual([]);
  await page.getByLabel('System name').fill('Garden shed bank');
  await page.getByLabel('Kind').click();
  await page.getByRole('option', { name: 'Cabin' }).click();
  await page.getByLabel('Rated capacity').fill('100');
  await page.getByLabel('Usable capacity').fill('90');
  await page.getByLabel('Time zone').fill('UTC');
  await page.keyboard.press('Escape');
  await page.getByRole('button', { name: 'Next: battery protection' }).click();
  await page.getByLabel('Continuous discharge').fill('100');
  await page.getByLabel('Peak discharge').fill('200');
  await page.getByRole('radio', { name: 'No, or not known' }).check();
  await page.getByRole('button', { name: 'Next: owner' }).click();
  await page.getByText('You will own this system.').waitFor();
  await page.getByRole('button', { name: 'Set up the system' }).click();
  await page.getByLabel('Device id').fill('shed-shunt-1');
  await page.getByRole('button', { name: 'Add monitor and show its credentials' }).click();
  await page.getByText('Waiting for the first reading').first().waitFor();
  expect(await violations(page)).toEqual([]);

  // The owner's Access page has the new Requests tab: a share code to read out.
  await page.goto(`${node.baseUrl}/systems`);
  const systemLink = page.getByRole('link', { name: 'Open Garden shed bank' });
  await systemLink.waitFor();
  const systemId = (await systemLink.getAttribute('href'))!.split('/').pop();
  await page.goto(`${node.baseUrl}/systems/${systemId}/access`);
  await page.getByRole('tab', { name: 'Requests' }).click();
  await page.getByRole('button', { name: 'Make a share code' }).click();
  await page.getByText(/^[0-9A-Z]{4}-[0-9A-Z]{4}$/).waitFor();
  expect(await violations(page)).toEqual([]);
  await context.close();
}, 120000);

it('support asks for access, the owner approves in one click, and the support person sees the system', async () => {
  const supportContext = await newContext(390);
  const supportPage = await signIn(supportContext, support.email, '/requests');
  await supportPage.getByRole('heading', { level: 2, name: 'Ask an owner for access' }).waitFor();
  expect(await violations(supportPage)).toEqual([]);
  await supportPage.getByLabel("Owner's e-mail").fill(owner.email);
  await supportPage.getByLabel('System name').fill('lakeside cabin');
  await supportPage.getByLabel('Note to the owner (optional)').fill('Ticket 5120: charger question');
  await supportPage.getByRole('button', { name: 'Send request' }).click();
  await supportPage.getByText(/Request sent/).waitFor();

  for (const width of [1280, 390]) {
    const ownerContext = await newContext(width);
    const ownerPage = await signIn(ownerContext, owner.email, '/systems');
    if (width === 390) await ownerPage.getByRole('button', { name: 'Open navigation' }).click();
    await ownerPage.getByRole('link', { name: /Requests\s*1 waiting for you/ }).click();
    await ownerPage.getByText('Ticket 5120: charger question').waitFor();
    expect(await violations(ownerPage)).toEqual([]);
    if (width === 390)
      await ownerPage.getByRole('button', { name: `Approve ${support.email} for Lakeside cabin` }).click();
    if (width === 390) await ownerPage.getByText('Nobody is waiting for an answer from you.').waitFor();
    await ownerContext.close();
  }

  await supportPage.goto(`${node.baseUrl}/systems`);
  await supportPage.getByText('Lakeside cabin').first().waitFor();
  await supportPage.goto(`${node.baseUrl}/requests`);
  await supportPage.getByRole('cell', { name: 'Approved' }).waitFor();
  await supportContext.close();
}, 120000);
