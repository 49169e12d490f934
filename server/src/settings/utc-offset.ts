// Making a formatter costs about a hundred times using one (it loads the zone's rules), and a restart asks for
// a thousand systems' offsets at once; the zone names are a fixed list of a few hundred, so the cache is bounded.
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (formatter === undefined) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
    });
    // Only a zone the platform accepted gets here (the constructor throws for others), so the map stays bounded.
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** The UTC offset of an IANA time zone at an instant, minutes (east positive), from the platform's tz data. */
export function utcOffsetMinutes(timeZone: string, at: number): number {
  const parts = formatterFor(timeZone).formatToParts(new Date(at));
  const part = (type: string) => Number(parts.find((p) => p.type === type)!.value);
  const asUtc = Date.UTC(part('year'), part('month') - 1, part('day'), part('hour'), part('minute'));
  return Math.round((asUtc - Math.floor(at / 60_000) * 60_000) / 60_000);
}

/** Whether the platform knows the zone name. */
export function isKnownTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone });
    return true;
  } catch {
    return false;
  }
}
