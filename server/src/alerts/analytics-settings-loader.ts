import DataLoader from 'dataloader';
import {
  analyticsConfigFromSettings,
  resolveSystemAnalyticsSettings,
  type SystemAnalyticsSettings,
} from '@cellwarden/shared';
import type { SettingsRepository } from '../settings/settings-repository';
import { utcOffsetMinutes } from '../settings/utc-offset';
import type { ReadingsRepository } from '../telemetry/readings-repository';

/** Most systems one settings query asks for; a larger crowd is split into several queries. */
export const SETTINGS_BATCH_LIMIT = 500;

/** What the live analytics need to know of a system before they can run its readings. */
export interface AnalyticsProfile {
  settings: SystemAnalyticsSettings;
  loadedAt: number;
  name: string;
  timeZone: string;
  /** The monitor whose readings drive the analytics; the others of the same bank are shown, not estimated. */
  leadDeviceId: string | null;
}

/**
 * Loads systems' analytics settings and lead monitors, many at once: every load asked for in the same turn
 * of the event loop (a stored batch of readings, the start-up adoption of quiet systems) is answered by one
 * settings query and one lead-monitor query over all of their ids, up to `batchLimit` ids each. After a
 * restart a whole fleet reports its first readings within seconds; one query per system held the live path up.
 * (DataLoader gathers a turn's loads on process.nextTick: a spec with fake timers must leave nextTick real.)
 *
 * A system that no longer exists resolves to undefined; a system whose stored settings cannot be resolved
 * rejects its own loads only. Nothing is cached here: the analytics keep what was loaded, and decide when to
 * ask again.
 */
export function createAnalyticsSettingsLoader(deps: {
  settings: Pick<SettingsRepository, 'findMany'>;
  readings: Pick<ReadingsRepository, 'leadMonitors'>;
  now: () => number;
  batchLimit?: number;
}): (systemId: string) => Promise<AnalyticsProfile | undefined> {
  const loader = new DataLoader<string, AnalyticsProfile | undefined>(
    async (systemIds) => {
      const [stored, leads] = await Promise.all([
        deps.settings.findMany(systemIds),
        deps.readings.leadMonitors(systemIds),
      ]);
      const now = deps.now();
      return systemIds.map((systemId) => {
        const found = stored.get(systemId);
        if (!found) return undefined;
        // An Error in its slot rejects this system's loads and no other's (DataLoader's per-key contract).
        try {
          const config = analyticsConfigFromSettings(found as never, utcOffsetMinutes(found.timeZone, now));
          return {
            settings: resolveSystemAnalyticsSettings(config),
            loadedAt: now,
            name: found.name,
            timeZone: found.timeZone,
            leadDeviceId: leads.get(systemId) ?? null,
          };
        } catch (error) {
          return error instanceof Error ? error : new Error(String(error));
        }
      });
    },
    // The analytics hold one load per system at a time, and their own copy with its time-to-live.
    { cache: false, maxBatchSize: deps.batchLimit ?? SETTINGS_BATCH_LIMIT },
  );
  return (systemId) => loader.load(systemId);
}
