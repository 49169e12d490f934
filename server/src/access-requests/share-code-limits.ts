import { RateLimiterMemory } from 'rate-limiter-flexible';
import { SHARE_CODE_ATTEMPTS, SHARE_CODE_GLOBAL_ATTEMPTS, SHARE_CODE_TTL_MS } from '@cellwarden/shared';

/**
 * Brakes on guessing share codes: wrong codes per person and for the whole server, counted over one code
 * lifetime. In this node's memory (per node in cluster mode: a bound per node, not an exact one).
 */
export function createShareCodeLimits(
  settings = { perPerson: SHARE_CODE_ATTEMPTS, global: SHARE_CODE_GLOBAL_ATTEMPTS },
) {
  const duration = SHARE_CODE_TTL_MS / 1000;
  const people = new RateLimiterMemory({ points: settings.perPerson, duration });
  const everyone = new RateLimiterMemory({ points: settings.global, duration });
  const used = async (limiter: RateLimiterMemory, key: string) =>
    (await limiter.get(key))?.consumedPoints ?? 0;
  return {
    /** Whether this person may try a code now. */
    async mayTry(userId: string): Promise<boolean> {
      return (
        (await used(people, userId)) < settings.perPerson && (await used(everyone, 'all')) < settings.global
      );
    },
    /** Counts a wrong code against the person and the server. */
    async wrong(userId: string): Promise<void> {
      await Promise.all([people.penalty(userId), everyone.penalty('all')]);
    },
  };
}

export type ShareCodeLimits = ReturnType<typeof createShareCodeLimits>;
