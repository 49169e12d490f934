import type { Logger } from '../logger';
import type { LiveEvent, ReadingsHub } from '../telemetry/readings-hub';
import { closeRedis, connectRedis } from './redis-connection';

/** The Redis channel every node publishes live events on and listens to. */
export const LIVE_CHANNEL = 'cellwarden:v1:live';

// What travels on the channel: a live event for the streams, or the access-changed signal.
type BusMessage = { kind: 'event'; event: LiveEvent } | { kind: 'access'; systemId: string };

/** The readings hub over Redis pub/sub, with `close` to end its two connections. */
export type RedisLiveBus = ReadingsHub & { close(): Promise<void> };

function parseBusMessage(text: string): BusMessage | undefined {
  try {
    const message = JSON.parse(text) as BusMessage;
    if (message?.kind === 'event' && typeof message.event?.systemId === 'string') return message;
    if (message?.kind === 'access' && typeof message.systemId === 'string') return message;
  } catch {
    // Not ours or damaged: ignored below.
  }
  return undefined;
}

/**
 * Fan-out across nodes: a node publishes to Redis and hears its own events back like everyone else's, so a
 * browser sees the same stream whichever node it is on. Redis keeps the order of one connection's publishes,
 * which keeps each system's readings in order. Resolves once the channel is subscribed.
 */
export async function startRedisLiveBus(deps: {
  url: string;
  logger: Logger;
  channel?: string;
}): Promise<RedisLiveBus> {
  const channel = deps.channel ?? LIVE_CHANNEL;
  const publisher = connectRedis(deps.url, 'live-publish', deps.logger);
  const subscriber = connectRedis(deps.url, 'live-subscribe', deps.logger);
  const listeners = new Set<(event: LiveEvent) => void>();
  const accessListeners = new Set<(systemId: string) => void>();

  subscriber.on('message', (from: string, text: string) => {
    if (from !== channel) return;
    const message = parseBusMessage(text);
    if (!message) return deps.logger.warn('live bus message ignored', { length: text.length });
    if (message.kind === 'event') for (const listener of listeners) listener(message.event);
    else for (const listener of accessListeners) listener(message.systemId);
  });
  await subscriber.subscribe(channel);

  const send = (message: BusMessage) =>
    void publisher.publish(channel, JSON.stringify(message)).catch((error: Error) =>
      // A live event is a courtesy to the dashboard; the reading itself is already stored.
      deps.logger.warn('live event not published', { error: error.message }),
    );

  return {
    publish: (event: LiveEvent) => send({ kind: 'event', event }),
    subscribe(listener: (event: LiveEvent) => void): () => void {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    accessChanged: (systemId: string) => send({ kind: 'access', systemId }),
    onAccessChanged(listener: (systemId: string) => void): () => void {
      accessListeners.add(listener);
      return () => accessListeners.delete(listener);
    },
    async close() {
      listeners.clear();
      accessListeners.clear();
      await Promise.all([closeRedis(subscriber), closeRedis(publisher)]);
    },
  };
}
