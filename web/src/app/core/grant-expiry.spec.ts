import { FormControl } from '@angular/forms';
import { expiryInDays, futureInstant, toLocalInputValue } from './grant-expiry';

describe('grant expiry', () => {
  const now = new Date(2026, 11, 2, 9, 5).getTime();

  it('formats a local instant for a datetime-local input (HTML "valid normalized local date and time string")', () => {
    // WHATWG HTML, 2.3.5.5 local dates and times: "YYYY-MM-DDTHH:mm".
    expect(toLocalInputValue(new Date(2026, 0, 3, 7, 4))).toBe('2026-01-03T07:04');
  });

  it('puts the 7-day quick pick a week after now', () => {
    expect(expiryInDays(7, now)).toBe(toLocalInputValue(new Date(now + 7 * 86_400_000)));
    expect(new Date(expiryInDays(7, now)).getTime() - now).toBe(7 * 86_400_000);
  });

  it('refuses an expiry in the past or right now', () => {
    const validator = futureInstant(() => now);
    expect(validator(new FormControl(toLocalInputValue(new Date(now)), { nonNullable: true }))).toEqual({
      past: true,
    });
    expect(validator(new FormControl('2026-12-01T09:00', { nonNullable: true }))).toEqual({ past: true });
  });

  it('accepts an expiry after now', () => {
    expect(futureInstant(() => now)(new FormControl(expiryInDays(1, now), { nonNullable: true }))).toBeNull();
  });
});
