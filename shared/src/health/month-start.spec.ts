import { AnalyticsSettingError } from '../analytics/analytics-error';
import { monthStartIn } from './month-start';

describe('monthStartIn', () => {
  it('finds local midnight on the first of the month in winter time', () => {
    // Europe/Oslo is UTC+1 in January (IANA tz database): 1 January 00:00 local is 31 December 23:00 UTC.
    expect(monthStartIn(Date.UTC(2026, 0, 20, 12), 'Europe/Oslo')).toBe(Date.UTC(2025, 11, 31, 23));
  });

  it('follows daylight saving time', () => {
    // Oslo is UTC+2 from the last Sunday of March (IANA tz database): 1 April 00:00 local is 31 March 22:00 UTC.
    expect(monthStartIn(Date.UTC(2026, 3, 15), 'Europe/Oslo')).toBe(Date.UTC(2026, 2, 31, 22));
  });

  it('puts an instant just after local midnight into the new local month', () => {
    expect(monthStartIn(Date.UTC(2026, 1, 28, 23, 30), 'Europe/Oslo')).toBe(Date.UTC(2026, 1, 28, 23));
    expect(monthStartIn(Date.UTC(2026, 1, 28, 23, 30), 'UTC')).toBe(Date.UTC(2026, 1, 1));
  });

  it('handles zones west of Greenwich', () => {
    // America/Halifax keeps Atlantic Daylight Time, UTC−3, in July (IANA tz database).
    expect(monthStartIn(Date.UTC(2026, 6, 10), 'America/Halifax')).toBe(Date.UTC(2026, 6, 1, 3));
  });

  it('names the field when the zone is not one', () => {
    expect(() => monthStartIn(0, 'Mars/Olympus')).toThrow(AnalyticsSettingError);
    expect(() => monthStartIn(0, 'Mars/Olympus')).toThrow(/timeZone/);
  });
});
