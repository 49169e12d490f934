import { QueryTypes } from 'sequelize';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { addAccessFixture, FIXTURE_PASSWORD } from '../support/access-fixture';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// Support people asking owners for access: by the owner's address and the system's name, or by a share
// code read out on the phone; the owner approves (an ordinary grant) or declines; nothing tells the
// requester whether an address or a system exists.

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let systems: { van: string; cabin: string; boat: string };
let owner: string;
let agent: string; // Ridgeway's support agent: no access to anything of the demo owner's
let deskAgent: string; // Saltmarsh's support agent
const ownerEmail = demo.users[0].email;
let vanName: string;

const api = (token: string) => ({
  get: (path: string) => request(node.baseUrl).get(path).set('Authorization', `Bearer ${token}`),
  post: (path: string, body: object = {}) =>
    request(node.baseUrl).post(path).set('Authorization', `Bearer ${token}`).send(body),
});
const auditActions = async (systemId: string) =>
  (
    await node.database.query<{ action: string }>(
      `SELECT action FROM audit_entries WHERE system_id = :systemId ORDER BY id`,
      { replacements: { systemId }, type: QueryTypes.SELECT },
    )
  ).map((row) => row.action);
const inDays = (days: number) => new Date(Date.now() + days * 24 * 3600_000).toISOString();
const sees = async (token: string, systemId: string) =>
  (await api(token).get('/api/systems')).body.systems.some((s: { id: string }) => s.id === systemId);

beforeAll(async () => {
  node = await startTestServer();
  systems = (await addAccessFixture(node.database)).systems;
  [{ name: vanName }] = await node.database.query<{ name: string }>(
    `SELECT name FROM systems WHERE id = :id`,
    {
      replacements: { id: systems.van },
      type: QueryTypes.SELECT,
    },
  );
  owner = (await signInAs(node.baseUrl, ownerEmail, demo.password)).accessToken;
  agent = (await signInAs(node.baseUrl, 'agent@ridgeway.example', FIXTURE_PASSWORD)).accessToken;
  deskAgent = (await signInAs(node.baseUrl, 'agent@saltmarsh.example', FIXTURE_PASSWORD)).accessToken;
});
afterAll(() => node.stop());

it('lets a support person ask by address and name, the owner approve, and the system appear for them', async () => {
  expect(await sees(agent, systems.van)).toBe(false);
  const asked = await api(agent).post('/api/access-requests', {
    ownerEmail: ownerEmail.toUpperCase(),
    systemName: ` ${vanName.toLowerCase()} `,
    note: 'Ticket 4411: fridge cuts out at night',
  });
  expect(asked.status).toBe(202);
  expect(asked.body.request).toMatchObject({ via: 'owner-and-name', state: 'pending' });
  const mail = await node.server.mailCatcher!.waitFor(
    (m) => m.to.includes(ownerEmail) && /Access request/.test(m.subject),
    5000,
  );
  expect(mail.text).toContain('Ticket 4411');

  const incoming = (await api(owner).get('/api/access-requests/incoming')).body.requests;
  expect(incoming).toHaveLength(1);
  expect(incoming[0]).toMatchObject({
    systemId: systems.van,
    requester: { email: 'agent@ridgeway.example', companyName: 'Ridgeway Help Line' },
  });
  expect((await api(owner).get(`/api/systems/${systems.van}/access-requests`)).body.requests).toHaveLength(1);
  // Nobody but the owner can answer, and the requester learns nothing from trying.
  expect(
    (
      await api(agent).post(`/api/access-requests/${incoming[0].id}/approve`, {
        access: 'configure',
        expiresAt: inDays(7),
      })
    ).status,
  ).toBe(404);

  const approved = await api(owner).post(`/api/access-requests/${incoming[0].id}/approve`, {
    access: 'view',
    expiresAt: inDays(2),
  });
  expect(approved.status).toBe(200);
  expect(approved.body.grant).toMatchObject({ access: 'view', active: true });
  expect(await sees(agent, systems.van)).toBe(true);
  expect((await api(agent).get('/api/access-requests/outgoing')).body.requests[0].state).toBe('approved');
  expect(await auditActions(systems.van)).toEqual(
    expect.arrayContaining(['access.requested', 'grant.created', 'access.approved']),
  );
  // Answered once: a second approval makes no second grant.
  expect(
    (
      await api(owner).post(`/api/access-requests/${incoming[0].id}/approve`, {
        access: 'view',
        expiresAt: inDays(2),
      })
    ).status,
  ).toBe(404);

  // The grant is an ordinary one: revoking it ends the view.
  await request(node.baseUrl)
    .delete(`/api/systems/${systems.van}/grants/${approved.body.grant.id}`)
    .set('Authorization', `Bearer ${owner}`)
    .expect(204);
  expect(await sees(agent, systems.van)).toBe(false);
});

