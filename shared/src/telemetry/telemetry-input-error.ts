// The common base of every error raised while turning device input into readings, so an MQTT hook or an
// HTTP handler can catch one class and map it to `{ error: { code, message, field } }`.

/** Refused device input: a stable `code`, the JSON path of the offending `field` (e.g. `[2].v`), if any. */
export class TelemetryInputError extends Error {
  /** Stable, machine-readable reason; safe to branch on and to send back to the device's owner. */
  readonly code: string;
  /** Where in the input the problem is (`[2].v`, `voltage`); undefined when it concerns the whole payload. */
  readonly field: string | undefined;

  constructor(code: string, message: string, options: { field?: string; cause?: unknown } = {}) {
    super(message, options.cause === undefined ? undefined : { cause: options.cause });
    this.name = 'TelemetryInputError';
    this.code = code;
    this.field = options.field;
  }
}

const MAX_QUOTED_LENGTH = 60;

/** A short, log-safe rendering of a bad input value for an error message: numbers bare, the rest as JSON. */
export function quoteValue(value: unknown): string {
  if (typeof value === 'number' || typeof value === 'bigint') return String(value);
  if (value === undefined) return 'nothing';
  let text: string;
  try {
    text = JSON.stringify(value) ?? String(value);
  } catch {
    // Cycles and other unserialisable values only come from callers in-process, never from a payload.
    text = Object.prototype.toString.call(value);
  }
  return text.length > MAX_QUOTED_LENGTH ? `${text.slice(0, MAX_QUOTED_LENGTH)}…` : text;
}

/** An instant (ms since the epoch) for an error message; numbers no Date can hold are shown raw. */
export function quoteTime(epochMilliseconds: number): string {
  const date = new Date(epochMilliseconds);
  // Beyond ±8.64e15 ms a Date is invalid and toISOString throws; the raw number still says enough.
  return Number.isNaN(date.getTime()) ? `${epochMilliseconds} ms` : date.toISOString();
}
