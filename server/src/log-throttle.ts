import type { Logger } from './logger';

const MAX_KEYS = 1000;

/**
 * Warnings that a misbehaving peer could repeat hundreds of times a second, logged as at most one line per
 * key and interval: the first occurrence at once, then how many more there were, when the interval ends.
 */
export function createLogThrottle(logger: Logger, intervalMs = 60_000) {
  const counts = new Map<string, { message: string; fields: Record<string, unknown>; more: number }>();
  const timer = setInterval(() => {
    for (const [key, entry] of counts) {
      if (entry.more > 0)
        logger.warn(`${entry.message} (repeated)`, {
          ...entry.fields,
          repeated: entry.more,
          intervalSeconds: intervalMs / 1000,
        });
      counts.delete(key);
    }
  }, intervalMs);
  timer.unref();
  return {
    /** Logs `message` for `key` now if it is the first in this interval, else counts it. */
    warn(key: string, message: string, fields: Record<string, unknown> = {}): void {
      // Keys may come from a peer (a device id tried at connect): past MAX_KEYS they share one line.
      if (!counts.has(key) && counts.size >= MAX_KEYS) key = '(many others)';
      const entry = counts.get(key);
      if (entry) {
        entry.more++;
        entry.fields = fields;
        return;
      }
      counts.set(key, { message, fields, more: 0 });
      logger.warn(message, fields);
    },
    close: () => clearInterval(timer),
  };
}

export type LogThrottle = ReturnType<typeof createLogThrottle>;
