import request from 'supertest';
import { openStream, until } from './http-session';

/** The id of the first system of `kind` the signed-in user sees. */
export async function systemIdOf(baseUrl: string, token: string, kind: string): Promise<string> {
  const response = await request(baseUrl).get('/api/systems').set('Authorization', `Bearer ${token}`);
  return response.body.systems.find((s: { kind: string }) => s.kind === kind).id;
}

/** A live stream on `httpPort`, resolved once the node confirmed every one of `systemIds`. */
export async function subscribedStream(httpPort: number, token: string, systemIds: readonly string[]) {
  const stream = openStream(httpPort, token);
  await stream.opened;
  stream.socket.send(JSON.stringify({ type: 'subscribe', systemIds }));
  await until(() =>
    stream.messages.some((m) => m.type === 'subscribed' && systemIds.every((id) => m.systemIds.includes(id))),
  );
  return stream;
}
