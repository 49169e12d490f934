import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

jest.setTimeout(120000);

// The local mail catcher stands in for an SMTP service: through the product each person sees only the
// captured mail addressed to them. A company admin who could read everyone's would hold every reset link.

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;
const [owner, installer] = demo.users;
const ADMIN = 'admin@fitters.example';

beforeAll(async () => {
  node = await startTestServer();
});
afterAll(() => node.stop());

const outbox = (token: string) =>
  request(node.baseUrl).get('/api/dev/mail').set('Authorization', `Bearer ${token}`);
const resetLink = /\/password-reset\/([A-Za-z0-9_-]+)/;

it("shows a company admin neither the owner's nor a member's reset mail, and each person their own", async () => {
  for (const person of [owner, installer])
    await request(node.baseUrl).post('/api/auth/password-reset/request').send({ email: person.email });
  const resets = await Promise.all(
    [owner, installer].map((person) =>
      node.server.mailCatcher!.waitFor((m) => m.to.includes(person.email) && resetLink.test(m.text), 10000),
    ),
  );

  const admin = await signInAs(node.baseUrl, ADMIN, demo.password);
  const adminView = await outbox(admin.accessToken);
  const adminText = JSON.stringify(adminView.body);
  console.log(
    `mail-privacy: admin sees ${adminView.body.messages?.length} message(s) of ${node.server.mailCatcher!.messages().length} captured`,
  );
  expect(adminView.status).toBe(200);
  expect(adminView.body.catcher).toBe(true);
  // No message to anyone else, and not a trace of either reset link.
  expect(adminView.body.messages.flatMap((m: { to: string[] }) => m.to)).toEqual(
    adminView.body.messages.map(() => ADMIN),
  );
  expect(resets.map((mail) => adminText.includes(resetLink.exec(mail.text)![1]))).toEqual([false, false]);

  const ownerSession = await signInAs(node.baseUrl, owner.email, demo.password);
  const ownerView = await outbox(ownerSession.accessToken);
  expect(ownerView.body.messages.map((m: { id: string }) => m.id)).toContain(resets[0].id);
  expect(ownerView.body.messages.map((m: { id: string }) => m.id)).not.toContain(resets[1].id);
  expect(ownerView.body.messages.every((m: { to: string[] }) => m.to.join() === owner.email)).toBe(true);
});

it('needs a sign-in', async () => {
  expect((await request(node.baseUrl).get('/api/dev/mail')).status).toBe(401);
});
