/** A span of time, ms since the epoch, `from` before `to`. */
export interface TimeRange {
  from: number;
  to: number;
}

/** The preset spans of the range picker. */
export type RangePreset = '1h' | '6h' | '24h' | '7d' | '30d' | '1y';

const HOUR = 60 * 60 * 1000;
const DAY = 24 * HOUR;

/** Length of each preset, ms. */
export const PRESET_SPANS: Record<RangePreset, number> = {
  '1h': HOUR,
  '6h': 6 * HOUR,
  '24h': DAY,
  '7d': 7 * DAY,
  '30d': 30 * DAY,
  '1y': 365 * DAY,
};

/** How each preset reads on its button and to a screen reader. */
export const PRESET_LABELS: Record<RangePreset, { short: string; long: string }> = {
  '1h': { short: '1 h', long: 'Last hour' },
  '6h': { short: '6 h', long: 'Last 6 hours' },
  '24h': { short: '24 h', long: 'Last 24 hours' },
  '7d': { short: '7 d', long: 'Last 7 days' },
  '30d': { short: '30 d', long: 'Last 30 days' },
  '1y': { short: '1 y', long: 'Last year' },
};

/** The shortest range worth asking for, ms; a smaller drag is treated as a click. */
export const MIN_RANGE_MS = 60 * 1000;
/** The longest range the picker allows (a leap year), ms. */
export const MAX_RANGE_MS = 366 * DAY;

/** The range a preset covers, ending now. */
export function presetRange(preset: RangePreset, now: number): TimeRange {
  return { from: now - PRESET_SPANS[preset], to: now };
}

/** The preset a range matches (ending within a minute of now), or null for a custom range. */
export function matchingPreset(range: TimeRange, now: number): RangePreset | null {
  if (Math.abs(now - range.to) > 60_000) return null;
  const span = range.to - range.from;
  const match = (Object.keys(PRESET_SPANS) as RangePreset[]).find(
    (p) => Math.abs(PRESET_SPANS[p] - span) < 60_000,
  );
  return match ?? null;
}

/** Why a range cannot be shown, or null when it can. */
export function rangeProblem(range: TimeRange): string | null {
  if (!Number.isFinite(range.from) || !Number.isFinite(range.to)) return 'Enter both a start and an end.';
  if (range.to <= range.from) return 'The end must be after the start.';
  if (range.to - range.from < MIN_RANGE_MS) return 'Choose a range of at least one minute.';
  if (range.to - range.from > MAX_RANGE_MS) return 'Choose a range of at most one year.';
  return null;
}

/** An instant from a query parameter: ISO 8601 or milliseconds since the epoch; NaN when unreadable. */
export function parseInstant(value: string | null | undefined): number {
  if (value == null || value === '') return NaN;
  return /^\d+$/.test(value) ? Number(value) : Date.parse(value);
}

/** The range named by `from`/`to` query parameters, or the last 24 hours when they are missing or wrong. */
export function rangeFromQuery(from: string | undefined, to: string | undefined, now: number): TimeRange {
  const range = { from: parseInstant(from), to: parseInstant(to) };
  return rangeProblem(range) === null ? range : presetRange('24h', now);
}

/** The range twice as long around the same middle, not past `now` (zoom out). */
export function widen(range: TimeRange, now: number): TimeRange {
  const span = Math.min((range.to - range.from) * 2, MAX_RANGE_MS);
  const middle = (range.from + range.to) / 2;
  const to = Math.min(now, middle + span / 2);
  return { from: to - span, to };
}

/** A value for `<input type="datetime-local">` in local time, to the minute. */
export function toLocalInput(ms: number): string {
  const d = new Date(ms);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Milliseconds from an `<input type="datetime-local">` value read as local time; NaN when empty. */
export function fromLocalInput(value: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})/.exec(value);
  if (!match) return NaN;
  const [, y, mo, d, h, mi] = match.map(Number);
  return new Date(y, mo - 1, d, h, mi).getTime();
}
