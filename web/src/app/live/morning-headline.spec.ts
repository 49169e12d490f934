import type { DerivedState } from '@cellwarden/shared';
import { ampHoursRemaining, morningHeadline } from './morning-headline';

// 20:00 UTC on a December evening; 07:00 in Lisbon (UTC+0 in winter) is 11 h later.
const NOW = Date.UTC(2026, 11, 2, 20, 0);
const MORNING = Date.UTC(2026, 11, 3, 7, 0);
const HOUR = 3_600_000;

const derived = (over: Partial<DerivedState> = {}): DerivedState => ({
  stateOfCharge: 71,
  stateOfChargeSource: 'reported',
  hoursToEmpty: 15.5,
  hoursToFull: null,
  meanCurrent: -8,
  byMorning: { at: MORNING, stateOfCharge: 42.4, crossesLowAt: null },
  activeFlags: [],
  ...over,
});
const atHome = { now: NOW, locale: 'en-GB', systemZone: 'Europe/Lisbon', viewerZone: 'Europe/London' };

describe('morningHeadline', () => {
  it('says the charge lasts until morning and with how much to spare', () =>
    expect(morningHeadline(derived(), atHome)).toEqual({
      lasts: true,
      text: 'Lasts until 07:00 with 42 % to spare',
    }));

  it('says when the charge runs out if that is before morning', () =>
    expect(
      morningHeadline(
        derived({
          hoursToEmpty: 7.5,
          byMorning: { at: MORNING, stateOfCharge: 0, crossesLowAt: NOW + HOUR },
        }),
        atHome,
      ),
    ).toEqual({ lasts: false, text: 'Runs out around 03:30, before 07:00' }));

  it('names the system’s zone when the viewer’s clock differs', () =>
    expect(morningHeadline(derived(), { ...atHome, viewerZone: 'America/Halifax' })?.text).toBe(
      'Lasts until 07:00 (system time, Western European Standard Time) with 42 % to spare',
    ));

  it('writes the time with the viewer’s kind of clock', () =>
    expect(morningHeadline(derived(), { ...atHome, locale: 'en-US' })?.text).toMatch(
      /^Lasts until 7:00\sAM with 42 % to spare$/,
    ));

  it('says nothing without a projection', () =>
    expect(morningHeadline(derived({ byMorning: null }), atHome)).toBeNull());
});

describe('ampHoursRemaining', () => {
  it('is the state of charge of the usable capacity', () =>
    expect(ampHoursRemaining(71, 180)).toBeCloseTo(127.8));
  it('is unknown without a state of charge', () => expect(ampHoursRemaining(null, 180)).toBeNull());
});
