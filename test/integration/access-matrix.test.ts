import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { addAccessFixture, FIXTURE_PASSWORD } from '../support/access-fixture';
import { openStream, signInAs, until } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// The access matrix: every system route and the stream subscription × each kind of person × own, company,
// granted, expired-grant, revoked-grant and unrelated systems. Expectations are written out by hand here (not
// derived from the policy module), so the test checks the policy rather than restating it.

type Action =
  'view' | 'export' | 'configure' | 'manage-devices' | 'manage-grants' | 'read-audit' | 'commission';
type SystemKey = 'van' | 'cabin' | 'boat';
const OWNER: Action[] = [
  'view',
  'export',
  'configure',
  'manage-devices',
  'manage-grants',
  'read-audit',
  'commission',
];
const FITTER: Action[] = ['view', 'export', 'configure', 'manage-devices', 'commission'];

const people: { email: string; password: string; allowed: Record<SystemKey, Action[]> }[] = [
  { email: demo.users[0].email, password: demo.password, allowed: { van: OWNER, cabin: OWNER, boat: [] } },
  { email: demo.users[1].email, password: demo.password, allowed: { van: FITTER, cabin: FITTER, boat: [] } },
  // The demo support person: the owner granted their company a view of the van only.
  {
    email: demo.users[2].email,
    password: demo.password,
    allowed: { van: ['view', 'export'], cabin: [], boat: [] },
  },
  {
    email: demo.users[3].email,
    password: demo.password,
    allowed: { van: ['view', 'export', 'read-audit'], cabin: ['view', 'export', 'read-audit'], boat: [] },
  },
  // Configure grant to the person on the cabin; their company's grant on the van expired an hour ago.
  {
    email: 'agent@saltmarsh.example',
    password: FIXTURE_PASSWORD,
    allowed: { van: [], cabin: ['view', 'export', 'configure'], boat: [] },
  },
  // Installer of the boat's company.
  {
    email: 'fitter@saltmarsh.example',
    password: FIXTURE_PASSWORD,
    allowed: { van: [], cabin: [], boat: FITTER },
  },
  // Their company's grant on the van was revoked.
  { email: 'agent@ridgeway.example', password: FIXTURE_PASSWORD, allowed: { van: [], cabin: [], boat: [] } },
  { email: 'skipper@boat.example', password: FIXTURE_PASSWORD, allowed: { van: [], cabin: [], boat: OWNER } },
];

let deviceSerial = 0;
const inADay = () => new Date(Date.now() + 24 * 3600_000).toISOString();
const routes: { name: string; action: Action; call: (base: string, systemId: string) => request.Test }[] = [
  { name: 'GET system', action: 'view', call: (b, id) => request(b).get(`/api/systems/${id}`) },
  { name: 'GET readings', action: 'view', call: (b, id) => request(b).get(`/api/systems/${id}/readings`) },
  { name: 'GET devices', action: 'view', call: (b, id) => request(b).get(`/api/systems/${id}/devices`) },
  {
    name: 'POST devices',
    action: 'manage-devices',
    call: (b, id) =>
      request(b)
        .post(`/api/systems/${id}/devices`)
        .send({ id: `matrix-${++deviceSerial}`, label: 'm' }),
  },
  {
    name: 'POST rotate',
    action: 'manage-devices',
    call: (b, id) => request(b).post(`/api/systems/${id}/devices/no-such-device/rotate`),
  },
  {
    name: 'GET grants',
    action: 'manage-grants',
    call: (b, id) => request(b).get(`/api/systems/${id}/grants`),
  },
  {
    name: 'POST grants',
    action: 'manage-grants',
    call: (b, id) =>
      request(b)
        .post(`/api/systems/${id}/grants`)
        .send({ granteeEmail: 'bystander@elsewhere.example', access: 'view', expiresAt: inADay() }),
  },
  { name: 'GET audit', action: 'read-audit', call: (b, id) => request(b).get(`/api/systems/${id}/audit`) },
  {
    name: 'GET monitor status',
    action: 'manage-devices',
    call: (b, id) => request(b).get(`/api/systems/${id}/devices/no-such-device/status`),
  },
  {
    name: 'POST share code',
    action: 'manage-grants',
    call: (b, id) => request(b).post(`/api/systems/${id}/share-codes`),
  },
  {
    name: 'GET access requests',
    action: 'manage-grants',
    call: (b, id) => request(b).get(`/api/systems/${id}/access-requests`),
  },
  {
    name: 'GET install register',
    action: 'view',
    call: (b, id) => request(b).get(`/api/systems/${id}/install`),
  },
  {
    name: 'GET install measured',
    action: 'view',
    call: (b, id) => request(b).get(`/api/systems/${id}/install/measured`),
  },
  {
    name: 'POST install component',
    action: 'configure',
    call: (b, id) =>
      request(b)
        .post(`/api/systems/${id}/install/components`)
        .send({
          name: 'Matrix fridge',
          ratings: { kind: 'fridge', watts: 40, hoursPerDay: 24, dutyCycle: 0.3, ac: false },
        }),
  },
];

