import type { Sequelize } from 'sequelize';
import type { CapacitySample, ChargeEpisode } from '@cellwarden/shared';
import { createAlertsRepository } from '../alerts/alerts-repository';
import {
  createBatteryHealthRepository,
  type HealthCheckpoint,
  type HealthSystem,
} from './battery-health-repository';

/**
 * Taking in battery history made elsewhere (the demo's generated year): the samples and checkpoint are stored
 * as the health job would have left them, and charging below freezing becomes past alerts.
 */
export function createHealthHistoryImport(sequelize: Sequelize) {
  const repository = createBatteryHealthRepository(sequelize);
  const alerts = createAlertsRepository(sequelize);
  return {
    /** The system's battery facts; undefined when it has health figures already (nothing to import). */
    async systemWithoutHistory(systemId: string): Promise<HealthSystem | undefined> {
      if (await repository.findCheckpoint(systemId)) return undefined;
      return repository.findSystem(systemId);
    },

    /** Stores the samples and the checkpoint in one transaction. */
    save(checkpoint: HealthCheckpoint, samples: readonly CapacitySample[]): Promise<void> {
      return sequelize.transaction((transaction) =>
        repository.saveProgress(checkpoint, samples, transaction),
      );
    },

    /** Each cold-charging episode as a past alert, unless one of its kind already overlaps it. */
    async recordColdCharging(systemId: string, episodes: readonly ChargeEpisode[]): Promise<void> {
      for (const episode of episodes)
        await alerts.insertPastEpisode(systemId, {
          kind: 'cold-charging',
          severity: 'critical',
          startedAt: episode.start,
          endedAt: episode.end,
          peak: episode.lowestTemperature,
          unit: '°C',
        });
    },
  };
}
