import { AnalyticsSettingError } from './analytics-error';
import { nextLocalTime } from './local-time';

describe('nextLocalTime', () => {
  it('finds 07:00 later the same day in UTC', () => {
    expect(nextLocalTime(Date.UTC(2026, 11, 2, 5, 30), '07:00', 0)).toBe(Date.UTC(2026, 11, 2, 7, 0));
  });

  it('moves to tomorrow once the time has passed, across midnight', () => {
    expect(nextLocalTime(Date.UTC(2026, 11, 2, 22, 0), '07:00', 0)).toBe(Date.UTC(2026, 11, 3, 7, 0));
    expect(nextLocalTime(Date.UTC(2026, 11, 2, 7, 0), '07:00', 0)).toBe(Date.UTC(2026, 11, 3, 7, 0));
  });

  it('works in the local day for offsets east and west of UTC', () => {
    // UTC+10 (ISO 8601 offsets, arithmetic): 21:00 UTC on the 2nd is 07:00 on the 3rd locally, so the next
    // 07:00 after 20:00 UTC is 21:00 UTC
    expect(nextLocalTime(Date.UTC(2026, 11, 2, 20, 0), '07:00', 600)).toBe(Date.UTC(2026, 11, 2, 21, 0));
    // UTC−05:00: 23:30 local on the 2nd is 04:30 UTC on the 3rd; the next 07:00 local is 12:00 UTC on the 3rd
    expect(nextLocalTime(Date.UTC(2026, 11, 3, 4, 30), '07:00', -300)).toBe(Date.UTC(2026, 11, 3, 12, 0));
    // UTC+05:45: 07:00 local is 01:15 UTC
    expect(nextLocalTime(Date.UTC(2026, 11, 2, 2, 0), '07:00', 345)).toBe(Date.UTC(2026, 11, 3, 1, 15));
  });

  it('refuses a time or offset that cannot be', () => {
    expect(() => nextLocalTime(0, '7am', 0)).toThrow(AnalyticsSettingError);
    expect(() => nextLocalTime(0, '24:00', 0)).toThrow(/24:00/);
    expect(() => nextLocalTime(0, '07:00', 900)).toThrow(/900/);
  });
});
