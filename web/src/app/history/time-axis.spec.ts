import { formatInstant } from '../core/date-time';
import { timeTickLabel } from './time-axis';

// Ticks are in the viewer's zone; build them from local clock times so the spec holds in any zone.
const local = (day: number, hour: number, minute = 0) => new Date(2026, 11, day, hour, minute).getTime();
const HOUR = 3_600_000;

describe('timeTickLabel', () => {
  it('writes times within one day, with the date on the first tick only', () => {
    expect(timeTickLabel(local(2, 10), null, 6 * HOUR, 'en-GB')).toEqual(['10:00', 'Wed 2 Dec']);
    expect(timeTickLabel(local(2, 11), local(2, 10), 6 * HOUR, 'en-GB')).toBe('11:00');
  });

  it('adds the date where the day changes across a range of days', () =>
    expect(timeTickLabel(local(3, 6), local(2, 18), 7 * 24 * HOUR, 'en-GB')).toEqual(['06:00', 'Thu 3 Dec']));

  it('writes midnight as the day', () =>
    expect(timeTickLabel(local(3, 0), local(2, 12), 7 * 24 * HOUR, 'en-GB')).toBe('Thu 3 Dec'));

  it('writes month starts as the month over a year', () =>
    expect(timeTickLabel(new Date(2026, 10, 1).getTime(), null, 365 * 24 * HOUR, 'en-GB')).toBe(
      formatInstant(new Date(2026, 10, 1).getTime(), 'month', 'en-GB'),
    ));

  it('uses the locale’s clock', () =>
    expect(timeTickLabel(local(2, 19, 30), local(2, 19), 6 * HOUR, 'en-US')).toMatch(/^7:30\sPM$/));
});
