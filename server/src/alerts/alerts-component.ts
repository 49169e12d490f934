import type { AlertEvent } from '@cellwarden/shared';
import type { AuditService } from '../audit/audit-service';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import type { SettingsRepository } from '../settings/settings-repository';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsHub } from '../telemetry/readings-hub';
import type { ReadingsRepository } from '../telemetry/readings-repository';
import { createAlertNotices } from './alert-notices';
import type { AlertsRepository } from './alerts-repository';
import { createAlertsService } from './alerts-service';
import { createLiveAnalytics } from './live-analytics';

/**
 * The alerts component: alert events and their notices, the live analytics every stored reading passes through,
 * and the periodic silence check (a system whose monitors fell quiet raises its alert without a reading).
 */
export function createAlertsComponent(deps: {
  repository: AlertsRepository;
  settings: SettingsRepository;
  readings: ReadingsRepository;
  systems: SystemsService;
  audit: AuditService;
  hub: Pick<ReadingsHub, 'publish'>;
  mailer: Mailer;
  logger: Logger;
  now: () => number;
  silenceCheckSeconds: number;
}) {
  const { repository, logger, now } = deps;
  const publish = (alert: AlertEvent) =>
    deps.hub.publish({
      systemId: alert.systemId,
      message: { type: 'alert', systemId: alert.systemId, alert },
    });
  const alerts = createAlertsService({
    repository,
    systems: deps.systems,
    audit: deps.audit,
    notices: createAlertNotices({ repository, mailer: deps.mailer, logger, now }),
    logger,
    publish,
  });
  const analytics = createLiveAnalytics({
    settings: deps.settings,
    alerts,
    readings: deps.readings,
    alertsRepository: repository,
    publish,
    logger,
    now,
  });
  const silenceSweep = setInterval(() => {
    analytics.sweepSilence().catch((error) => logger.warn('silence check failed', { error: String(error) }));
  }, deps.silenceCheckSeconds * 1000);
  silenceSweep.unref();
  return {
    alerts,
    analytics,
    stop(): void {
      clearInterval(silenceSweep);
    },
  };
}
