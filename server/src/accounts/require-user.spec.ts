import express from 'express';
import request from 'supertest';
import type { AccessClaims } from './access-token';
import { signAccessToken } from './access-token';
import type { AccountsService, PublicUser } from './accounts-service';
import { createRequireUser } from './require-user';

const SECRET = 'a-test-secret-of-enough-length-0123456789';
const USER_ID = '11111111-1111-4111-8111-111111111111';
const SESSION_ID = '22222222-2222-4222-8222-222222222222';
const user: PublicUser = {
  id: USER_ID,
  email: 'owner@example.test',
  displayName: 'Owner',
  roles: ['owner'],
  companyId: null,
};

/** An app with the check in front of two routers, as the system routers are mounted. */
function appWith(open: (claims: AccessClaims) => boolean) {
  const asked: string[] = [];
  const accounts = {
    userForClaims: async (claims: AccessClaims) => {
      asked.push(claims.sessionId);
      if (!open(claims)) throw Object.assign(new Error('Session ended'), { status: 401 });
      return user;
    },
  } as unknown as AccountsService;
  const requireUser = createRequireUser(accounts, SECRET);
  const first = express.Router().get('/first', (_req, res) => res.json({ route: 'first' }));
  const second = express
    .Router()
    .get('/second', (req, res) => res.json({ route: 'second', user: req.currentUser?.id }));
  const app = express();
  for (const router of [first, second]) app.use('/api', requireUser, router);
  app.use(
    (error: { status?: number }, _req: express.Request, res: express.Response, _next: express.NextFunction) =>
      res.status(error.status ?? 500).json({}),
  );
  return { app, asked };
}

describe('requireUser', () => {
  const token = signAccessToken(SECRET, { userId: USER_ID, sessionId: SESSION_ID }, 600);

  it('reads the session once however many mounts a request passes before its route', async () => {
    const { app, asked } = appWith(() => true);
    const response = await request(app).get('/api/second').set('authorization', `Bearer ${token}`);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ route: 'second', user: USER_ID });
    expect(asked).toEqual([SESSION_ID]);
  });

  it('still refuses a request whose session has ended, at the first mount', async () => {
    const { app, asked } = appWith(() => false);
    const response = await request(app).get('/api/second').set('authorization', `Bearer ${token}`);
    expect(response.status).toBe(401);
    expect(asked).toEqual([SESSION_ID]);
  });

  it('refuses a token signed with another secret', async () => {
    const { app, asked } = appWith(() => true);
    const forged = signAccessToken(`${SECRET}-other`, { userId: USER_ID, sessionId: SESSION_ID }, 600);
    expect((await request(app).get('/api/second').set('authorization', `Bearer ${forged}`)).status).toBe(401);
    expect(asked).toEqual([]);
  });

  it('refuses a request without a token at every mount', async () => {
    const { app, asked } = appWith(() => true);
    expect((await request(app).get('/api/second')).status).toBe(401);
    expect(asked).toEqual([]);
  });
});
