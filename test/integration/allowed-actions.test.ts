import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

// A system read through GET /api/systems/:id carries what the asking person may do with it, as the access
// rule decides, so the dashboard shows a form read-only before anyone tries (and never guesses from roles).

let node: Awaited<ReturnType<typeof startTestServer>>;
const systemIds: Record<string, string> = {};

beforeAll(async () => {
  node = await startTestServer();
  const owner = await signInAs(node.baseUrl, demo.users[0].email, demo.password);
  const list = await request(node.baseUrl)
    .get('/api/systems')
    .set('Authorization', `Bearer ${owner.accessToken}`);
  for (const system of list.body.systems as { id: string; kind: string }[])
    systemIds[system.kind] = system.id;
});
afterAll(async () => {
  await node.stop();
});

async function actionsOf(userIndex: number, kind: string) {
  const { accessToken } = await signInAs(node.baseUrl, demo.users[userIndex].email, demo.password);
  const response = await request(node.baseUrl)
    .get(`/api/systems/${systemIds[kind]}`)
    .set('Authorization', `Bearer ${accessToken}`);
  return { status: response.status, actions: response.body.system?.allowedActions as string[] | undefined };
}

it('names every action for the owner, the fitting rights for the installer and view and export for support', async () => {
  // Owner: everything (access-policy.ts OWNER_ACTIONS).
  expect(await actionsOf(0, 'van')).toEqual({
    status: 200,
    actions: ['view', 'export', 'configure', 'manage-devices', 'manage-grants', 'read-audit', 'commission'],
  });
  // The installer company's installer fits and configures, but neither grants access nor reads the audit.
  expect((await actionsOf(1, 'cabin')).actions).toEqual([
    'view',
    'export',
    'configure',
    'manage-devices',
    'commission',
  ]);
  // Support sees the van through the owner's view grant to its company, and nothing of the cabin.
  expect((await actionsOf(2, 'van')).actions).toEqual(['view', 'export']);
  expect((await actionsOf(2, 'cabin')).status).toBe(404);
  // The company admin reads the system and its audit.
  expect((await actionsOf(3, 'van')).actions).toEqual(['view', 'export', 'read-audit']);
});
