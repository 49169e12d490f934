import WebSocket from 'ws';
import { MAX_STREAM_SUBSCRIPTIONS, type StreamMessage } from '@cellwarden/shared';

/** Dashboard-side end of the latency measurement: live-stream sockets subscribed to the given systems. */
export async function listenToStream(
  baseUrl: string,
  token: string,
  systemIds: readonly string[],
  received: Map<string, number>,
): Promise<{ close(): void }> {
  const sockets: WebSocket[] = [];
  for (let i = 0; i < systemIds.length; i += MAX_STREAM_SUBSCRIPTIONS) {
    const ids = systemIds.slice(i, i + MAX_STREAM_SUBSCRIPTIONS);
    const socket = new WebSocket(`${baseUrl.replace('http', 'ws')}/api/stream`, [
      'cellwarden.v1',
      `bearer.${token}`,
    ]);
    sockets.push(socket);
    await new Promise<void>((resolve, reject) => {
      socket.once('error', reject);
      socket.once('open', () => {
        // One subscribe per socket: a subscribe replaces the socket's subscriptions.
        socket.send(JSON.stringify({ type: 'subscribe', systemIds: ids }));
      });
      socket.on('message', (data) => {
        const message = JSON.parse(String(data)) as StreamMessage;
        if (message.type === 'subscribed' && message.systemIds.length >= ids.length) resolve();
        if (message.type === 'reading')
          received.set(`${message.systemId}|${message.reading.measuredAt}`, performance.now());
      });
      setTimeout(() => reject(new Error('stream subscribe not answered within 60 s')), 60_000).unref();
    });
  }
  return { close: () => sockets.forEach((s) => s.close()) };
}
