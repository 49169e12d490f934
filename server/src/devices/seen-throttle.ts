/**
 * Writes a device's "last seen" time at most once per interval instead of on every ingest flush.
 *
 * At 1,000 monitors × 1 Hz every flush updated up to 500 device rows, a second write load beside the readings
 * for a column only the fleet list and the device pages read (as "last seen …"; the silence alerts use the live
 * analytics' own clock, not this column). A device seen for the first time in an interval is written at once
 * (a monitor coming back shows at once); later sightings wait in `pending` and the timer writes them, so the
 * column is never more than one interval behind the newest stored reading.
 */
export function createSeenThrottle(deps: {
  write: (lastSeen: Map<string, number>) => Promise<void>;
  onError: (error: unknown) => void;
  now: () => number;
  intervalMs?: number;
  /** Devices remembered as written; the oldest are forgotten past it (they are then written at once again). */
  maxDevices?: number;
}) {
  const intervalMs = deps.intervalMs ?? 30_000;
  const maxDevices = deps.maxDevices ?? 50_000;
  /** deviceId → when it was last written; insertion order is write order, so the first key is the oldest. */
  const written = new Map<string, number>();
  /** deviceId → newest measured time not yet written. */
  let pending = new Map<string, number>();

  function write(batch: Map<string, number>) {
    if (batch.size === 0) return Promise.resolve();
    const at = deps.now();
    for (const id of batch.keys()) {
      written.delete(id);
      written.set(id, at);
    }
    while (written.size > maxDevices) written.delete(written.keys().next().value!);
    return deps.write(batch).then(
      () => undefined,
      (error: unknown) => void deps.onError(error),
    );
  }

  function flushPending() {
    const batch = pending;
    pending = new Map();
    return write(batch);
  }

  const timer = setInterval(() => void flushPending(), intervalMs);
  timer.unref();

  return {
    /** Takes one flush's newest measured time per device; writes the ones not written within the interval. */
    markSeen(lastSeen: Map<string, number>): Promise<void> {
      const now = deps.now();
      const due = new Map<string, number>();
      for (const [id, at] of lastSeen) {
        const newest = Math.max(at, pending.get(id) ?? 0);
        const writtenAt = written.get(id);
        if (writtenAt === undefined || now - writtenAt >= intervalMs) {
          due.set(id, newest);
          pending.delete(id);
        } else pending.set(id, newest);
      }
      // A burst of new devices cannot grow the waiting map without bound: past the cap it is written now.
      if (pending.size > maxDevices) {
        for (const [id, at] of pending) due.set(id, at);
        pending = new Map();
      }
      return write(due);
    },
    /** Writes whatever waits (at shutdown), and stops the timer. */
    close(): Promise<void> {
      clearInterval(timer);
      return flushPending();
    },
  };
}

export type SeenThrottle = ReturnType<typeof createSeenThrottle>;
