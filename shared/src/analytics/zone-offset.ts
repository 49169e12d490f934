// A zone's offset from UTC at an instant, daylight saving included, from the platform's IANA data through Intl
// (pure: the same in Node and the browser).
import { AnalyticsSettingError } from './analytics-error';

// Making a formatter costs about a hundred times using one (it loads the zone's rules), and a restart asks for a
// thousand systems' offsets at once; zone names are a fixed list of a few hundred, so the cache stays bounded
// (a name the platform refuses never gets in).
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

/** The zone's wall clock at an instant: year, month (1–12), day, hour, minute, second. */
export function wallClockIn(at: number, timeZone: string): number[] {
  const parts = formatterFor(timeZone).formatToParts(new Date(at));
  const value = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  return [value('year'), value('month'), value('day'), value('hour'), value('minute'), value('second')];
}

/** Offset of the zone's wall clock from UTC at an instant, ms (east positive). */
export function zoneOffsetMs(at: number, timeZone: string): number {
  const [y, mo, d, h, mi, s] = wallClockIn(at, timeZone);
  return Date.UTC(y, mo - 1, d, h, mi, s) - Math.floor(at / 1000) * 1000;
}

/** The zone's UTC offset at an instant, whole minutes (east positive): what the morning projection takes. */
export function utcOffsetMinutes(timeZone: string, at: number): number {
  return Math.round(zoneOffsetMs(at, timeZone) / 60_000);
}
