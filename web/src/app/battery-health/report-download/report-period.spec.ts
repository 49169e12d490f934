import { dayInputValue, reportPeriod } from './report-period';

describe('reportPeriod', () => {
  it('runs from the first day’s local midnight to the midnight after the last day', () => {
    const { from, to, problem } = reportPeriod('2026-03-01', '2026-03-31');
    expect(problem).toBeUndefined();
    expect(from).toEqual(new Date(2026, 2, 1));
    expect(to).toEqual(new Date(2026, 3, 1));
  });

  it('accepts a single day', () => {
    const { from, to } = reportPeriod('2026-03-14', '2026-03-14');
    expect(to!.getTime() - from!.getTime()).toBeGreaterThanOrEqual(23 * 3_600_000);
  });

  it('names the field that stops the download', () => {
    expect(reportPeriod('', '2026-03-14').problem).toMatch(/^First day/);
    expect(reportPeriod('2026-03-14', 'soon').problem).toMatch(/^Last day/);
    expect(reportPeriod('2026-03-14', '2026-03-13').problem).toMatch(/not be before/);
    expect(reportPeriod('2020-01-01', '2026-03-13').problem).toMatch(/at most 800 days/);
  });

  it('writes a day as the date input expects it', () => {
    expect(dayInputValue(new Date(2026, 0, 5, 13).getTime())).toBe('2026-01-05');
  });
});
