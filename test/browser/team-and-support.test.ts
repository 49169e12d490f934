import type { Page } from 'playwright-core';
import demo from '../../db/seeders/demo-sign-ins.json';
import { ownerSystems, startBrowserNode } from './browser-node';

// The company admin's team screen in real Chromium: an invitation to a support person (one role, chosen
// explicitly) is accepted through the link in the mail; the newcomer sees only the system an owner shared with
// the company; another invitation is withdrawn and its link stops working; removing the newcomer ends their
// open session at once.

let harness: Awaited<ReturnType<typeof startBrowserNode>>;
let systems: Record<string, { id: string; name: string }>;
const admin = demo.users[3];
const NEWCOMER = 'piet.ruiter@fitters.example';
const CHANGED_MIND = 'not.after.all@fitters.example';

beforeAll(async () => {
  harness = await startBrowserNode();
  systems = await ownerSystems(harness.node.baseUrl);
}, 60_000);
afterAll(async () => {
  await harness?.chromium.close();
  await harness?.node.stop();
});

async function signIn(page: Page, email: string, path: string) {
  await page.goto(`${harness.node.baseUrl}/sign-in?returnUrl=${encodeURIComponent(path)}`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demo.password);
  await page.keyboard.press('Enter');
  await page.waitForURL((url) => url.pathname === path);
}

/**
 * Picks a role in the invite form. The select's panel animates closed after a choice; a click that lands while
 * it is still closing would toggle it shut, so each step waits for the panel to be gone first.
 */
async function chooseRole(page: Page, role: string) {
  const listbox = page.getByRole('listbox');
  await listbox.waitFor({ state: 'detached' });
  await page.getByRole('form', { name: 'Invite someone' }).getByRole('combobox', { name: 'Role' }).click();
  await page.getByRole('option', { name: role, exact: true }).click();
  await listbox.waitFor({ state: 'detached' });
}

async function invite(page: Page, email: string, role: string) {
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('E-mail').fill(email);
  await chooseRole(page, role);
  await form.getByRole('button', { name: 'Send invitation' }).click();
  await page.getByText(`Invitation sent to ${email}.`).waitFor();
}

/** The invitation link in the mail the catcher holds for `email`. */
async function invitationLink(email: string): Promise<string> {
  const mail = await harness.node.server.mailCatcher!.waitFor((m) => m.to.includes(email), 10_000);
  const path = /\/invitation\/[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
  if (!path) throw new Error(`no invitation link in the mail to ${email}`);
  return `${harness.node.baseUrl}${path}`;
}

it('invites a support person who sees only the shared system, withdraws another, and removal ends the session', async () => {
  const adminPage = await harness.chromium.browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signIn(adminPage, admin.email, '/team');
  // Each role says what it lets the person see before it is chosen.
  await chooseRole(adminPage, 'Support');
  await adminPage.getByText(/Sees only the systems an owner has shared/).waitFor();
  await invite(adminPage, NEWCOMER, 'Support');
  await invite(adminPage, CHANGED_MIND, 'Installer');

  // The newcomer accepts through the link in the mail, in their own browser.
  const newcomerContext = await harness.chromium.browser.newContext({
    viewport: { width: 390, height: 844 },
  });
  const newcomer = await newcomerContext.newPage();
  await newcomer.goto(await invitationLink(NEWCOMER));
  await newcomer.getByTestId('invitation-summary').getByText('Support').waitFor();
  await newcomer.getByLabel('Display name').fill('Piet Ruiter');
  await newcomer.getByLabel('Password', { exact: true }).fill('a long enough passphrase');
  await newcomer.getByLabel('Repeat the password').fill('a long enough passphrase');
  await newcomer.getByRole('button', { name: 'Accept and sign in' }).click();
  await newcomer.waitForURL((url) => url.pathname === '/systems');
  // The owner shared the van with the company's support desk; the cabin stays private.
  await newcomer.getByText(systems.van.name).first().waitFor();
  await expect(newcomer.getByText(systems.cabin.name).count()).resolves.toBe(0);

  // The admin withdraws the second invitation: its link now says so instead of offering the form.
  const withdrawLink = await invitationLink(CHANGED_MIND);
  await adminPage.reload();
  await adminPage.getByRole('button', { name: `Withdraw the invitation to ${CHANGED_MIND}` }).click();
  await adminPage
    .getByText(`The invitation to ${CHANGED_MIND} was withdrawn; its link no longer works.`)
    .waitFor();
  const latecomer = await newcomerContext.newPage();
  await latecomer.goto(withdrawLink);
  await latecomer.getByRole('alert').waitFor();
  await expect(latecomer.getByRole('button', { name: 'Accept and sign in' }).count()).resolves.toBe(0);
  await latecomer.close();

  // Removing the newcomer ends their session: their next step lands on the sign-in page.
  await adminPage.reload();
  await adminPage.getByRole('button', { name: 'Remove Piet Ruiter' }).click();
  await adminPage.getByRole('button', { name: 'Remove Piet Ruiter now' }).click();
  await adminPage.getByText('Piet Ruiter was removed; their sign-ins have ended.').waitFor();
  await newcomer.reload();
  await newcomer.waitForURL((url) => url.pathname === '/sign-in', { timeout: 15_000 });
  await newcomerContext.close();
  await adminPage.close();
}, 90_000);
