import { Redis } from 'ioredis';
import type { Logger } from '../logger';

/**
 * One connection to the cluster's Redis, named so `CLIENT LIST` shows which node and role holds it.
 * Errors are logged rather than thrown: ioredis reconnects by itself and queues commands meanwhile.
 */
export function connectRedis(url: string, role: string, logger: Logger): Redis {
  const redis = new Redis(url, {
    connectionName: `cellwarden-${role}`,
    // Commands wait through a short Redis restart instead of failing at the first refused connect.
    maxRetriesPerRequest: 20,
    retryStrategy: (attempt) => Math.min(attempt * 100, 2000),
  });
  redis.on('error', (error) => logger.warn('redis connection error', { role, error: error.message }));
  return redis;
}

/** Closes a connection politely (QUIT), or drops it when Redis is not answering. */
export async function closeRedis(redis: Redis): Promise<void> {
  if (redis.status === 'end') return;
  try {
    await redis.quit();
  } catch {
    redis.disconnect();
  }
}
