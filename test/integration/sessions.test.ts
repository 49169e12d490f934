import jwt from 'jsonwebtoken';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { openStream, signInAs } from '../support/http-session';
import { startTestServer } from '../support/test-server';

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
const [owner, , , admin] = demo.users;

beforeAll(async () => {
  node = await startTestServer({ env: { SIGN_IN_LIMIT_PER_ACCOUNT: '5' } });
});
afterAll(() => node.stop());

const refresh = (cookie: string) => request(node.baseUrl).post('/api/auth/refresh').set('Cookie', cookie);
const cookieOf = (response: request.Response) =>
  ([] as string[]).concat(response.headers['set-cookie'] ?? []).find((c) => c.startsWith('cw_refresh='))!;

describe('refresh tokens', () => {
  it('sets the refresh token as an httpOnly, SameSite=Strict cookie scoped to the session routes', async () => {
    const response = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: owner.email, password: demo.password });
    expect(cookieOf(response)).toMatch(/HttpOnly/);
    expect(cookieOf(response)).toMatch(/SameSite=Strict/);
    expect(cookieOf(response)).toMatch(/Path=\/api\/auth/);
    expect(JSON.stringify(response.body)).not.toContain(cookieOf(response).split(';')[0].split('=')[1]);
  });

  it('rotates on every refresh, and a reused token ends the whole sign-in', async () => {
    const first = await signInAs(node.baseUrl, owner.email, demo.password);
    const second = await refresh(first.cookie);
    expect(second.status).toBe(200);
    expect(second.body.user.email).toBe(owner.email);
    const secondCookie = cookieOf(second).split(';')[0];
    expect(secondCookie).not.toBe(first.cookie);
    // The first token again: someone copied it. Both it and its successor stop working.
    expect((await refresh(first.cookie)).status).toBe(401);
    expect((await refresh(secondCookie)).status).toBe(401);
  });

  it('signs out by revoking the refresh token', async () => {
    const session = await signInAs(node.baseUrl, owner.email, demo.password);
    const out = await request(node.baseUrl).post('/api/auth/sign-out').set('Cookie', session.cookie);
    expect(out.status).toBe(204);
    expect((await refresh(session.cookie)).status).toBe(401);
  });

  it('answers a refresh without a cookie with 401', async () => {
    expect((await request(node.baseUrl).post('/api/auth/refresh')).status).toBe(401);
  });
});

