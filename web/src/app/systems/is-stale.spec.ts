import { STALE_AFTER_MS, isStale } from './is-stale';

describe('isStale', () => {
  const now = 1_000_000_000;
  it('treats a reading from one minute ago as fresh', () => expect(isStale(now - 60_000, now)).toBe(false));
  it('treats a reading just over two minutes old as stale', () =>
    expect(isStale(now - STALE_AFTER_MS - 1, now)).toBe(true));
  it('treats a missing reading as stale', () => expect(isStale(null, now)).toBe(true));
});
