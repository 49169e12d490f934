import { QueryTypes, type Sequelize } from 'sequelize';
import { deriveSystemState, type SystemAnalyticsState } from '@cellwarden/shared';
import { createAlertHistoryImport } from '../../server/src/alerts/alert-history-import';
import { createReadingsHistoryImport } from '../../server/src/telemetry/readings-history-import';
import { SCENARIOS } from '../../simulator/src/scenario-catalog';
import { playScenario } from '../../simulator/src/simulate-readings';
import { DEMO_DEVICES } from './demo-scenario';

const BATCH = 1000;

/** Where the demo's one timeline began, so the live simulators carry it on without a seam. */
export interface DemoTimeline {
  /** The first simulated reading, epoch ms. */
  origin: number;
  /** The live simulators' reporting interval, s: the history is simulated at it too. */
  intervalSeconds: number;
  /** Seed of each demo device's simulation. */
  seeds: Record<string, number>;
}

/** The seed of the k-th demo device's timeline. */
export const demoSeed = (index: number) => 1000 + index;

/**
 * Gives each demo system the past `days` of readings from its scenario, stored through the same insert
 * as live ingest (so the rollups are built), and runs the same analytics over them so the alert history is
 * what the live path would have recorded. The scenario is simulated at the live simulators' interval and
 * one reading per `storedEverySeconds` kept, so a simulator resumed from the returned timeline continues
 * the same pack (charge, temperature, voltage) where the history ends: no seam. A system that already has
 * readings is left alone (and no timeline returned).
 */
export async function seedDemoHistory(
  sequelize: Sequelize,
  options: {
    days: number;
    liveIntervalSeconds: number;
    storedEverySeconds: number;
    now: number;
    log?: (line: string) => void;
  },
): Promise<{ stored: number; timeline?: DemoTimeline }> {
  const every = Math.max(1, Math.round(options.storedEverySeconds / options.liveIntervalSeconds));
  const step = every * options.liveIntervalSeconds * 1000;
  const origin = Math.floor((options.now - options.days * 86400_000) / step) * step;
  const timeline: DemoTimeline = { origin, intervalSeconds: options.liveIntervalSeconds, seeds: {} };
  const readings = createReadingsHistoryImport(sequelize);
  const alerts = createAlertHistoryImport(sequelize);
  let stored = 0;
  for (const [index, device] of DEMO_DEVICES.entries()) {
    // History follows each bank's lead monitor; a second monitor's readings start when it goes live.
    if (device.monitorOf) continue;
    const [row] = await sequelize.query<{ systemId: string }>(
      `SELECT system_id AS "systemId" FROM devices WHERE id = :id`,
      {
        replacements: { id: device.id },
        type: QueryTypes.SELECT,
      },
    );
    if (!row || (await readings.countForSystem(row.systemId)) > 0) continue;
    timeline.seeds[device.id] = demoSeed(index);
    const series = [];
    const play = playScenario(SCENARIOS[device.scenario], {
      seed: demoSeed(index),
      start: origin,
      intervalSeconds: options.liveIntervalSeconds,
    });
    for (let i = 0; ; i++) {
      const { reading } = play.next().value!;
      if (reading.measuredAt >= options.now) break;
      if (i % every === 0) series.push(reading);
    }
    for (let i = 0; i < series.length; i += BATCH) {
      const batch = series
        .slice(i, i + BATCH)
        .map((reading) => ({ systemId: row.systemId, deviceId: device.id, reading }));
      stored += (await readings.store(batch)).length;
      options.log?.(
        `demo history ${device.id}: ${Math.min(i + BATCH, series.length)}/${series.length} readings`,
      );
    }
    const settings = await alerts.analyticsSettings(row.systemId, options.now);
    let state: SystemAnalyticsState | undefined;
    for (const reading of series) {
      const result = deriveSystemState(state, reading, settings);
      state = result.state;
      await alerts.record(row.systemId, result.events);
    }
  }
  return { stored, timeline: Object.keys(timeline.seeds).length > 0 ? timeline : undefined };
}
