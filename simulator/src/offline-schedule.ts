/** A monitor that drops off every `everyMinutes` of simulated time and stays away `forMinutes` (< every). */
export interface OfflineSchedule {
  everyMinutes: number;
  forMinutes: number;
}

/** Whether a reading measured at `at` is taken while offline; windows open at start + k·every, k ≥ 1. */
export function isOffline(schedule: OfflineSchedule | undefined, start: number, at: number): boolean {
  if (!schedule || schedule.forMinutes <= 0 || schedule.everyMinutes <= 0) return false;
  const elapsedMinutes = (at - start) / 60_000;
  if (elapsedMinutes < schedule.everyMinutes) return false;
  return elapsedMinutes % schedule.everyMinutes < schedule.forMinutes;
}
