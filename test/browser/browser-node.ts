import { join } from 'node:path';
import request from 'supertest';
import demo from '../../db/seeders/demo-sign-ins.json';
import { startTestServer } from '../support/test-server';
import { launchChromium } from './launch-chromium';

/** A real node serving the built dashboard, and Debian's Chromium to drive it. */
export async function startBrowserNode() {
  const node = await startTestServer({ webDist: join(__dirname, '..', '..', 'dist', 'web', 'browser') });
  const chromium = await launchChromium();
  return { node, chromium };
}

/** The demo owner's systems, by kind (van, cabin), as the API lists them. */
export async function ownerSystems(baseUrl: string): Promise<Record<string, { id: string; name: string }>> {
  const signIn = await request(baseUrl)
    .post('/api/auth/sign-in')
    .send({ email: demo.users[0].email, password: demo.password });
  const systems = await request(baseUrl)
    .get('/api/systems')
    .set('Authorization', `Bearer ${signIn.body.accessToken}`);
  return Object.fromEntries(
    (systems.body.systems as { id: string; name: string; kind: string }[]).map((s) => [s.kind, s]),
  );
}
