import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let node: TestServer;

const [owner, installer, support] = demo.users;

async function signIn(email: string): Promise<string> {
  const response = await request(node.baseUrl)
    .post('/api/auth/sign-in')
    .send({ email, password: demo.password });
  expect(response.status).toBe(200);
  return response.body.accessToken;
}

beforeAll(async () => {
  node = await startTestServer();
});
afterAll(async () => {
  await node.stop();
});

describe('sign-in', () => {
  it('issues an access token and the user for a correct e-mail and password', async () => {
    const response = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: owner.email.toUpperCase(), password: demo.password });
    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({ email: owner.email, roles: ['owner'] });
    const me = await request(node.baseUrl)
      .get('/api/auth/me')
      .set('Authorization', `Bearer ${response.body.accessToken}`);
    expect(me.body.user.email).toBe(owner.email);
  });

  it('refuses a wrong password without saying whether the e-mail exists', async () => {
    const wrong = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: owner.email, password: 'nope' });
    const unknown = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@owner.example', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('names the bad field of a malformed body', async () => {
    const response = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: 'not-an-address', password: 'x' });
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ code: 'invalid_input', field: 'email' });
  });

  it('answers malformed JSON with a clear error and keeps serving', async () => {
    const response = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email":');
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('malformed_json');
    expect((await request(node.baseUrl).get('/api/health')).status).toBe(200);
  });

  it('refuses a token signed with another algorithm or secret', async () => {
    const token = await signIn(owner.email);
    const [header, payload] = token.split('.');
    const unsigned = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${payload}.`;
    for (const forged of [unsigned, `${header}.${payload}.AAAA`]) {
      const response = await request(node.baseUrl)
        .get('/api/systems')
        .set('Authorization', `Bearer ${forged}`);
      expect(response.status).toBe(401);
    }
  });
});

describe('systems', () => {
  it('requires sign-in', async () => {
    const response = await request(node.baseUrl).get('/api/systems');
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('not_authenticated');
  });

  it("lists the owner's van and cabin", async () => {
    const response = await request(node.baseUrl)
      .get('/api/systems')
      .set('Authorization', `Bearer ${await signIn(owner.email)}`);
    expect(response.body.systems.map((s: { kind: string }) => s.kind).sort()).toEqual(['cabin', 'van']);
  });

  it("lists the installer company's systems for its installer", async () => {
    const response = await request(node.baseUrl)
      .get('/api/systems')
      .set('Authorization', `Bearer ${await signIn(installer.email)}`);
    expect(response.body.systems).toHaveLength(2);
  });

  it('shows support staff only the system the owner granted their company, and hides the other behind 404', async () => {
    const ownerToken = await signIn(owner.email);
    const systems = (
      await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${ownerToken}`)
    ).body.systems as { id: string; kind: string }[];
    const cabin = systems.find((s) => s.kind === 'cabin')!;
    const supportToken = await signIn(support.email);
    const list = await request(node.baseUrl)
      .get('/api/systems')
      .set('Authorization', `Bearer ${supportToken}`);
    expect(list.body.systems.map((s: { kind: string }) => s.kind)).toEqual(['van']);
    const one = await request(node.baseUrl)
      .get(`/api/systems/${cabin.id}`)
      .set('Authorization', `Bearer ${supportToken}`);
    expect(one.status).toBe(404);
  });
});
