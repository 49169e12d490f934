// aedes-persistence-redis ships no types; this is the part Cellwarden calls.
declare module 'aedes-persistence-redis' {
  import type { Redis, RedisOptions } from 'ioredis';

  /** aedes persistence over Redis; `conn` reuses a connection, `destroy` ends it. */
  export interface RedisPersistence {
    /** True once aedes has called setup. */
    readonly ready: boolean;
    destroy(callback: () => void): void;
  }

  /** Creates the persistence (the callback-style wrapper aedes accepts as `persistence`). */
  export default function createRedisPersistence(
    options: RedisOptions & { conn?: Redis; maxSessionDelivery?: number },
  ): RedisPersistence;
}
