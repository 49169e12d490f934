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
