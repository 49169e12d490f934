import type { Store } from 'express-rate-limit';
import type { Logger } from '../logger';
import { createRedisBrokerStores, type BrokerStores } from './broker-persistence';
import { createRedisRateLimitStores } from './rate-limit-store';
import { closeRedis, connectRedis } from './redis-connection';
import { startRedisLiveBus, type RedisLiveBus } from './redis-live-bus';

/** What one node shares with the other nodes of a cluster through Redis. */
export interface ClusterMode {
  /** Live events and access changes, heard by every node's stream. */
  hub: RedisLiveBus;
  /** aedes' emitter and persistence. */
  broker: BrokerStores;
  /** Sign-in counters, one store per limiter. */
  signInStore: (name: string) => Store;
  /** Ends every Redis connection; call after the broker and the stream have closed. */
  close(): Promise<void>;
}

/** Connects a node to the cluster's Redis; resolves once live events can be heard. */
export async function startClusterMode(url: string, logger: Logger): Promise<ClusterMode> {
  const counters = connectRedis(url, 'sign-in-counters', logger);
  const hub = await startRedisLiveBus({ url, logger });
  const broker = createRedisBrokerStores(url, logger);
  return {
    hub,
    broker,
    signInStore: createRedisRateLimitStores(counters),
    async close() {
      await broker.close();
      await hub.close();
      await closeRedis(counters);
    },
  };
}
