import type { AuditAction, PublicUser } from '@cellwarden/shared';
import type { Logger } from '../logger';
import type { SystemsService } from '../systems/systems-service';
import type { AuditRepository } from './audit-repository';

// Control characters would let a crafted detail forge lines in an exported or e-mailed audit.
const clean = (text: string) => text.replace(/\p{Cc}/gu, ' ').slice(0, 500);

/** Who viewed, exported or changed which system's data, and when; readable by those the policy allows. */
export function createAuditService(deps: {
  repository: AuditRepository;
  systems: SystemsService;
  logger: Logger;
}) {
  return {
    /** Records an entry; a failure is logged, never turned into a failed request for what was already done. */
    async record(
      systemId: string,
      actor: PublicUser | null,
      action: AuditAction,
      detail = '',
    ): Promise<void> {
      try {
        await deps.repository.insert({ systemId, actorId: actor?.id ?? null, action, detail: clean(detail) });
      } catch (error) {
        deps.logger.error('audit entry not recorded', { systemId, action, error: (error as Error).message });
      }
    },

    async list(user: PublicUser, systemId: string, query: { limit?: number; before?: number }) {
      const system = await deps.systems.getFor(user, systemId, 'read-audit');
      return deps.repository.list(system.id, query.limit ?? 100, query.before ?? null);
    },
  };
}

export type AuditService = ReturnType<typeof createAuditService>;
