import { join } from 'node:path';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';

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

it('signs a demo owner in and shows the shell with their systems, loading nothing from another origin', async () => {
  const page = await chromium.browser.newPage({ viewport: { width: 375, height: 740 } });
  const foreignRequests: string[] = [];
  page.on('request', (req) => {
    if (!req.url().startsWith(node.baseUrl) && !req.url().startsWith('data:'))
      foreignRequests.push(req.url());
  });
  await page.goto(node.baseUrl);
  await page.waitForURL(/sign-in/);
  await page.getByLabel('E-mail').fill(demo.users[0].email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('main').getByText('Lakeside cabin').waitFor();
  await expect(
    page.getByRole('toolbar').or(page.locator('mat-toolbar')).first().textContent(),
  ).resolves.toContain('Cellwarden');
  expect(foreignRequests).toEqual([]);
  await page.close();
});

it('tells the person which field is wrong when the password is missing', async () => {
  const page = await chromium.browser.newPage();
  await page.goto(`${node.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(demo.users[0].email);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(
    page
      .getByText(/password/i)
      .first()
      .isVisible(),
  ).resolves.toBe(true);
  expect(page.url()).toContain('/sign-in');
  await page.close();
});
