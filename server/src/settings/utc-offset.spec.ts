import { isKnownTimeZone, utcOffsetMinutes } from './utc-offset';

describe('utcOffsetMinutes', () => {
  it('gives the standard and summer offsets of a zone with daylight saving', () => {
    // IANA tz database: Europe/Berlin is UTC+1 (CET) in winter and UTC+2 (CEST) in summer.
    expect(utcOffsetMinutes('Europe/Berlin', Date.UTC(2026, 0, 15, 12))).toBe(60);
    expect(utcOffsetMinutes('Europe/Berlin', Date.UTC(2026, 6, 15, 12))).toBe(120);
  });

  it('handles zones west of Greenwich and half-hour offsets', () => {
    // IANA tz database: America/Denver is UTC−7 (MST) in January; Asia/Kolkata is UTC+5:30 all year.
    expect(utcOffsetMinutes('America/Denver', Date.UTC(2026, 0, 15, 12))).toBe(-420);
    expect(utcOffsetMinutes('Asia/Kolkata', Date.UTC(2026, 0, 15, 12))).toBe(330);
    expect(utcOffsetMinutes('UTC', Date.UTC(2026, 0, 15, 12))).toBe(0);
  });

  it('tells known zone names from unknown ones', () => {
    expect(isKnownTimeZone('Europe/Oslo')).toBe(true);
    expect(isKnownTimeZone('Mars/Olympus_Mons')).toBe(false);
  });
});
