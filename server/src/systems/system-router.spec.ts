import express, { type ErrorRequestHandler } from 'express';
import request from 'supertest';
import { createErrorHandler } from '../errors/error-handler';
import { createMemoryLogger } from '../logger';
import { createSystemRouter } from './system-router';

const VAN = '0b6f1f5e-3c1d-4e59-9a8e-6f0c2b7d4a11';

// A stand-in system router: one route with :systemId, one without, and an error layer after them, mounted as
// the app mounts every system router.
function systemApp() {
  const seen: string[] = [];
  const router = createSystemRouter();
  router.get('/', (_req, res) => {
    res.json({ listed: true });
  });
  router.post('/:systemId/notes', (req, res) => {
    if (typeof req.body?.note !== 'string') throw new Error('the handler ran with a bad body');
    res.status(201).json({ systemId: req.params.systemId });
  });
  const noteError: ErrorRequestHandler = (error, _req, _res, next) => {
    seen.push(String(error.code));
    next(error);
  };
  router.use('/:system/notes', noteError);
  const app = express();
  app.use(express.json());
  app.use('/api/systems', router);
  app.use(createErrorHandler(createMemoryLogger()));
  return { app, seen };
}

describe('the :systemId check of a system router', () => {
  it('lets a uuid through to the route, as it was written', async () => {
    const { app } = systemApp();
    const response = await request(app).post(`/api/systems/${VAN.toUpperCase()}/notes`).send({ note: 'n' });
    expect([response.status, response.body]).toEqual([201, { systemId: VAN.toUpperCase() }]);
  });

  it.each(['not-a-uuid', 'van-1', `${VAN}x`, '%27%20OR%201%3D1', '0b6f1f5e3c1d4e599a8e6f0c2b7d4a11'])(
    'answers %s as a system not found, before the handler reads the body',
    async (id) => {
      const { app, seen } = systemApp();
      const response = await request(app).post(`/api/systems/${id}/notes`).send('[]').type('json');
      expect([response.status, response.body]).toEqual([
        404,
        { error: { code: 'not_found', message: 'System not found' } },
      ]);
      // An error layer on the same path under another parameter name still sees the refusal.
      expect(seen).toEqual(['not_found']);
    },
  );

  it('leaves routes without :systemId alone', async () => {
    const { app } = systemApp();
    expect((await request(app).get('/api/systems')).body).toEqual({ listed: true });
  });
});
