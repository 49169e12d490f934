import { randomUUID } from 'node:crypto';
import http from 'node:http';
import jwt from 'jsonwebtoken';
import request from 'supertest';
import type WebSocket from 'ws';
import { STREAM_CLOSE } from '@cellwarden/shared';
import demo from '../../db/seeders/demo-sign-ins.json';
import { openStream, signInAs, until } from '../support/http-session';
import { TEST_JWT_SECRET } from '../support/test-secret';
import { startTestServer } from '../support/test-server';

// Regression tests for sessions that outlived the person's intent, forged tokens, reset links and the
// HTTP edges: each failed on the code before the security hardening and passes after.

jest.setTimeout(60000);

type Node = Awaited<ReturnType<typeof startTestServer>>;
let node: Node;
const [owner, installer, support, admin] = demo.users;
const password = demo.password;

beforeAll(async () => {
  node = await startTestServer({ env: { SIGN_IN_LIMIT_PER_ACCOUNT: '5' } });
});
afterAll(() => node.stop());

const me = (token: string) =>
  request(node.baseUrl).get('/api/auth/me').set('Authorization', `Bearer ${token}`);
const closeCode = (socket: WebSocket) =>
  new Promise<number>((resolve) => socket.once('close', (code) => resolve(code)));
const resetLinks = (email: string) =>
  node.server
    .mailCatcher!.messages()
    .filter((m) => m.to.includes(email) && /reset/i.test(m.subject))
    .sort((a, b) => a.receivedAt - b.receivedAt)
    .map((m) => m.text.match(/password-reset\/([A-Za-z0-9_-]+)/)![1]);
const completeReset = (token: string, newPassword: string) =>
  request(node.baseUrl).post('/api/auth/password-reset/complete').send({ token, password: newPassword });

describe('access tokens', () => {
  it('refuses a correctly signed token without exp, or without a session id', async () => {
    const session = await signInAs(node.baseUrl, owner.email, password);
    const claims = jwt.decode(session.accessToken) as { sub: string; sid: string };
    const noExp = jwt.sign({ sid: claims.sid }, TEST_JWT_SECRET, {
      subject: claims.sub,
      audience: 'cellwarden',
    });
    const noSid = jwt.sign({}, TEST_JWT_SECRET, {
      subject: claims.sub,
      audience: 'cellwarden',
      expiresIn: 600,
    });
    const otherSid = jwt.sign({ sid: randomUUID() }, TEST_JWT_SECRET, {
      subject: claims.sub,
      audience: 'cellwarden',
      expiresIn: 600,
    });
    expect((await me(session.accessToken)).status).toBe(200);
    for (const token of [noExp, noSid, otherSid]) expect((await me(token)).status).toBe(401);
    await expect(openStream(node.server.httpPort, noExp).opened).rejects.toThrow(/401/);
  });

  it('stops working at once after sign-out, on HTTP and on the open stream', async () => {
    const session = await signInAs(node.baseUrl, owner.email, password);
    const stream = openStream(node.server.httpPort, session.accessToken);
    await stream.opened;
    const closed = closeCode(stream.socket);
    await request(node.baseUrl).post('/api/auth/sign-out').set('Cookie', session.cookie).expect(204);
    expect((await me(session.accessToken)).status).toBe(401);
    expect(await closed).toBe(STREAM_CLOSE.sessionEnded);
  });

  it('closes a stream when its token lapses, unless the client renews it on the socket', async () => {
    const session = await signInAs(node.baseUrl, installer.email, password);
    const { sub, sid } = jwt.decode(session.accessToken) as { sub: string; sid: string };
    const shortLived = () =>
      jwt.sign({ sid }, TEST_JWT_SECRET, { subject: sub, audience: 'cellwarden', expiresIn: 2 });
    const lapsing = openStream(node.server.httpPort, shortLived());
    const renewed = openStream(node.server.httpPort, shortLived());
    await Promise.all([lapsing.opened, renewed.opened]);
    const lapsed = closeCode(lapsing.socket);
    renewed.socket.send(JSON.stringify({ type: 'renew', token: session.accessToken }));
    await until(() => renewed.messages.some((m) => m.type === 'renewed'));
    // Another person's token is no renewal.
    const other = await signInAs(node.baseUrl, owner.email, password);
    renewed.socket.send(JSON.stringify({ type: 'renew', token: other.accessToken }));
    await until(() => renewed.messages.some((m) => m.type === 'error' && m.code === 'renew_refused'));
    expect(await lapsed).toBe(STREAM_CLOSE.tokenExpired);
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(renewed.socket.readyState).toBe(renewed.socket.OPEN);
    renewed.socket.close();
  });
});

