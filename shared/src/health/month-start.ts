// Calendar months in a system's IANA time zone, daylight saving included, from the platform's Intl data
// (pure: no I/O, the same in Node and the browser).
import { AnalyticsSettingError } from '../analytics/analytics-error';

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (formatter === undefined) {
    try {
      formatter = new Intl.DateTimeFormat('en-US', {
        timeZone,
        hourCycle: 'h23',
        year: 'numeric',
        month: 'numeric',
        day: 'numeric',
        hour: 'numeric',
        minute: 'numeric',
        second: 'numeric',
      });
    } catch (cause) {
      const error = new AnalyticsSettingError(
        'bad_local_time',
        'timeZone',
        `timeZone must be an IANA time zone such as Europe/Oslo; got "${timeZone}"`,
      );
      throw Object.assign(error, { cause });
    }
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

function wallClock(at: number, timeZone: string): number[] {
  const parts = formatterFor(timeZone).formatToParts(new Date(at));
  const value = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  return [value('year'), value('month'), value('day'), value('hour'), value('minute'), value('second')];
}

/** Offset of the zone's wall clock from UTC at an instant, ms. */
function offsetAt(at: number, timeZone: string): number {
  const [y, mo, d, h, mi, s] = wallClock(at, timeZone);
  return Date.UTC(y, mo - 1, d, h, mi, s) - Math.floor(at / 1000) * 1000;
}

/** The instant local midnight began on the first day of the month holding `at` in `timeZone`, ms. */
export function monthStartIn(at: number, timeZone: string): number {
  const [year, month] = wallClock(at, timeZone);
  const wallMidnight = Date.UTC(year, month - 1, 1);
  // Two rounds: the offset at a first guess, then at the instant it gives (in case a change lies between).
  const guess = wallMidnight - offsetAt(wallMidnight, timeZone);
  return wallMidnight - offsetAt(guess, timeZone);
}
