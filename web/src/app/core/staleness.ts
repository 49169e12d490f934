/** A reading older than this is always stale. */
export const STALE_AFTER_MS = 2 * 60 * 1000;

/** How long without a reading makes values stale: two reporting intervals, and at least two minutes. */
export function staleAfter(intervalMs: number | null | undefined): number {
  return intervalMs != null && intervalMs > 0 ? Math.max(STALE_AFTER_MS, 2 * intervalMs) : STALE_AFTER_MS;
}

/** Whether the latest reading (measured at `measuredAt`, ms) is too old to show as current at `now`. */
export function isStale(
  measuredAt: number | null | undefined,
  now: number,
  intervalMs?: number | null,
): boolean {
  return measuredAt == null || now - measuredAt > staleAfter(intervalMs);
}
