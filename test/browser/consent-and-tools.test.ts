import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';

// Real Chromium against a real node: the owner's consent screen and the installer's wire and fuse check,
// at phone width, driven by the keyboard and labels a person would use.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
let chromium: Awaited<ReturnType<typeof launchChromium>>;
let vanId: string;

beforeAll(async () => {
  node = await startTestServer({ webDist: join(__dirname, '..', '..', 'dist', 'web', 'browser') });
  chromium = await launchChromium();
  const signIn = await request(node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: demo.users[0].email, password: demo.password });
  const systems = await request(node.baseUrl)
    .get('/api/systems')
    .set('Authorization', `Bearer ${signIn.body.accessToken}`);
  vanId = systems.body.systems.find((s: { kind: string }) => s.kind === 'van').id;
}, 60000);
afterAll(async () => {
  await chromium?.close();
  await node?.stop();
});

async function signedIn(browser: Browser, email: string, path: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 375, height: 800 } });
  await page.goto(`${node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(path)}`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  if (!page.url().endsWith(path)) await page.goto(`${node.baseUrl}${path}`);
  return page;
}

it("lets the owner revoke the support desk's grant, after which the support person no longer finds the van", async () => {
  const support = await signedIn(chromium.browser, demo.users[2].email, '/systems');
  await support.getByText('Winter van').first().waitFor();

  const owner = await signedIn(chromium.browser, demo.users[0].email, `/systems/${vanId}/access`);
  await owner.getByRole('button', { name: 'Revoke access of Kestrel Hollow Vanfitters' }).click();
  await owner.getByRole('dialog').getByRole('button', { name: 'Revoke' }).click();
  await owner
    .getByText(/revoked/i)
    .first()
    .waitFor();

  await support.reload();
  await support.getByRole('main').waitFor();
  await expect(support.getByText('Winter van').count()).resolves.toBe(0);
  await owner.close();
  await support.close();
});

it('checks a 60 A charger run on 4 AWG with a 100 A fuse and shows the verdict and the cautions', async () => {
  const page = await signedIn(chromium.browser, demo.users[1].email, '/installer');
  await page.getByText('Before you cut cable').waitFor();
  await page.getByLabel('Continuous current').fill('60');
  await page.getByLabel('Run length, one way').fill('2');
  await page.getByLabel('Proposed gauge (optional)').click();
  await page.getByRole('option', { name: '4 AWG', exact: true }).click();
  await page.getByLabel('Proposed fuse (optional)').fill('100');
  const result = page.getByRole('region', { name: 'Wire and fuse result' });
  // 60 A on 4 AWG, 2 m one way at 12 V: 0.196 V, 1.63 % (worked by hand from IEC 60028 copper resistivity).
  await result.getByText(/0\.2\d V \(1\.6\d? %\)/).waitFor();
  await result.getByText('This wire and fuse pair passes').waitFor();
  await page.close();
});