describe('password reset and change', () => {
  it('voids older links when a new one is issued, and every link and session once a reset completes', async () => {
    const before = await signInAs(node.baseUrl, support.email, password);
    const stream = openStream(node.server.httpPort, before.accessToken);
    await stream.opened;
    const closed = closeCode(stream.socket);
    for (let i = 0; i < 2; i++) {
      await request(node.baseUrl)
        .post('/api/auth/password-reset/request')
        .send({ email: support.email })
        .expect(202);
      await until(() => resetLinks(support.email).length === i + 1);
    }
    const [older, newer] = resetLinks(support.email);
    expect((await completeReset(older, 'a-brand-new-secret-1')).status).toBe(410);
    expect((await completeReset(newer, 'a-brand-new-secret-1')).status).toBe(204);
    expect((await me(before.accessToken)).status).toBe(401);
    expect(await closed).toBe(STREAM_CLOSE.sessionEnded);
    // A link issued before the reset completed, then used afterwards, is void as well.
    await request(node.baseUrl).post('/api/auth/password-reset/request').send({ email: support.email });
    await until(() => resetLinks(support.email).length === 3);
    const third = resetLinks(support.email)[2];
    await request(node.baseUrl).post('/api/auth/password-reset/request').send({ email: support.email });
    await until(() => resetLinks(support.email).length === 4);
    expect((await completeReset(resetLinks(support.email)[3], 'another-new-secret-2')).status).toBe(204);
    expect((await completeReset(third, 'a-third-new-secret-3')).status).toBe(410);
    await signInAs(node.baseUrl, support.email, 'another-new-secret-2');
  });

  it('answers a reset request for an unknown address with the same status, words and headers', async () => {
    const ask = (email: string) =>
      request(node.baseUrl).post('/api/auth/password-reset/request').send({ email });
    const [known, unknown] = [await ask(owner.email), await ask('nobody-here@owner.example')];
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    expect(unknown.headers['content-length']).toBe(known.headers['content-length']);
  });

  it('ends every other session when the password is changed, and keeps this one', async () => {
    const other = await signInAs(node.baseUrl, admin.email, password);
    const current = await signInAs(node.baseUrl, admin.email, password);
    const change = (body: object) =>
      request(node.baseUrl)
        .post('/api/auth/password')
        .set('Authorization', `Bearer ${current.accessToken}`)
        .send(body);
    const wrong = await change({ currentPassword: 'not-it-at-all', newPassword: 'admin-new-secret-9' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.field).toBe('currentPassword');
    const tooLong = await change({ currentPassword: password, newPassword: 'ü'.repeat(40) });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.field).toBe('newPassword');
    expect((await change({ currentPassword: password, newPassword: 'admin-new-secret-9' })).status).toBe(204);
    expect((await me(other.accessToken)).status).toBe(401);
    expect((await me(current.accessToken)).status).toBe(200);
    await request(node.baseUrl)
      .post('/api/auth/password')
      .set('Authorization', `Bearer ${current.accessToken}`)
      .send({ currentPassword: 'admin-new-secret-9', newPassword: password })
      .expect(204);
  });

  it('does not let a password longer than the hash reads sign in on its first 72 bytes', async () => {
    const response = await request(node.baseUrl)
      .post('/api/auth/sign-in')
      .send({ email: owner.email, password: `${password}${'x'.repeat(80)}` });
    expect(response.status).toBe(401);
  });
});

