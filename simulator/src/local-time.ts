/** A daily window of local clock hours, [from, to); wraps past midnight when from > to. */
export interface DailyWindow {
  from: number;
  to: number;
}

/** Local mean solar time of day in hours [0, 24): UTC shifted by longitude/15 (15° per hour). */
export function localHour(at: number, longitude: number): number {
  const hours = at / 3_600_000 + longitude / 15;
  return ((hours % 24) + 24) % 24;
}

/** Whether a local hour falls inside any of the windows. */
export function withinWindows(windows: readonly DailyWindow[], hour: number): boolean {
  return windows.some(({ from, to }) => (from <= to ? hour >= from && hour < to : hour >= from || hour < to));
}

/** All day, every day. */
export const ALWAYS: readonly DailyWindow[] = [{ from: 0, to: 24 }];
