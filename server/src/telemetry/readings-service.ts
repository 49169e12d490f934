import type { PublicUser } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { isUuid } from '../database/sql-values';
import { invalidInput } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import { parseQueryTime } from './query-time';
import type { ReadingsRepository } from './readings-repository';

/** Most points one history series returns, whatever the range. */
export const POINT_BUDGET = 2000;
const MAX_RANGE_MS = 400 * 24 * 3600 * 1000;

/** History of one system's readings, within the point budget. */
export function createReadingsService(deps: {
  systems: Pick<SystemsService, 'authorize'>;
  repository: Pick<ReadingsRepository, 'listDownsampled'>;
  audit: Pick<AuditService, 'record'>;
  now: () => number;
}) {
  return {
    async history(user: PublicUser, systemId: string, query: { from?: unknown; to?: unknown }) {
      const to = parseQueryTime('to', query.to, deps.now());
      const from = parseQueryTime('from', query.from, to.getTime() - 3600 * 1000);
      if (from >= to) throw invalidInput('from', 'from must be before to');
      if (to.getTime() - from.getTime() > MAX_RANGE_MS)
        throw invalidInput('from', 'range must be at most 400 days');
      const bucketMs = Math.ceil((to.getTime() - from.getTime()) / POINT_BUDGET);
      // The points are read while the access policy decides (its lookups would otherwise come first); nothing
      // read is answered unless access is granted, and an id that is not a uuid goes to the policy alone (404).
      const reading = isUuid(systemId)
        ? deps.repository.listDownsampled(systemId, from, to, bucketMs, POINT_BUDGET)
        : undefined;
      reading?.catch(() => undefined); // settled below, or dropped when access is refused
      const system = await deps.systems.authorize(user, systemId);
      // The view is recorded as the answer goes out, not before it: recording never throws (a failed insert is
      // logged), so waiting for its commit would only delay the answer.
      void deps.audit.record(
        system.id,
        user,
        'readings.viewed',
        `${from.toISOString()} – ${to.toISOString()}`,
      );
      const points = await (reading ??
        deps.repository.listDownsampled(system.id, from, to, bucketMs, POINT_BUDGET));
      return { resolution: bucketMs <= 1000 ? 'raw' : `${Math.round(bucketMs / 1000)}s`, points };
    },
  };
}

export type ReadingsService = ReturnType<typeof createReadingsService>;
