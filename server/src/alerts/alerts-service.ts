import type { AlertEvent, FlagEvent, PublicUser } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import { notFound } from '../errors/app-error';
import type { Logger } from '../logger';
import type { SystemsService } from '../systems/systems-service';
import type { AlertNotices } from './alert-notices';
import type { AlertsRepository } from './alerts-repository';
import { isUuid } from '../database/sql-values';

/**
 * Stores one flag transition: a start opens an event (`created` false when one of its kind was open already),
 * an escalation updates the open one and an end closes it. The live path and the history import share it.
 */
export async function storeFlagEvent(
  repository: Pick<AlertsRepository, 'open' | 'update'>,
  systemId: string,
  event: FlagEvent,
): Promise<{ alert: AlertEvent | undefined; created: boolean }> {
  if (event.transition === 'start')
    return repository.open({
      systemId,
      kind: event.kind,
      severity: event.severity,
      startedAt: event.at,
      peakValue: event.peak,
      unit: event.unit,
    });
  const alert = await repository.update(systemId, event.kind, {
    severity: event.severity,
    peakValue: event.peak,
    endedAt: event.transition === 'end' ? event.at : undefined,
  });
  return { alert, created: false };
}

/** Alert events: recorded from the flag engine's transitions, listed and acknowledged through the policy. */
export function createAlertsService(deps: {
  repository: AlertsRepository;
  systems: SystemsService;
  audit: AuditService;
  notices: AlertNotices;
  logger: Logger;
  /** Pushes an event to the system's live subscribers. */
  publish: (alert: AlertEvent) => void;
}) {
  return {
    async list(user: PublicUser, systemId: string, range: { from: Date; to: Date; activeOnly: boolean }) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return deps.repository.list(system.id, range.from, range.to, range.activeOnly, 1000);
    },

    async acknowledge(
      user: PublicUser,
      systemId: string,
      alertId: string,
      note: string,
    ): Promise<AlertEvent> {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      const alert = isUuid(alertId)
        ? await deps.repository.acknowledge(system.id, alertId, user.id, note)
        : undefined;
      if (!alert) throw notFound('Alert');
      await deps.audit.record(system.id, user, 'alert.acknowledged', `${alert.kind}: ${note}`);
      deps.publish(alert);
      return alert;
    },

    /** Stores one system's flag transitions in order, pushes them live and sends the e-mail notices. */
    async record(systemId: string, system: { name: string; timeZone: string }, events: readonly FlagEvent[]) {
      for (const event of events) {
        const { alert, created } = await storeFlagEvent(deps.repository, systemId, event);
        if (alert && created) void deps.notices.send(alert, 'start', system);
        if (alert && event.transition === 'end') void deps.notices.send(alert, 'end', system);
        if (alert) deps.publish(alert);
      }
    },
  };
}

export type AlertsService = ReturnType<typeof createAlertsService>;
