import { QueryTypes, type Sequelize } from 'sequelize';
import {
  analyticsConfigFromSettings,
  deriveSystemState,
  resolveSystemAnalyticsSettings,
  type SystemAnalyticsState,
} from '@cellwarden/shared';
import { createAlertsRepository } from '../../server/src/alerts/alerts-repository';
import { createSettingsRepository } from '../../server/src/settings/settings-repository';
import { utcOffsetMinutes } from '../../server/src/settings/utc-offset';
import { createReadingsRepository } from '../../server/src/telemetry/readings-repository';
import { SCENARIOS } from '../../simulator/src/scenario-catalog';
import { simulateReadings } from '../../simulator/src/simulate-readings';
import { DEMO_DEVICES } from './demo-scenario';

const BATCH = 1000;

/**
 * Gives each demo system the past `days` of readings from its scenario, stored through the same repository
 * as live ingest (so the rollups are built), and runs the same analytics over them so the alert history is
 * what the live path would have recorded. A system that already has readings is left alone.
 */
export async function seedDemoHistory(
  sequelize: Sequelize,
  options: { days: number; intervalSeconds: number; now: number; log?: (line: string) => void },
): Promise<number> {
  const readings = createReadingsRepository(sequelize);
  const alerts = createAlertsRepository(sequelize);
  const settingsRepository = createSettingsRepository(sequelize);
  let stored = 0;
  for (const [index, device] of DEMO_DEVICES.entries()) {
    const [row] = await sequelize.query<{ systemId: string }>(
      `SELECT system_id AS "systemId" FROM devices WHERE id = :id`,
      {
        replacements: { id: device.id },
        type: QueryTypes.SELECT,
      },
    );
    if (!row || (await readings.countForSystem(row.systemId)) > 0) continue;
    const count = Math.floor((options.days * 86400) / options.intervalSeconds);
    const start = options.now - count * options.intervalSeconds * 1000;
    const series = simulateReadings(SCENARIOS[device.scenario], {
      seed: 1000 + index,
      start,
      intervalSeconds: options.intervalSeconds,
      count,
    }).readings;
    for (let i = 0; i < series.length; i += BATCH) {
      const batch = series
        .slice(i, i + BATCH)
        .map((reading) => ({ systemId: row.systemId, deviceId: device.id, reading }));
      stored += (await readings.insertBatch(batch)).length;
      options.log?.(
        `demo history ${device.id}: ${Math.min(i + BATCH, series.length)}/${series.length} readings`,
      );
    }
    const stored_settings = (await settingsRepository.find(row.systemId))!;
    const settings = resolveSystemAnalyticsSettings(
      analyticsConfigFromSettings(
        stored_settings as never,
        utcOffsetMinutes(stored_settings.timeZone, options.now),
      ),
    );
    let state: SystemAnalyticsState | undefined;
    for (const reading of series) {
      const result = deriveSystemState(state, reading, settings);
      state = result.state;
      for (const event of result.events) {
        if (event.transition === 'start')
          await alerts.open({
            systemId: row.systemId,
            kind: event.kind,
            severity: event.severity,
            startedAt: event.at,
            peakValue: event.peak,
            unit: event.unit,
          });
        else
          await alerts.update(row.systemId, event.kind, {
            severity: event.severity,
            peakValue: event.peak,
            endedAt: event.transition === 'end' ? event.at : undefined,
          });
      }
    }
  }
  return stored;
}
