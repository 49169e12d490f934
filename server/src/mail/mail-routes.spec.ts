import express, { type RequestHandler } from 'express';
import request from 'supertest';
import type { PublicUser } from '@cellwarden/shared';
import { createErrorHandler } from '../errors/error-handler';
import { createMemoryLogger } from '../logger';
import type { CapturedMail } from './captured-mail';
import { createMailOutboxRoutes } from './mail-routes';
import { requireAdmin } from './require-admin';

const held: CapturedMail = {
  id: 'm1',
  to: ['ada@example.test'],
  from: 'alerts@cellwarden.test',
  subject: 'Low charge',
  text: 'Charge is at 18 %.',
  receivedAt: 1,
  attachments: [{ filename: 'record.pdf', contentType: 'application/pdf', size: 1200 }],
  headerNames: ['from', 'to', 'subject'],
};

function appAs(user: PublicUser | undefined) {
  const app = express();
  const signIn: RequestHandler = (req, _res, next) => {
    req.currentUser = user;
    next();
  };
  app.use('/api/dev/mail', signIn, requireAdmin, createMailOutboxRoutes({ messages: () => [held] }));
  app.use(createErrorHandler(createMemoryLogger()));
  return app;
}

const person = (roles: PublicUser['roles']): PublicUser => ({
  id: 'u1',
  email: 'ada@example.test',
  displayName: 'Ada',
  roles,
  companyId: null,
});

describe('the development outbox', () => {
  it('lists the captured messages to an admin', async () => {
    const response = await request(appAs(person(['admin'])))
      .get('/api/dev/mail')
      .expect(200);
    expect(response.body).toEqual({ messages: [held] });
  });

  it('is forbidden to anyone without the admin role', async () => {
    const response = await request(appAs(person(['owner', 'installer'])))
      .get('/api/dev/mail')
      .expect(403);
    expect(response.body.error.code).toBe('forbidden');
  });

  it('asks for sign-in when no one is signed in', async () => {
    await request(appAs(undefined)).get('/api/dev/mail').expect(401);
  });
});
