import type { AlertEvent } from '@cellwarden/shared';
import { flagText } from '../core/flag-text';
import { TemperatureUnit, formatTemperature } from '../core/temperature-unit';

/** An alert as the table shows it. */
export interface AlertRow extends AlertEvent {
  title: string;
  /** 'active', 'ended' or 'acknowledged'. */
  state: 'active' | 'ended' | 'acknowledged';
}

/** Which alerts the table shows. */
export interface AlertFilter {
  text: string;
  state: 'all' | 'active' | 'unacknowledged';
}

/** Margin shown either side of an alert on the history chart, ms. */
export const MOMENT_MARGIN_MS = 60 * 60 * 1000;

/** A table row from an alert. */
export function toAlertRow(alert: AlertEvent): AlertRow {
  const state = alert.acknowledgedAt !== null ? 'acknowledged' : alert.endedAt === null ? 'active' : 'ended';
  return { ...alert, title: flagText(alert.kind).title, state };
}

/** Whether a row passes the filter: state first, then text in its title, kind, severity or note. */
export function alertMatches(row: AlertRow, filter: AlertFilter): boolean {
  if (filter.state === 'active' && row.endedAt !== null) return false;
  if (filter.state === 'unacknowledged' && row.acknowledgedAt !== null) return false;
  const needle = filter.text.trim().toLowerCase();
  if (!needle) return true;
  return [row.title, row.kind, row.severity, row.note ?? ''].join(' ').toLowerCase().includes(needle);
}

/** The value a column sorts by. */
export function alertSortValue(row: AlertRow, column: string): string | number {
  switch (column) {
    case 'severity':
      return row.severity === 'critical' ? 1 : 0;
    case 'title':
      return row.title.toLowerCase();
    case 'startedAt':
      return row.startedAt;
    case 'endedAt':
      // Active alerts sort as the newest.
      return row.endedAt ?? Number.MAX_SAFE_INTEGER;
    case 'peakValue':
      return row.peakValue ?? -Infinity;
    case 'state':
      return row.state;
    default:
      return '';
  }
}

/** The history query for an alert's moment: an hour either side, not past `now`. */
export function momentQuery(alert: AlertEvent, now: number): { from: string; to: string } {
  const from = alert.startedAt - MOMENT_MARGIN_MS;
  const to = Math.min(now, (alert.endedAt ?? now) + MOMENT_MARGIN_MS);
  return {
    from: new Date(from).toISOString(),
    to: new Date(Math.max(to, from + MOMENT_MARGIN_MS)).toISOString(),
  };
}

// The flag engine records temperatures as "°C"; SenML (RFC 8428 §12.1) names degrees Celsius "Cel".
const CELSIUS_UNITS = new Set(['Cel', '°C', 'C']);

/** The worst value of an alert with its unit; temperatures (°C or SenML "Cel") in the person's unit. */
export function peakText(
  alert: Pick<AlertEvent, 'peakValue' | 'unit'>,
  temperatureUnit: TemperatureUnit,
): string {
  if (alert.peakValue == null) return '—';
  if (CELSIUS_UNITS.has(alert.unit)) return formatTemperature(alert.peakValue, temperatureUnit);
  const digits = Math.abs(alert.peakValue) >= 100 ? 0 : 2;
  const value = Number(alert.peakValue.toFixed(digits)).toString();
  return `${value} ${alert.unit === '%EL' ? '%' : alert.unit}`;
}

/** Whether an alert ended on a later calendar day (viewer's clock) than it started: its end then needs a date. */
export function endsOnAnotherDay(alert: Pick<AlertEvent, 'startedAt' | 'endedAt'>): boolean {
  if (alert.endedAt === null) return false;
  return new Date(alert.startedAt).toDateString() !== new Date(alert.endedAt).toDateString();
}
