import type { PublicUser } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { invalidInput } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsRepository } from './readings-repository';

/** Most points one history series returns, whatever the range. */
export const POINT_BUDGET = 2000;
const MAX_RANGE_MS = 400 * 24 * 3600 * 1000;

function parseTime(field: string, value: unknown, fallback: number): Date {
  if (value === undefined) return new Date(fallback);
  const time = typeof value === 'string' ? Date.parse(value) : NaN;
  if (!Number.isFinite(time))
    throw invalidInput(field, `${field} must be an ISO 8601 time; got ${JSON.stringify(value)}`);
  return new Date(time);
}

/** History of one system's readings, within the point budget. */
export function createReadingsService(deps: {
  systems: SystemsService;
  repository: ReadingsRepository;
  audit: AuditService;
  now: () => number;
}) {
  return {
    async history(user: PublicUser, systemId: string, query: { from?: unknown; to?: unknown }) {
      const system = await deps.systems.getFor(user, systemId);
      const to = parseTime('to', query.to, deps.now());
      const from = parseTime('from', query.from, to.getTime() - 3600 * 1000);
      if (from >= to) throw invalidInput('from', 'from must be before to');
      if (to.getTime() - from.getTime() > MAX_RANGE_MS)
        throw invalidInput('from', 'range must be at most 400 days');
      const bucketMs = Math.ceil((to.getTime() - from.getTime()) / POINT_BUDGET);
      const points = await deps.repository.listDownsampled(system.id, from, to, bucketMs, POINT_BUDGET);
      await deps.audit.record(
        system.id,
        user,
        'readings.viewed',
        `${from.toISOString()} – ${to.toISOString()}`,
      );
      return { resolution: bucketMs <= 1000 ? 'raw' : `${Math.round(bucketMs / 1000)}s`, points };
    },
  };
}

export type ReadingsService = ReturnType<typeof createReadingsService>;
