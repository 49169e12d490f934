import type { Redis } from 'ioredis';
import type { Store } from 'express-rate-limit';
import { RedisStore, type RedisReply } from 'rate-limit-redis';

/** Key prefix of the sign-in counters in Redis. */
export const SIGN_IN_COUNTER_PREFIX = 'cellwarden:v1:sign-in:';

/**
 * express-rate-limit counters in Redis, one store per limiter (`name` keeps their keys apart), so every
 * node counts the same attempts: a guesser gains nothing by spreading over nodes behind a load balancer.
 */
export function createRedisRateLimitStores(redis: Redis): (name: string) => Store {
  return (name) =>
    new RedisStore({
      prefix: `${SIGN_IN_COUNTER_PREFIX}${name}:`,
      sendCommand: (command: string, ...args: string[]) =>
        redis.call(command, ...args) as Promise<RedisReply>,
    });
}
