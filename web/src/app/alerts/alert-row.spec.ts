import type { AlertEvent } from '@cellwarden/shared';
import {
  alertMatches,
  alertSortValue,
  endsOnAnotherDay,
  momentQuery,
  peakText,
  toAlertRow,
} from './alert-row';

const HOUR = 3_600_000;
const T = Date.UTC(2026, 11, 1, 22, 0, 0);
const alert = (over: Partial<AlertEvent> = {}): AlertEvent => ({
  id: 'al-1',
  systemId: 'van-1',
  kind: 'low-charge',
  severity: 'warning',
  startedAt: T,
  endedAt: T + HOUR,
  peakValue: 17,
  unit: '%',
  acknowledgedAt: null,
  acknowledgedBy: null,
  note: null,
  ...over,
});

describe('toAlertRow', () => {
  it('calls an unfinished alert active', () =>
    expect(toAlertRow(alert({ endedAt: null })).state).toBe('active'));
  it('calls an acknowledged alert acknowledged even while active', () =>
    expect(toAlertRow(alert({ endedAt: null, acknowledgedAt: T })).state).toBe('acknowledged'));
});

describe('alertMatches', () => {
  const ended = toAlertRow(alert({ note: 'Fridge left on overnight' }));
  it('finds an alert by words of its note', () =>
    expect(alertMatches(ended, { text: 'fridge', state: 'all' })).toBe(true));
  it('hides ended alerts when only active ones are asked for', () =>
    expect(alertMatches(ended, { text: '', state: 'active' })).toBe(false));
  it('hides acknowledged alerts when only unacknowledged ones are asked for', () =>
    expect(
      alertMatches(toAlertRow(alert({ acknowledgedAt: T })), { text: '', state: 'unacknowledged' }),
    ).toBe(false));
});

describe('alertSortValue', () => {
  it('sorts critical above warning', () =>
    expect(alertSortValue(toAlertRow(alert({ severity: 'critical' })), 'severity')).toBeGreaterThan(
      alertSortValue(toAlertRow(alert()), 'severity') as number,
    ));
});

describe('momentQuery', () => {
  it('frames an alert with an hour either side', () =>
    expect(momentQuery(alert(), T + 10 * HOUR)).toEqual({
      from: '2026-12-01T21:00:00.000Z',
      to: '2026-12-02T00:00:00.000Z',
    }));
  it('stops an active alert’s frame at now', () =>
    expect(momentQuery(alert({ endedAt: null }), T + 2 * HOUR).to).toBe('2026-12-02T00:00:00.000Z'));
});

describe('peakText', () => {
  // RFC 8428 §12.1: "Cel" is degrees Celsius; NIST SP 811 (2008), B.9: 51.5 °C × 1.8 + 32 = 124.7 °F.
  it('shows a temperature peak in the person’s unit', () => {
    expect(peakText({ peakValue: 51.5, unit: 'Cel' }, 'C')).toBe('51.5 °C');
    expect(peakText({ peakValue: 51.5, unit: 'Cel' }, 'F')).toBe('124.7 °F');
  });
  // RFC 8428 §12.1: "%EL" is remaining battery energy level in percent.
  it('shows a state-of-charge peak as a percentage', () =>
    expect(peakText({ peakValue: 17, unit: '%EL' }, 'C')).toBe('17 %'));
  it('keeps other units as sent', () =>
    expect(peakText({ peakValue: 11.456, unit: 'V' }, 'C')).toBe('11.46 V'));
  it('shows a dash without a value', () => expect(peakText({ peakValue: null, unit: 'V' }, 'C')).toBe('—'));
});

describe('peakText with the flag engine’s units', () => {
  // NIST SP 811 (2008), B.9: °F = °C × 1.8 + 32; −3 °C = 26.6 °F.
  it('shows a temperature recorded in °C in °F when the person prefers it', () =>
    expect(peakText({ peakValue: -3, unit: '°C' }, 'F')).toBe('26.6 °F'));
});

describe('endsOnAnotherDay', () => {
  const at = (day: number, hour: number) => new Date(2026, 11, day, hour).getTime();
  it('is true for an alert that ran overnight', () =>
    expect(endsOnAnotherDay({ startedAt: at(2, 23), endedAt: at(3, 2) })).toBe(true));
  it('is false within one day and while still active', () => {
    expect(endsOnAnotherDay({ startedAt: at(2, 10), endedAt: at(2, 12) })).toBe(false);
    expect(endsOnAnotherDay({ startedAt: at(2, 10), endedAt: null })).toBe(false);
  });
});
