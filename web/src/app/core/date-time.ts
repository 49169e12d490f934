// One way of writing instants for the whole dashboard, in the viewer's locale (24-hour where the locale uses
// it) through Intl, keyed by Angular's LOCALE_ID. Optional `timeZone` shows a system's own clock.

/** How an instant is written: date and time, time of day, a day, or a month. */
export type DateTimeStyle = 'dateTime' | 'time' | 'day' | 'month';

const OPTIONS: Record<DateTimeStyle, Intl.DateTimeFormatOptions> = {
  dateTime: { dateStyle: 'medium', timeStyle: 'short' },
  time: { timeStyle: 'short' },
  day: { weekday: 'short', day: 'numeric', month: 'short' },
  month: { month: 'short', year: 'numeric' },
};

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(style: DateTimeStyle, locale: string, timeZone?: string): Intl.DateTimeFormat {
  const key = `${style}|${locale}|${timeZone ?? ''}`;
  let found = formatters.get(key);
  if (!found) {
    found = new Intl.DateTimeFormat(locale, { ...OPTIONS[style], timeZone });
    formatters.set(key, found);
  }
  return found;
}

/** An instant (ms since the epoch) written in one of the dashboard's styles; '—' for no instant. */
export function formatInstant(
  ms: number | null | undefined,
  style: DateTimeStyle,
  locale: string,
  timeZone?: string,
): string {
  if (ms == null || !Number.isFinite(ms)) return '—';
  return formatter(style, locale, timeZone).format(ms);
}

/** The viewer's own time zone (IANA name). */
export function viewerTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone;
}

/** Whether two IANA zones keep the same clock at `at` (e.g. "Europe/Paris" and "Europe/Berlin"). */
export function sameClock(zoneA: string, zoneB: string, at: number): boolean {
  if (zoneA === zoneB) return true;
  const offset = (zone: string) =>
    new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: 'longOffset' })
      .formatToParts(at)
      .find((p) => p.type === 'timeZoneName')?.value;
  try {
    return offset(zoneA) === offset(zoneB);
  } catch {
    return false;
  }
}

/** A zone's name as people read it, e.g. "Central European Time" or "Lisbon" for Europe/Lisbon. */
export function zoneName(zone: string, locale: string, at: number): string {
  try {
    const name = new Intl.DateTimeFormat(locale, { timeZone: zone, timeZoneName: 'long' })
      .formatToParts(at)
      .find((p) => p.type === 'timeZoneName')?.value;
    return name ?? zone;
  } catch {
    return zone;
  }
}
