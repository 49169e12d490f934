import type { Sequelize } from 'sequelize';
import {
  analyticsConfigFromSettings,
  resolveSystemAnalyticsSettings,
  type FlagEvent,
  type SystemAnalyticsSettings,
} from '@cellwarden/shared';
import { createSettingsRepository } from '../settings/settings-repository';
import { utcOffsetMinutes } from '../settings/utc-offset';
import { createAlertsRepository } from './alerts-repository';
import { storeFlagEvent } from './alerts-service';

/**
 * Taking in the alerts of readings made elsewhere (the demo's simulated history): the seeder runs the shared
 * analytics over them and records each flag transition as the live path would, without notices or live
 * pushes (nobody was watching then). Like the health history import, it reads the system's settings itself.
 */
export function createAlertHistoryImport(sequelize: Sequelize) {
  const alerts = createAlertsRepository(sequelize);
  const settings = createSettingsRepository(sequelize);
  return {
    /** The system's analytics settings, with its time zone's offset at `now`. */
    async analyticsSettings(systemId: string, now: number): Promise<SystemAnalyticsSettings> {
      const stored = (await settings.find(systemId))!;
      return resolveSystemAnalyticsSettings(
        analyticsConfigFromSettings(stored as never, utcOffsetMinutes(stored.timeZone, now)),
      );
    },

    /** Stores one system's flag transitions in order: a start opens an event, the others update or close it. */
    async record(systemId: string, events: readonly FlagEvent[]): Promise<void> {
      for (const event of events) await storeFlagEvent(alerts, systemId, event);
    },
  };
}
