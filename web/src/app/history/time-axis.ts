import { formatInstant } from '../core/date-time';

const DAY = 24 * 60 * 60 * 1000;
/** Beyond this span the axis is read in months. */
export const MONTHS_FROM_MS = 62 * DAY;

/**
 * The label of one time-axis tick in the viewer's locale and zone: a time of day, with the day under it on
 * the first tick and wherever the day changes; midnight as the day alone; the month for spans of months.
 */
export function timeTickLabel(
  value: number,
  previous: number | null,
  spanMs: number,
  locale: string,
): string | string[] {
  const at = new Date(value);
  const midnight = at.getHours() === 0 && at.getMinutes() === 0;
  if (spanMs > MONTHS_FROM_MS && midnight) {
    return at.getDate() === 1 ? formatInstant(value, 'month', locale) : formatInstant(value, 'day', locale);
  }
  if (midnight) return formatInstant(value, 'day', locale);
  const time = formatInstant(value, 'time', locale);
  const newDay = previous === null || new Date(previous).toDateString() !== at.toDateString();
  return newDay ? [time, formatInstant(value, 'day', locale)] : time;
}
