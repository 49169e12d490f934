import { z } from 'zod';
import { EARLIEST_QUERY_TIME, LATEST_QUERY_TIME, queryRangeMessage } from '@cellwarden/shared';
import { invalidInput } from '../errors/app-error';

// The query calendar and the query-time schema are shared (shared/src/api/common-schemas.ts); re-exported here
// for the routes that import them from telemetry.
export { EARLIEST_QUERY_TIME, LATEST_QUERY_TIME, isoTimeSchema as queryTimeSchema } from '@cellwarden/shared';

const ISO_WITH_ZONE = z.iso.datetime({ offset: true });

/** Parses a query time for a service; `fallback` (ms since the epoch) when absent; throws naming `field`. */
export function parseQueryTime(field: string, value: unknown, fallback: number): Date {
  if (value === undefined) return new Date(fallback);
  const quoted = JSON.stringify(value)?.slice(0, 60) ?? String(value);
  if (typeof value !== 'string' || !ISO_WITH_ZONE.safeParse(value).success)
    throw invalidInput(field, `${field} must be an ISO 8601 time with a zone; got ${quoted}`);
  const time = Date.parse(value);
  if (!(time >= EARLIEST_QUERY_TIME && time <= LATEST_QUERY_TIME))
    throw invalidInput(field, `${queryRangeMessage(field)}; got ${quoted}`);
  return new Date(time);
}
