import express, { type RequestHandler } from 'express';
import request from 'supertest';
import type { PublicUser } from '@cellwarden/shared';
import { createErrorHandler } from '../errors/error-handler';
import { createMemoryLogger } from '../logger';
import type { CapturedMail } from './captured-mail';
import { createMailOutboxRoutes } from './mail-routes';

const mail = (id: string, to: string[], subject: string): CapturedMail => ({
  id,
  to,
  from: 'alerts@cellwarden.test',
  subject,
  text: `${subject} text`,
  receivedAt: 1,
  attachments: [],
  headerNames: ['from', 'to', 'subject'],
});
const held = [
  mail('m1', ['ada@example.test'], 'Low charge'),
  mail('m2', ['kim@example.test'], 'Reset your password'),
  mail('m3', ['kim@example.test', 'ADA@Example.test'], 'Record for two'),
];

function appAs(user: PublicUser | undefined, catcher = { messages: () => held }) {
  const app = express();
  const signIn: RequestHandler = (req, _res, next) => {
    req.currentUser = user;
    next();
  };
  app.use('/api/dev/mail', signIn, createMailOutboxRoutes(catcher));
  app.use(createErrorHandler(createMemoryLogger()));
  return app;
}

const person = (email: string, roles: PublicUser['roles']): PublicUser => ({
  id: 'u1',
  email,
  displayName: 'Someone',
  roles,
  companyId: 'c1',
});

describe('the local copy of your mail', () => {
  it("lists only the messages addressed to the signed-in person, and only their own address in 'to'", async () => {
    const response = await request(appAs(person('Ada@example.test', ['owner'])))
      .get('/api/dev/mail')
      .expect(200);
    expect(response.body).toEqual({
      catcher: true,
      address: 'ada@example.test',
      messages: [held[0], { ...held[2], to: ['ADA@Example.test'] }],
    });
  });

  it("shows a company admin their own mail, never another person's reset mail", async () => {
    const response = await request(appAs(person('boss@example.test', ['admin'])))
      .get('/api/dev/mail')
      .expect(200);
    expect(response.body.messages).toEqual([]);
  });

  it('says when the server runs without its catcher', async () => {
    const app = express();
    app.use(
      '/api/dev/mail',
      (req, _res, next) => {
        req.currentUser = person('ada@example.test', ['owner']);
        next();
      },
      createMailOutboxRoutes(undefined),
    );
    const response = await request(app).get('/api/dev/mail').expect(200);
    expect(response.body).toEqual({ catcher: false, address: 'ada@example.test', messages: [] });
  });

  it('asks for sign-in when no one is signed in', async () => {
    await request(appAs(undefined)).get('/api/dev/mail').expect(401);
  });
});
