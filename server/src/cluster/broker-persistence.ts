import type { AedesOptions } from 'aedes';
import createRedisPersistence from 'aedes-persistence-redis';
import createRedisEmitter from 'mqemitter-redis';
import type { Logger } from '../logger';
import { closeRedis, connectRedis } from './redis-connection';

/** The aedes emitter and persistence a cluster's brokers share, and how to let go of them. */
export interface BrokerStores {
  mq: NonNullable<AedesOptions['mq']>;
  persistence: NonNullable<AedesOptions['persistence']>;
  /** Ends the persistence's connection; aedes closes the emitter itself when the broker closes. */
  close(): Promise<void>;
}

/**
 * Redis for aedes: the emitter carries every PUBLISH and the brokers' $SYS notices (so a client taken over
 * by another node is closed on the old one), and the persistence holds sessions, QoS 1/2 in-flight state,
 * retained messages and wills, so a device with a persistent session can move to any node.
 */
export function createRedisBrokerStores(url: string, logger: Logger): BrokerStores {
  const mq = createRedisEmitter({
    pubConn: connectRedis(url, 'mqtt-emit', logger),
    subConn: connectRedis(url, 'mqtt-listen', logger),
  });
  const connection = connectRedis(url, 'mqtt-sessions', logger);
  const persistence = createRedisPersistence({ conn: connection });
  return {
    mq: mq as unknown as BrokerStores['mq'],
    persistence: persistence as unknown as BrokerStores['persistence'],
    async close() {
      // destroy() unsubscribes the broker and disconnects; closeRedis covers a persistence never set up.
      if (persistence.ready) await new Promise<void>((resolve) => persistence.destroy(() => resolve()));
      await closeRedis(connection);
    },
  };
}