it('answers the same for an address or a system that does not exist, and mails nobody', async () => {
  node.server.mailCatcher!.clear();
  const answers = await Promise.all(
    [
      { ownerEmail: 'no-such-owner@nowhere.example', systemName: vanName },
      { ownerEmail, systemName: 'A system Ilse does not have' },
    ].map((body) => api(agent).post('/api/access-requests', body)),
  );
  const real = await api(agent).post('/api/access-requests', { ownerEmail, systemName: 'Lakeside cabin' });
  const shape = (r: request.Response) => ({
    status: r.status,
    keys: Object.keys(r.body.request).sort(),
    state: r.body.request.state,
  });
  for (const answer of answers) expect(shape(answer)).toEqual(shape(real));
  const outgoing = (await api(agent).get('/api/access-requests/outgoing')).body.requests;
  expect(outgoing.filter((r: { state: string }) => r.state === 'pending')).toHaveLength(3);
  await node.server.mailCatcher!.waitFor((m) => /Lakeside cabin/.test(m.subject), 5000);
  expect(node.server.mailCatcher!.messages()).toHaveLength(1);
});

it('lets the owner decline: no grant, the requester sees it declined, the audit has it', async () => {
  const pending = (await api(owner).get(`/api/systems/${systems.cabin}/access-requests`)).body.requests;
  const mine = pending.find(
    (r: { requester: { email: string } }) => r.requester.email === 'agent@ridgeway.example',
  );
  expect((await api(owner).post(`/api/access-requests/${mine.id}/decline`)).status).toBe(204);
  expect(await sees(agent, systems.cabin)).toBe(false);
  const outgoing = (await api(agent).get('/api/access-requests/outgoing')).body.requests;
  expect(outgoing.find((r: { systemName: string }) => r.systemName === 'Lakeside cabin').state).toBe(
    'declined',
  );
  expect(await auditActions(systems.cabin)).toContain('access.declined');
  expect(
    (
      await api(owner).post(`/api/access-requests/${mine.id}/approve`, {
        access: 'view',
        expiresAt: inDays(1),
      })
    ).status,
  ).toBe(404);
});

