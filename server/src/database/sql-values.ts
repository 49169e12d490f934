// Small helpers for the repositories' SQL, so each concern is written once.

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Whether a path parameter can be a uuid key; checked before querying, since PostgreSQL refuses a bad one with an error. */
export function isUuid(value: string): boolean {
  return UUID.test(value);
}

/** A timestamptz column as milliseconds since the epoch, the time unit of the API. */
export function epochMs(column: string): string {
  return `(extract(epoch FROM ${column}) * 1000)::float8`;
}
