// Calendar months in a system's IANA time zone, daylight saving included, from the platform's Intl data
// (pure: no I/O, the same in Node and the browser).
import { wallClockIn, zoneOffsetMs } from '../analytics/zone-offset';

/** The instant local midnight began on the first day of the month holding `at` in `timeZone`, ms. */
export function monthStartIn(at: number, timeZone: string): number {
  const [year, month] = wallClockIn(at, timeZone);
  const wallMidnight = Date.UTC(year, month - 1, 1);
  // Two rounds: the offset at a first guess, then at the instant it gives (in case a change lies between).
  const guess = wallMidnight - zoneOffsetMs(wallMidnight, timeZone);
  return wallMidnight - zoneOffsetMs(guess, timeZone);
}
