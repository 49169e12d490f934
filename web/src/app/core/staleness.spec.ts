import { STALE_AFTER_MS, isStale, staleAfter } from './staleness';

describe('isStale', () => {
  const now = 1_000_000_000;
  it('treats a reading from one minute ago as fresh', () => expect(isStale(now - 60_000, now)).toBe(false));
  it('treats a reading just over two minutes old as stale', () =>
    expect(isStale(now - STALE_AFTER_MS - 1, now)).toBe(true));
  it('treats a missing reading as stale', () => expect(isStale(null, now)).toBe(true));
  it('waits two intervals when a monitor reports every five minutes', () => {
    expect(isStale(now - 9 * 60_000, now, 5 * 60_000)).toBe(false);
    expect(isStale(now - 10 * 60_000 - 1, now, 5 * 60_000)).toBe(true);
  });
});

describe('staleAfter', () => {
  it('never drops below two minutes for fast monitors', () =>
    expect(staleAfter(10_000)).toBe(STALE_AFTER_MS));
  it('falls back to two minutes when the interval is unknown', () =>
    expect(staleAfter(null)).toBe(STALE_AFTER_MS));
});
