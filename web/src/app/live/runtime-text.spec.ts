import { formatHours } from './runtime-text';

describe('formatHours', () => {
  it('shows under an hour in minutes', () => expect(formatHours(0.75)).toBe('45 min'));
  it('shows hours and minutes below two days', () => expect(formatHours(3 + 1 / 3)).toBe('3 h 20 min'));
  it('drops zero minutes', () => expect(formatHours(5)).toBe('5 h'));
  it('shows days and hours for long runtimes', () => expect(formatHours(52)).toBe('2 d 4 h'));
  it('gives nothing for a missing or negative estimate', () => {
    expect(formatHours(null)).toBeNull();
    expect(formatHours(-1)).toBeNull();
    expect(formatHours(Infinity)).toBeNull();
  });
});
