import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';

// The local mail catcher's copy of a person's own mail, in real Chromium: reached from the navigation
// with the keyboard, showing the owner their reset mail and the company admin nobody else's.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
const [owner, installer] = demo.users;

beforeAll(async () => {
  node = await startTestServer({ webDist: join(__dirname, '..', '..', 'dist', 'web', 'browser') });
  chromium = await launchChromium();
  for (const person of [owner, installer]) {
    await request(node.baseUrl).post('/api/auth/password-reset/request').send({ email: person.email });
    await node.server.mailCatcher!.waitFor((m) => m.to.includes(person.email), 10000);
  }
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function openOwnMail(browser: Browser, email: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await page.goto(`${node.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  const link = page.getByRole('link', { name: 'Your mail (local copy)' });
  await link.focus();
  await page.keyboard.press('Enter');
  await page.getByRole('heading', { name: 'Your mail, local copy' }).waitFor();
  return page;
}

it("shows the owner their own reset mail and not the installer's", async () => {
  const page = await openOwnMail(chromium.browser, owner.email);
  await page.getByText(`Messages to ${owner.email}`).waitFor();
  await expect(page.getByText('Reset your Cellwarden password').count()).resolves.toBe(1);
  await expect(page.getByText(installer.email).count()).resolves.toBe(0);
  await page.close();
});

it("shows a company admin none of the company's or the owner's mail", async () => {
  const page = await openOwnMail(chromium.browser, 'admin@fitters.example');
  await page.getByText('No mail to you captured yet.').waitFor();
  await expect(page.getByText('Reset your Cellwarden password').count()).resolves.toBe(0);
  await page.close();
});
