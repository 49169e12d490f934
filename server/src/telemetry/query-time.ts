import { z } from 'zod';
import { invalidInput } from '../errors/app-error';

// JavaScript dates reach ±275,760 years and PostgreSQL timestamps 4713 BC to 294276 AD, but neither has a
// use for times before readings existed; year 0 (which PostgreSQL does not have) and the far ends of both
// calendars are refused here, before any query or any response header, with the field named.
/** Earliest time a query may name: 1970-01-01T00:00:00Z. */
export const EARLIEST_QUERY_TIME = Date.UTC(1970, 0, 1);
/** Latest time a query may name: 9999-12-31T23:59:59.999Z. */
export const LATEST_QUERY_TIME = Date.UTC(9999, 11, 31, 23, 59, 59, 999);

const ISO_WITH_ZONE = z.iso.datetime({ offset: true });

function rangeMessage(field: string): string {
  return `${field} must be between 1970-01-01 and 9999-12-31`;
}

/** A query time as a zod schema: ISO 8601 with a zone, inside the query calendar, as a Date. */
export function queryTimeSchema(field: string) {
  return z.iso
    .datetime({ offset: true, error: `${field} must be an ISO 8601 time` })
    .transform((text) => new Date(text))
    .refine((time) => time.getTime() >= EARLIEST_QUERY_TIME && time.getTime() <= LATEST_QUERY_TIME, {
      message: rangeMessage(field),
    });
}

/** Parses a query time for a service; `fallback` (ms since the epoch) when absent; throws naming `field`. */
export function parseQueryTime(field: string, value: unknown, fallback: number): Date {
  if (value === undefined) return new Date(fallback);
  const quoted = JSON.stringify(value)?.slice(0, 60) ?? String(value);
  if (typeof value !== 'string' || !ISO_WITH_ZONE.safeParse(value).success)
    throw invalidInput(field, `${field} must be an ISO 8601 time with a zone; got ${quoted}`);
  const time = Date.parse(value);
  if (!(time >= EARLIEST_QUERY_TIME && time <= LATEST_QUERY_TIME))
    throw invalidInput(field, `${rangeMessage(field)}; got ${quoted}`);
  return new Date(time);
}