describe('company members', () => {
  it('ends the sessions of a member whose roles change or who is removed, and withdraws invitations', async () => {
    const adminSession = await signInAs(node.baseUrl, admin.email, password);
    const asAdmin = (r: request.Test) => r.set('Authorization', `Bearer ${adminSession.accessToken}`);
    const members = (await asAdmin(request(node.baseUrl).get('/api/company/members'))).body.members as {
      id: string;
      email: string;
    }[];
    const fitter = members.find((m) => m.email === installer.email)!;
    const before = await signInAs(node.baseUrl, installer.email, password);
    const roles = await asAdmin(request(node.baseUrl).put(`/api/company/members/${fitter.id}/roles`)).send({
      roles: ['installer', 'support'],
    });
    expect(roles.status).toBe(204);
    expect((await me(before.accessToken)).status).toBe(401);
    const after = await signInAs(node.baseUrl, installer.email, password);
    expect(after.body.user.roles).toEqual(['installer', 'support']);
    expect((await asAdmin(request(node.baseUrl).delete(`/api/company/members/${fitter.id}`))).status).toBe(
      204,
    );
    expect((await me(after.accessToken)).status).toBe(401);
    const removed = await signInAs(node.baseUrl, installer.email, password);
    expect(removed.body.user).toMatchObject({ roles: [], companyId: null });
    expect((await asAdmin(request(node.baseUrl).delete(`/api/company/members/${fitter.id}`))).status).toBe(
      404,
    );

    const invited = await asAdmin(request(node.baseUrl).post('/api/company/invitations')).send({
      email: 'new.fitter@fitters.example',
      roles: ['support'],
    });
    expect(invited.status).toBe(201);
    const id = invited.body.invitation.id;
    expect((await asAdmin(request(node.baseUrl).delete(`/api/company/invitations/${id}`))).status).toBe(204);
    expect((await asAdmin(request(node.baseUrl).delete(`/api/company/invitations/${id}`))).status).toBe(404);
  });

  it('answers an invitation the same whether or not the address already has an account', async () => {
    const adminSession = await signInAs(node.baseUrl, admin.email, password);
    const invite = (email: string) =>
      request(node.baseUrl)
        .post('/api/company/invitations')
        .set('Authorization', `Bearer ${adminSession.accessToken}`)
        .send({ email, roles: ['support'] });
    const [existing, fresh] = [await invite(owner.email), await invite('someone.new@fitters.example')];
    expect(existing.status).toBe(201);
    expect(fresh.status).toBe(201);
    expect(Object.keys(existing.body.invitation)).toEqual(Object.keys(fresh.body.invitation));
  });
});

describe('HTTP edges', () => {
  it('marks API answers Cache-Control: no-store', async () => {
    const session = await signInAs(node.baseUrl, owner.email, password);
    expect((await me(session.accessToken)).headers['cache-control']).toBe('no-store');
    expect((await request(node.baseUrl).get('/api/health')).headers['cache-control']).toBe('no-store');
  });

  // The real client address decides; a header anyone can send does not.
  it('counts failed sign-ins by the real address, whatever X-Forwarded-For says', async () => {
    const email = 'guess-target@owner.example';
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) {
      const response = await request(node.baseUrl)
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', `203.0.113.${i}`)
        .send({ email, password: 'wrong-guess-000' });
      statuses.push(response.status);
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.slice(5)).toEqual([429, 429]);
  });

  it('does not lock the owner out from their own address when a stranger guesses from another', async () => {
    const signInFrom = (localAddress: string, body: object) =>
      new Promise<number>((resolve, reject) => {
        const req = http.request(
          `${node.baseUrl}/api/auth/sign-in`,
          { method: 'POST', localAddress, headers: { 'content-type': 'application/json' } },
          (res) => (res.resume(), resolve(res.statusCode!)),
        );
        req.on('error', reject);
        req.end(JSON.stringify(body));
      });
    for (let i = 0; i < 6; i++)
      await signInFrom('127.0.0.2', { email: owner.email, password: 'stranger-guess' });
    expect(await signInFrom('127.0.0.2', { email: owner.email, password })).toBe(429);
    expect(await signInFrom('127.0.0.1', { email: owner.email, password })).toBe(200);
  });
});

