// Small helpers for the repositories' SQL, so each concern is written once.
import { UUID_PATTERN } from '@cellwarden/shared';

/** Whether a path parameter can be a uuid key; checked before querying, since PostgreSQL refuses a bad one with an error. */
export function isUuid(value: string): boolean {
  return UUID_PATTERN.test(value);
}

/** A timestamptz column as milliseconds since the epoch, the time unit of the API. */
export function epochMs(column: string): string {
  return `(extract(epoch FROM ${column}) * 1000)::float8`;
}

const NEEDS_ESCAPE = /["\\]/;

/**
 * A one-dimensional PostgreSQL array literal for a bound parameter (PostgreSQL documentation §8.15.6, "Array
 * Value Input"): elements double-quoted with backslash and double quote escaped by a backslash, NULL bare,
 * numbers as JavaScript writes them (float8 input reads that form, NaN and Infinity included). node-postgres
 * builds the same literal from a JavaScript array, with two regular expressions per element and a local-time
 * format per Date; the readings insert binds ten such arrays of up to 500 elements per batch, so it builds its
 * own from ISO times (half the CPU per row, measured).
 */
export function arrayLiteral(values: readonly (string | number | null)[]): string {
  let literal = '{';
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (i > 0) literal += ',';
    if (value === null) literal += 'NULL';
    else if (typeof value === 'number') literal += String(value);
    else literal += NEEDS_ESCAPE.test(value) ? `"${value.replace(/[\\"]/g, '\\$&')}"` : `"${value}"`;
  }
  return literal + '}';
}
