import { formatInstant, sameClock, zoneName } from './date-time';

const AT = Date.UTC(2026, 11, 2, 19, 5);

describe('formatInstant', () => {
  it('writes a 24-hour clock where the locale uses one and a 12-hour clock where it does not', () => {
    expect(formatInstant(AT, 'time', 'en-GB', 'UTC')).toBe('19:05');
    expect(formatInstant(AT, 'time', 'de', 'UTC')).toBe('19:05');
    expect(formatInstant(AT, 'time', 'en-US', 'UTC')).toMatch(/^7:05\sPM$/);
  });

  it('orders the date the locale’s way', () => {
    expect(formatInstant(AT, 'dateTime', 'en-GB', 'UTC')).toBe('2 Dec 2026, 19:05');
    expect(formatInstant(AT, 'dateTime', 'de', 'UTC')).toBe('02.12.2026, 19:05');
  });

  it('shows the clock of a given zone', () =>
    // Europe/Lisbon keeps UTC+0 in winter; Europe/Berlin UTC+1.
    expect(formatInstant(AT, 'time', 'en-GB', 'Europe/Berlin')).toBe('20:05'));

  it('writes a dash for no instant', () => expect(formatInstant(null, 'dateTime', 'en-GB')).toBe('—'));
});

describe('sameClock', () => {
  it('treats zones with the same offset at that moment as one clock', () => {
    expect(sameClock('Europe/Paris', 'Europe/Berlin', AT)).toBe(true);
    expect(sameClock('Europe/Lisbon', 'Europe/Berlin', AT)).toBe(false);
  });
});

describe('zoneName', () => {
  it('names a zone in the viewer’s language', () =>
    expect(zoneName('America/Halifax', 'en-GB', AT)).toBe('Atlantic Standard Time'));
});