describe('tampered access tokens', () => {
  it('gets 401 on every route and at the stream upgrade', async () => {
    const session = await signInAs(node.baseUrl, owner.email, demo.password);
    const [header, payload, signature] = session.accessToken.split('.');
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString());
    const other = await signInAs(node.baseUrl, admin.email, demo.password);
    const edited = Buffer.from(
      JSON.stringify({ ...claims, sub: other.body.user.id, roles: ['admin'] }),
    ).toString('base64url');
    const forged = {
      'alg none': `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${payload}.`,
      'edited payload': `${header}.${edited}.${signature}`,
      'wrong key': jwt.sign({ roles: ['owner'] }, 'another-secret-of-at-least-32-characters!', {
        algorithm: 'HS256',
        subject: claims.sub,
        audience: 'cellwarden',
      }),
      expired: jwt.sign(
        { roles: ['owner'], exp: Math.floor(Date.now() / 1000) - 60 },
        node.config.JWT_SECRET,
        {
          algorithm: 'HS256',
          subject: claims.sub,
          audience: 'cellwarden',
        },
      ),
      'other audience': jwt.sign({ roles: ['owner'] }, node.config.JWT_SECRET, {
        algorithm: 'HS256',
        subject: claims.sub,
        audience: 'somebody-else',
      }),
      'HS512 with our key': jwt.sign({ roles: ['owner'] }, node.config.JWT_SECRET, {
        algorithm: 'HS512',
        subject: claims.sub,
        audience: 'cellwarden',
      }),
    };
    const systems = (
      await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${session.accessToken}`)
    ).body.systems as { id: string }[];
    const paths = [
      '/api/auth/me',
      '/api/systems',
      `/api/systems/${systems[0].id}`,
      `/api/systems/${systems[0].id}/readings`,
      `/api/systems/${systems[0].id}/grants`,
      `/api/systems/${systems[0].id}/devices`,
      `/api/systems/${systems[0].id}/audit`,
      '/api/grants/received',
      '/api/companies',
      '/api/company/members',
    ];
    let cases = 0;
    for (const [name, token] of Object.entries(forged)) {
      for (const path of paths) {
        const response = await request(node.baseUrl).get(path).set('Authorization', `Bearer ${token}`);
        expect({ name, path, status: response.status }).toEqual({ name, path, status: 401 });
        cases++;
      }
      await expect(openStream(node.server.httpPort, token).opened).rejects.toThrow(/401/);
      cases++;
    }
    console.log(`tampered tokens: ${cases} cases refused`);
  });
});

describe('brute force', () => {
  it('locks sign-in for an account after repeated failures, without touching other accounts', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++)
      statuses.push(
        (
          await request(node.baseUrl)
            .post('/api/auth/sign-in')
            .send({ email: demo.users[1].email, password: `guess-${i}` })
        ).status,
      );
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses[5]).toBe(429);
    const rightPassword = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: demo.users[1].email, password: demo.password });
    expect(rightPassword.status).toBe(429);
    expect(rightPassword.body.error.code).toBe('too_many_attempts');
    expect(
      (
        await request(node.baseUrl)
          .post('/api/auth/sign-in')
          .send({ email: owner.email, password: demo.password })
      ).status,
    ).toBe(200);
  });
});

describe('invitations', () => {
  it('invites by e-mail; the link works once and never after it expires', async () => {
    const adminSession = await signInAs(node.baseUrl, admin.email, demo.password);
    const invite = await request(node.baseUrl)
      .post('/api/company/invitations')
      .set('Authorization', `Bearer ${adminSession.accessToken}`)
      .send({ email: 'new.fitter@fitters.example', roles: ['installer'] });
    expect(invite.status).toBe(201);
    const mail = await node.server.mailCatcher!.waitFor(
      (m) => m.to.includes('new.fitter@fitters.example'),
      5000,
    );
    const token = /\/invitation\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];

    const preview = await request(node.baseUrl).get(`/api/auth/invitations/${token}`);
    expect(preview.body.invitation).toMatchObject({
      email: 'new.fitter@fitters.example',
      companyName: 'Kestrel Hollow Vanfitters',
    });
    const accept = () =>
      request(node.baseUrl)
        .post('/api/auth/invitations/accept')
        .send({ token, displayName: 'New Fitter', password: 'a-long-password-1' });
    const first = await accept();
    expect(first.status).toBe(200);
    expect(first.body.user).toMatchObject({ email: 'new.fitter@fitters.example', roles: ['installer'] });
    const again = await accept();
    expect(again.status).toBe(410);
    expect(again.body.error.field).toBe('token');

    await request(node.baseUrl)
      .post('/api/company/invitations')
      .set('Authorization', `Bearer ${adminSession.accessToken}`)
      .send({ email: 'late@fitters.example', roles: ['support'] });
    const lateMail = await node.server.mailCatcher!.waitFor(
      (m) => m.to.includes('late@fitters.example'),
      5000,
    );
    const lateToken = /\/invitation\/([A-Za-z0-9_-]+)/.exec(lateMail.text)![1];
    await node.database.query(
      `UPDATE invitations SET expires_at = now() - interval '1 minute' WHERE email = 'late@fitters.example'`,
    );
    const late = await request(node.baseUrl)
      .post('/api/auth/invitations/accept')
      .send({ token: lateToken, displayName: 'Late', password: 'a-long-password-1' });
    expect(late.status).toBe(410);
  });

  it('lets only company admins invite, and names the bad field', async () => {
    const ownerSession = await signInAs(node.baseUrl, owner.email, demo.password);
    const refused = await request(node.baseUrl)
      .post('/api/company/invitations')
      .set('Authorization', `Bearer ${ownerSession.accessToken}`)
      .send({ email: 'x@example.com', roles: ['support'] });
    expect(refused.status).toBe(403);
    const adminSession = await signInAs(node.baseUrl, admin.email, demo.password);
    const bad = await request(node.baseUrl)
      .post('/api/company/invitations')
      .set('Authorization', `Bearer ${adminSession.accessToken}`)
      .send({ email: 'x@example.com', roles: ['emperor'] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toMatch(/^roles/);
  });
});

describe('password reset', () => {
  it('answers the same for known and unknown addresses, and the link resets once', async () => {
    const known = await request(node.baseUrl)
      .post('/api/auth/password-reset/request')
      .send({ email: owner.email });
    const unknown = await request(node.baseUrl)
      .post('/api/auth/password-reset/request')
      .send({ email: 'nobody@nowhere.example' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    const before = await signInAs(node.baseUrl, owner.email, demo.password);
    const mail = await node.server.mailCatcher!.waitFor(
      (m) => m.to.includes(owner.email) && /reset/i.test(m.subject),
      5000,
    );
    const token = /\/password-reset\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    const complete = () =>
      request(node.baseUrl)
        .post('/api/auth/password-reset/complete')
        .send({ token, password: 'a-brand-new-password' });
    expect((await complete()).status).toBe(204);
    expect((await complete()).status).toBe(410);
    // The reset ended the sessions that existed before it.
    expect((await refresh(before.cookie)).status).toBe(401);
    expect(
      (
        await request(node.baseUrl)
          .post('/api/auth/sign-in')
          .send({ email: owner.email, password: 'a-brand-new-password' })
      ).status,
    ).toBe(200);
    const short = await request(node.baseUrl)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'short' });
    expect(short.body.error.field).toBe('password');
  });
});