/** What a route must answer when allowed: 404 for a device that does not exist is still "let in". */
const ALLOWED_STATUS: Record<string, number> = {
  'POST devices': 201,
  'POST grants': 201,
  'POST rotate': 404,
  'GET monitor status': 404,
  'POST share code': 201,
  'POST install component': 201,
};

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
let systems: Record<SystemKey, string>;

beforeAll(async () => {
  node = await startTestServer();
  systems = (await addAccessFixture(node.database)).systems;
});
afterAll(() => node.stop());

it('answers every route for every person as the access matrix says', async () => {
  const mismatches: string[] = [];
  let cases = 0;
  for (const person of people) {
    const { accessToken } = await signInAs(node.baseUrl, person.email, person.password);
    for (const key of Object.keys(systems) as SystemKey[]) {
      const allowed = person.allowed[key];
      for (const route of routes) {
        const expected = allowed.includes(route.action)
          ? (ALLOWED_STATUS[route.name] ?? 200)
          : allowed.includes('view')
            ? 403
            : 404;
        const response = await route
          .call(node.baseUrl, systems[key])
          .set('Authorization', `Bearer ${accessToken}`);
        cases++;
        if (response.status !== expected)
          mismatches.push(
            `${person.email} ${route.name} ${key}: expected ${expected}, got ${response.status}`,
          );
      }
      // The same person's system list shows exactly the systems they may view.
      const list = await request(node.baseUrl)
        .get('/api/systems')
        .set('Authorization', `Bearer ${accessToken}`);
      const listed = list.body.systems.some((s: { id: string }) => s.id === systems[key]);
      cases++;
      if (listed !== allowed.includes('view'))
        mismatches.push(`${person.email} list ${key}: listed=${listed}`);
    }
  }
  console.log(`access matrix: ${cases} HTTP cases, ${mismatches.length} mismatches`);
  expect(mismatches).toEqual([]);
});

it('subscribes each person on the live stream to exactly the systems they may view', async () => {
  let cases = 0;
  for (const person of people) {
    const { accessToken } = await signInAs(node.baseUrl, person.email, person.password);
    const stream = openStream(node.server.httpPort, accessToken);
    await stream.opened;
    stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds: Object.values(systems) }));
    await until(() => stream.messages.some((m) => m.type === 'subscribed'));
    const subscribed = stream.messages.find((m) => m.type === 'subscribed');
    const expected = (Object.keys(systems) as SystemKey[]).filter((k) => person.allowed[k].includes('view'));
    expect(subscribed && 'systemIds' in subscribed ? [...subscribed.systemIds].sort() : null).toEqual(
      expected.map((k) => systems[k]).sort(),
    );
    cases += 3;
    stream.socket.close();
  }
  console.log(`access matrix: ${cases} stream subscription cases`);
});

it('ends access at once, on the API and the live stream, when the owner revokes a grant', async () => {
  const owner = await signInAs(node.baseUrl, demo.users[0].email, demo.password);
  const support = await signInAs(node.baseUrl, demo.users[2].email, demo.password);
  const stream = openStream(node.server.httpPort, support.accessToken);
  await stream.opened;
  stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds: [systems.van] }));
  await until(() => stream.messages.some((m) => m.type === 'subscribed'));

  const grants = await request(node.baseUrl)
    .get(`/api/systems/${systems.van}/grants`)
    .set('Authorization', `Bearer ${owner.accessToken}`);
  const companyGrant = grants.body.grants.find(
    (g: { active: boolean; granteeCompany: { name: string } | null }) =>
      g.active && g.granteeCompany?.name === 'Kestrel Hollow Vanfitters',
  );
  const revoke = await request(node.baseUrl)
    .delete(`/api/systems/${systems.van}/grants/${companyGrant.id}`)
    .set('Authorization', `Bearer ${owner.accessToken}`);
  expect(revoke.status).toBe(204);

  await until(() => stream.messages.some((m) => m.type === 'access-ended'));
  expect(stream.messages.find((m) => m.type === 'access-ended')).toEqual({
    type: 'access-ended',
    systemIds: [systems.van],
  });
  const after = await request(node.baseUrl)
    .get(`/api/systems/${systems.van}`)
    .set('Authorization', `Bearer ${support.accessToken}`);
  expect(after.status).toBe(404);
  const audit = await request(node.baseUrl)
    .get(`/api/systems/${systems.van}/audit`)
    .set('Authorization', `Bearer ${owner.accessToken}`);
  expect(audit.body.entries.map((e: { action: string }) => e.action)).toContain('grant.revoked');
  stream.socket.close();
});
