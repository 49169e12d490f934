// The next occurrence of a wall-clock time in a system's time zone, given as a fixed UTC offset for the
// instant in question (the server resolves the zone, daylight saving included, and passes the offset).
import { AnalyticsSettingError } from './analytics-error';

const MS_PER_MINUTE = 60_000;
const MS_PER_DAY = 86_400_000;
const LOCAL_TIME = /^([01]\d|2[0-3]):([0-5]\d)$/;

/** The first instant strictly after `nowMs` whose local time is `hhmm` ("07:00") at `utcOffsetMinutes`. */
export function nextLocalTime(nowMs: number, hhmm: string, utcOffsetMinutes: number): number {
  const minutes = minutesOf(hhmm);
  if (!Number.isInteger(utcOffsetMinutes) || Math.abs(utcOffsetMinutes) > 14 * 60) {
    throw new AnalyticsSettingError(
      'bad_local_time',
      'utcOffsetMinutes',
      `utcOffsetMinutes must be a whole number between -840 and 840; got ${utcOffsetMinutes}`,
    );
  }
  const offsetMs = utcOffsetMinutes * MS_PER_MINUTE;
  const localNow = nowMs + offsetMs;
  const localMidnight = Math.floor(localNow / MS_PER_DAY) * MS_PER_DAY;
  let localTarget = localMidnight + minutes * MS_PER_MINUTE;
  if (localTarget <= localNow) localTarget += MS_PER_DAY;
  return localTarget - offsetMs;
}

// Minutes after midnight of each valid "HH:MM" seen (at most 1,440): the morning projection asks on every reading.
const parsedTimes = new Map<string, number>();

function minutesOf(hhmm: string): number {
  const known = parsedTimes.get(hhmm);
  if (known !== undefined) return known;
  const match = LOCAL_TIME.exec(hhmm);
  if (match === null) {
    throw new AnalyticsSettingError(
      'bad_local_time',
      'localTime',
      `local time must be HH:MM (00:00–23:59); got "${hhmm}"`,
    );
  }
  const minutes = Number(match[1]) * 60 + Number(match[2]);
  parsedTimes.set(hhmm, minutes);
  return minutes;
}
