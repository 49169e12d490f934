import request from 'supertest';
import WebSocket from 'ws';
import type { StreamMessage } from '@cellwarden/shared';

/** Signs in and returns the access token and the refresh cookie as the browser would hold it. */
export async function signInAs(baseUrl: string, email: string, password: string) {
  const response = await request(baseUrl).post('/api/auth/sign-in').send({ email, password });
  if (response.status !== 200) throw new Error(`sign-in of ${email} answered ${response.status}`);
  const cookie = ([] as string[])
    .concat(response.headers['set-cookie'] ?? [])
    .find((c) => c.startsWith('cw_refresh='));
  return {
    accessToken: response.body.accessToken as string,
    cookie: cookie?.split(';')[0] ?? '',
    body: response.body,
  };
}

/** A live-stream client that records every message it receives. */
export function openStream(httpPort: number, token: string) {
  const messages: StreamMessage[] = [];
  const socket = new WebSocket(`ws://127.0.0.1:${httpPort}/api/stream`, ['cellwarden.v1', `bearer.${token}`]);
  socket.on('message', (data) => messages.push(JSON.parse(data.toString())));
  const opened = new Promise<void>((resolve, reject) => {
    socket.once('open', () => resolve());
    socket.once('error', reject);
    socket.once('unexpected-response', (_req, res) =>
      reject(new Error(`upgrade answered ${res.statusCode}`)),
    );
  });
  return { socket, messages, opened };
}

/** Polls until `condition` holds, failing after `timeoutMs`. */
export async function until(condition: () => boolean | Promise<boolean>, timeoutMs = 5000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await condition())) {
    if (Date.now() > deadline) throw new Error('condition not met in time');
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}