describe('stream requests', () => {
  it('takes a subscribe naming hundreds of systems without closing, and refuses one over the cap by name', async () => {
    const session = await signInAs(node.baseUrl, owner.email, password);
    const systems = (
      await request(node.baseUrl).get('/api/systems').set('Authorization', `Bearer ${session.accessToken}`)
    ).body.systems as { id: string }[];
    const stream = openStream(node.server.httpPort, session.accessToken);
    await stream.opened;
    const strangers = Array.from({ length: 600 }, () => randomUUID());
    stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds: [...strangers, systems[0].id] }));
    await until(() => stream.messages.some((m) => m.type === 'subscribed'), 20000);
    expect(stream.messages.find((m) => m.type === 'subscribed')).toEqual({
      type: 'subscribed',
      systemIds: [systems[0].id],
    });
    stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds: Array(1001).fill(systems[0].id) }));
    await until(() => stream.messages.some((m) => m.type === 'error' && m.code === 'invalid_message'));
    const refused = stream.messages.find((m) => m.type === 'error' && m.code === 'invalid_message');
    expect(refused).toMatchObject({ message: expect.stringContaining('systemIds') });
    expect(stream.socket.readyState).toBe(stream.socket.OPEN);
    stream.socket.close();
  });
});

describe('grants to a person', () => {
  it('answers a grant to an address without an account like any other, and applies it once the account exists', async () => {
    const ownerSession = await signInAs(node.baseUrl, owner.email, password);
    const asOwner = (r: request.Test) => r.set('Authorization', `Bearer ${ownerSession.accessToken}`);
    const systems = (await asOwner(request(node.baseUrl).get('/api/systems'))).body.systems as {
      id: string;
      kind: string;
    }[];
    const van = systems.find((s) => s.kind === 'van')!;
    const grant = (email: string) =>
      asOwner(request(node.baseUrl).post(`/api/systems/${van.id}/grants`)).send({
        granteeEmail: email,
        access: 'view',
        expiresAt: new Date(Date.now() + 86400_000).toISOString(),
      });
    const newcomer = 'late.joiner@fitters.example';
    const [known, unknown] = [await grant(admin.email), await grant(newcomer)];
    expect([known.status, unknown.status]).toEqual([201, 201]);
    const shape = (g: { granteeUser: object }) => Object.keys(g.granteeUser).sort();
    expect(shape(unknown.body.grant)).toEqual(shape(known.body.grant));
    expect(unknown.body.grant.granteeUser).toEqual({ id: '', email: newcomer, displayName: newcomer });

    const adminSession = await signInAs(node.baseUrl, admin.email, password);
    await request(node.baseUrl)
      .post('/api/company/invitations')
      .set('Authorization', `Bearer ${adminSession.accessToken}`)
      .send({ email: newcomer, roles: ['support'] })
      .expect(201);
    let link = '';
    await until(() => {
      const mail = node.server.mailCatcher!.messages().find((m) => m.to.includes(newcomer));
      link = mail?.text.match(/invitation\/([A-Za-z0-9_-]+)/)?.[1] ?? '';
      return link !== '';
    });
    const accepted = await request(node.baseUrl)
      .post('/api/auth/invitations/accept')
      .send({ token: link, displayName: 'Late Joiner', password: 'late-joiner-secret-1' });
    expect(accepted.status).toBe(200);
    const seen = await request(node.baseUrl)
      .get('/api/systems')
      .set('Authorization', `Bearer ${accepted.body.accessToken}`);
    expect(seen.body.systems.map((s: { id: string }) => s.id)).toContain(van.id);
  });
});
