/** A reading older than this is marked stale. */
export const STALE_AFTER_MS = 2 * 60 * 1000;

/** Whether the latest reading (measured at `measuredAt`, ms) is too old to trust at `now`. */
export function isStale(measuredAt: number | null | undefined, now: number): boolean {
  return measuredAt == null || now - measuredAt > STALE_AFTER_MS;
}
