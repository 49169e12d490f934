import {
  MAX_RANGE_MS,
  fromLocalInput,
  matchingPreset,
  parseInstant,
  presetRange,
  rangeFromQuery,
  rangeProblem,
  toLocalInput,
  widen,
} from './time-range';

const NOW = Date.UTC(2026, 11, 2, 12, 0, 0);
const HOUR = 3_600_000;

describe('presetRange', () => {
  it('ends each preset now and reaches back its length', () => {
    expect(presetRange('1h', NOW)).toEqual({ from: NOW - HOUR, to: NOW });
    expect(presetRange('7d', NOW).from).toBe(NOW - 7 * 24 * HOUR);
    // Calendar arithmetic: a common year has 365 days.
    expect(presetRange('1y', NOW).from).toBe(NOW - 365 * 24 * HOUR);
  });
});

describe('matchingPreset', () => {
  it('recognises a preset range ending now', () =>
    expect(matchingPreset(presetRange('6h', NOW), NOW)).toBe('6h'));
  it('treats a range ending in the past as custom', () =>
    expect(matchingPreset({ from: NOW - 2 * HOUR, to: NOW - HOUR }, NOW)).toBeNull());
});

describe('rangeProblem', () => {
  it('accepts a 24-hour range', () => expect(rangeProblem(presetRange('24h', NOW))).toBeNull());
  it('refuses an end before the start', () =>
    expect(rangeProblem({ from: NOW, to: NOW - 1 })).toContain('after'));
  it('refuses more than a year', () =>
    expect(rangeProblem({ from: NOW - MAX_RANGE_MS - 1, to: NOW })).toContain('one year'));
  it('refuses a missing end', () => expect(rangeProblem({ from: NOW, to: NaN })).toContain('both'));
});

describe('rangeFromQuery', () => {
  it('reads ISO 8601 instants from a deep link', () => {
    // RFC 3339 §5.6 date-time with a Z offset.
    const range = rangeFromQuery('2026-12-01T22:00:00Z', '2026-12-02T02:00:00Z', NOW);
    expect(range).toEqual({ from: Date.UTC(2026, 11, 1, 22), to: Date.UTC(2026, 11, 2, 2) });
  });
  it('reads epoch milliseconds too', () => expect(parseInstant('1000')).toBe(1000));
  it('falls back to the last 24 hours for a broken link', () =>
    expect(rangeFromQuery('yesterday', undefined, NOW)).toEqual(presetRange('24h', NOW)));
});

describe('widen', () => {
  it('doubles the span around the same middle', () =>
    expect(widen({ from: NOW - 4 * HOUR, to: NOW - 2 * HOUR }, NOW)).toEqual({
      from: NOW - 5 * HOUR,
      to: NOW - HOUR,
    }));
  it('never reaches past now', () =>
    expect(widen({ from: NOW - HOUR, to: NOW }, NOW)).toEqual({ from: NOW - 2 * HOUR, to: NOW }));
});

describe('datetime-local values', () => {
  it('round-trips an instant to the minute in local time', () => {
    const instant = new Date(2026, 5, 7, 8, 9).getTime();
    expect(toLocalInput(instant)).toBe('2026-06-07T08:09');
    expect(fromLocalInput('2026-06-07T08:09')).toBe(instant);
  });
  it('gives NaN for an empty field', () => expect(fromLocalInput('')).toBeNaN());
});
