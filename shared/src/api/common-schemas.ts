// zod schemas for the values every edge of the API takes the same way: ids, times and the query calendar.
// Functions only (no schema built at load time), so a bundle that uses none of them carries no zod.
import { z } from 'zod';

/** The text form of a uuid key (any version; PostgreSQL refuses anything else with an error, not a miss). */
export const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

// JavaScript dates reach ±275,760 years and PostgreSQL timestamps 4713 BC to 294276 AD, but neither has a
// use for times before readings existed; year 0 (which PostgreSQL does not have) and the far ends of both
// calendars are refused at the edge, before any query or any response header, with the field named.
/** Earliest time a query may name: 1970-01-01T00:00:00Z. */
export const EARLIEST_QUERY_TIME = Date.UTC(1970, 0, 1);
/** Latest time a query may name: 9999-12-31T23:59:59.999Z. */
export const LATEST_QUERY_TIME = Date.UTC(9999, 11, 31, 23, 59, 59, 999);

/** The refusal of a time outside the query calendar, naming the field. */
export function queryRangeMessage(field: string): string {
  return `${field} must be between 1970-01-01 and 9999-12-31`;
}

/** An id (uuid) as a zod schema, refused naming `field`. */
export function idSchema(field: string) {
  return z.string({ error: `${field} must be an id` }).regex(UUID_PATTERN, `${field} must be an id`);
}

/** A query time as a zod schema: ISO 8601 with a zone, inside the query calendar, as a Date. */
export function isoTimeSchema(field: string) {
  return z.iso
    .datetime({ offset: true, error: `${field} must be an ISO 8601 time` })
    .transform((text) => new Date(text))
    .refine((time) => time.getTime() >= EARLIEST_QUERY_TIME && time.getTime() <= LATEST_QUERY_TIME, {
      message: queryRangeMessage(field),
    });
}

/** A time in milliseconds since the epoch (the API's time unit), as a positive whole number. */
export function epochMsSchema(field: string) {
  return z.coerce
    .number({ error: `${field} must be a time in ms` })
    .int()
    .positive();
}