it('takes a share code once, within its lifetime, and a new code ends the old one', async () => {
  const made = await api(owner).post(`/api/systems/${systems.van}/share-codes`);
  expect(made.status).toBe(201);
  expect(made.body.code).toMatch(/^[0-9A-HJKMNP-TV-Z]{4}-[0-9A-HJKMNP-TV-Z]{4}$/);
  // Crockford base32, so a code read out over the phone is typed the way it is heard.
  const typed = made.body.code.toLowerCase().replace('-', ' ');
  const used = await api(deskAgent).post('/api/access-requests', { shareCode: typed });
  expect([used.status, used.body.request.via]).toEqual([202, 'share-code']);
  const again = await api(agent).post('/api/access-requests', { shareCode: made.body.code });
  expect([again.status, again.body.error.code, again.body.error.field]).toEqual([
    422,
    'share_code_invalid',
    'shareCode',
  ]);
  expect(
    (await api(owner).get(`/api/systems/${systems.van}/access-requests`)).body.requests.map(
      (r: { via: string; requester: { email: string } }) => [r.via, r.requester.email],
    ),
  ).toContainEqual(['share-code', 'agent@saltmarsh.example']);

  const first = (await api(owner).post(`/api/systems/${systems.van}/share-codes`)).body.code;
  const second = (await api(owner).post(`/api/systems/${systems.van}/share-codes`)).body.code;
  expect((await api(agent).post('/api/access-requests', { shareCode: first })).status).toBe(422);
  await node.database.query(
    `UPDATE access_share_codes SET expires_at = now() - interval '1 second' WHERE used_at IS NULL`,
  );
  expect((await api(agent).post('/api/access-requests', { shareCode: second })).status).toBe(422);
  expect(await auditActions(systems.van)).toContain('share-code.created');
});

it('stops a person after five wrong codes, even a right one', async () => {
  const fresh = (await signInAs(node.baseUrl, demo.users[2].email, demo.password)).accessToken;
  for (let i = 0; i < 5; i++)
    expect((await api(fresh).post('/api/access-requests', { shareCode: `0000-000${i}` })).status).toBe(422);
  const right = (await api(owner).post(`/api/systems/${systems.cabin}/share-codes`)).body.code;
  const stopped = await api(fresh).post('/api/access-requests', { shareCode: right });
  expect([stopped.status, stopped.body.error.code]).toEqual([429, 'share_code_attempts']);
  // The right code was not spent by the refused attempt: someone else may still use it.
  expect((await api(agent).post('/api/access-requests', { shareCode: right })).status).toBe(202);
});

it('lets requests lapse: the owner no longer sees them and cannot answer them', async () => {
  await api(agent).post('/api/access-requests', { ownerEmail, systemName: vanName });
  await node.database.query(
    `UPDATE access_requests SET expires_at = now() - interval '1 second' WHERE decision IS NULL`,
  );
  expect((await api(owner).get('/api/access-requests/incoming')).body.requests).toEqual([]);
  const outgoing = (await api(agent).get('/api/access-requests/outgoing')).body.requests;
  expect(outgoing.filter((r: { state: string }) => r.state === 'pending')).toEqual([]);
  expect(outgoing.some((r: { state: string }) => r.state === 'expired')).toBe(true);
});

it('refuses people who are not support staff, and names the wrong field', async () => {
  expect((await api(owner).post('/api/access-requests', { ownerEmail, systemName: vanName })).status).toBe(
    403,
  );
  const noName = await api(agent).post('/api/access-requests', { ownerEmail });
  expect([noName.status, noName.body.error.field]).toEqual([400, 'systemName']);
  const badCode = await api(agent).post('/api/access-requests', { shareCode: 'ABC' });
  expect([badCode.status, badCode.body.error.field]).toEqual([400, 'shareCode']);
  const badMail = await api(agent).post('/api/access-requests', { ownerEmail: 'x', systemName: 'y' });
  expect([badMail.status, badMail.body.error.field]).toEqual([400, 'ownerEmail']);
  await api(agent).post('/api/access-requests', { ownerEmail, systemName: vanName });
  const [pending] = (await api(owner).get('/api/access-requests/incoming')).body.requests;
  const past = await api(owner).post(`/api/access-requests/${pending.id}/approve`, {
    access: 'view',
    expiresAt: new Date(Date.now() - 60_000).toISOString(),
  });
  expect([past.status, past.body.error.field]).toEqual([400, 'expiresAt']);
  const scope = await api(owner).post(`/api/access-requests/${pending.id}/approve`, {
    access: 'all',
    expiresAt: inDays(1),
  });
  expect([scope.status, scope.body.error.field]).toEqual([400, 'access']);
  expect((await api(owner).post('/api/access-requests/not-an-id/decline')).status).toBe(404);
});
