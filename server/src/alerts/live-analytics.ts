import {
  analyticsConfigFromSettings,
  checkSilence,
  deriveSystemState,
  flagEpisodes,
  resolveSystemAnalyticsSettings,
  type BatteryReading,
  type DerivedState,
  type SystemAnalyticsSettings,
  type SystemAnalyticsState,
} from '@cellwarden/shared';
import type { Logger } from '../logger';
import type { SettingsRepository } from '../settings/settings-repository';
import { utcOffsetMinutes } from '../settings/utc-offset';
import type { ReadingRow, ReadingsRepository } from '../telemetry/readings-repository';
import type { AlertsRepository } from './alerts-repository';
import type { AlertsService } from './alerts-service';

// A late backlog is replayed this long after its last pack arrived (packs come in quick succession) …
const REPLAY_DELAY_MS = 2000;
// … from this long before its first reading, so flags that need a run-up (minimum durations, trends) see it.
const REPLAY_LEAD_MS = 30 * 60_000;

// Settings are re-read at least this often, so a zone's change to or from summer time reaches the projection.
const SETTINGS_TTL_MS = 10 * 60_000;

interface SystemRuntime {
  settings: SystemAnalyticsSettings;
  loadedAt: number;
  name: string;
  timeZone: string;
  /** The monitor whose readings drive the analytics; the others of the same bank are shown, not estimated. */
  leadDeviceId: string | null;
  state?: SystemAnalyticsState;
  derived?: DerivedState;
  /** Wall-clock arrival of the newest reading, to judge silence on the device's own clock. */
  lastReceivedAt?: number;
  lastMeasuredAt?: number;
  /** Keeps one system's readings in order while the next batch arrives. */
  queue: Promise<unknown>;
  /** Earliest measured time of late readings not yet replayed, and the timer that will replay them. */
  lateFrom?: number;
  replayTimer?: NodeJS.Timeout;
}

/**
 * Runs the shared analytics on every stored reading of every system: estimator, projections and flags,
 * keeping each system's small state in memory; flag transitions become alert events.
 */
export function createLiveAnalytics(deps: {
  settings: Pick<SettingsRepository, 'find'>;
  alerts: Pick<AlertsService, 'record'>;
  /** For replaying a late backlog's span from the stored readings. */
  readings: Pick<ReadingsRepository, 'leadMonitor' | 'listRaw' | 'quietSystems'>;
  alertsRepository: Pick<AlertsRepository, 'insertPastEpisode'>;
  /** Pushes a past alert found in a backlog to the live subscribers. */
  publish: (alert: import('@cellwarden/shared').AlertEvent) => void;
  logger: Logger;
  now: () => number;
}) {
  const runtimes = new Map<string, SystemRuntime>();
  const pending = new Map<string, Promise<SystemRuntime | undefined>>();

  async function load(systemId: string, previous?: SystemRuntime): Promise<SystemRuntime | undefined> {
    const [stored, leadDeviceId] = await Promise.all([
      deps.settings.find(systemId),
      deps.readings.leadMonitor(systemId),
    ]);
    if (!stored) return undefined;
    const now = deps.now();
    const config = analyticsConfigFromSettings(stored as never, utcOffsetMinutes(stored.timeZone, now));
    return {
      settings: resolveSystemAnalyticsSettings(config),
      loadedAt: now,
      name: stored.name,
      timeZone: stored.timeZone,
      leadDeviceId,
      state: previous?.state,
      derived: previous?.derived,
      lastReceivedAt: previous?.lastReceivedAt,
      lastMeasuredAt: previous?.lastMeasuredAt,
      queue: previous?.queue ?? Promise.resolve(),
    };
  }

  async function runtimeFor(systemId: string): Promise<SystemRuntime | undefined> {
    const existing = runtimes.get(systemId);
    if (existing && deps.now() - existing.loadedAt < SETTINGS_TTL_MS) return existing;
    if (!pending.has(systemId))
      pending.set(
        systemId,
        load(systemId, existing).finally(() => pending.delete(systemId)),
      );
    const loaded = await pending.get(systemId)!;
    if (loaded) runtimes.set(systemId, loaded);
    return loaded;
  }

  function step(runtime: SystemRuntime, systemId: string, reading: BatteryReading) {
    const result = deriveSystemState(runtime.state, reading, runtime.settings);
    runtime.state = result.state;
    runtime.derived = result.derived;
    runtime.lastReceivedAt = deps.now();
    runtime.lastMeasuredAt = Math.max(runtime.lastMeasuredAt ?? 0, reading.measuredAt);
    return { derived: result.derived, events: result.events, systemId };
  }

  /**
   * Readings older than the newest seen cannot go through the live state (its flags have moved on): their
   * span is replayed from the stored readings into a fresh state, and the episodes it held are recorded as
   * past alerts (not e-mailed: they are history by the time they are known).
   */
  function scheduleReplay(systemId: string, runtime: SystemRuntime, measuredAt: number) {
    runtime.lateFrom = Math.min(runtime.lateFrom ?? Number.POSITIVE_INFINITY, measuredAt);
    if (runtime.replayTimer) clearTimeout(runtime.replayTimer);
    runtime.replayTimer = setTimeout(() => void replay(systemId, runtime), REPLAY_DELAY_MS);
    runtime.replayTimer.unref();
  }

  async function replay(systemId: string, runtime: SystemRuntime) {
    const from = runtime.lateFrom!;
    runtime.lateFrom = undefined;
    runtime.replayTimer = undefined;
    try {
      const readings = await deps.readings.listRaw(
        systemId,
        new Date(from - REPLAY_LEAD_MS),
        new Date((runtime.lastMeasuredAt ?? from) + 1),
        runtime.leadDeviceId ?? undefined,
      );
      for (const episode of flagEpisodes(readings, runtime.settings)) {
        if (episode.endedAt < from) continue;
        const alert = await deps.alertsRepository.insertPastEpisode(systemId, episode);
        if (alert) deps.publish(alert);
      }
    } catch (error) {
      deps.logger.warn('late readings not replayed', { systemId, error: (error as Error).message });
    }
  }

  /**
   * A system whose monitors fell quiet before this process started sends nothing that would give it a runtime,
   * so the first sweep adopts every system whose newest reading arrived more than a minute ago, from that
   * reading and its arrival time: its silence is then judged like any other's. Systems still reporting get
   * their runtime from their next reading.
   */
  let adoptedQuiet = false;
  async function adoptQuietSystems(): Promise<void> {
    const quiet = await deps.readings.quietSystems(new Date(deps.now() - 60_000));
    for (const { systemId, receivedAt, reading } of quiet) {
      if (runtimes.get(systemId)?.state) continue;
      const runtime = await runtimeFor(systemId);
      if (!runtime || runtime.state) continue;
      const result = deriveSystemState(undefined, reading, runtime.settings);
      runtime.state = result.state;
      runtime.derived = result.derived;
      runtime.lastReceivedAt = receivedAt;
      runtime.lastMeasuredAt = reading.measuredAt;
    }
  }

  return {
    /** Flushes pending replays at once (shutdown and tests). */
    async replayNow(): Promise<void> {
      for (const [systemId, runtime] of runtimes)
        if (runtime.replayTimer) {
          clearTimeout(runtime.replayTimer);
          await replay(systemId, runtime);
        }
    },

    /** Runs the analytics over stored rows (in order per system); resolves with each row's derived state. */
    async process(rows: readonly ReadingRow[]): Promise<(DerivedState | null)[]> {
      const results: Promise<DerivedState | null>[] = rows.map(async (row) => {
        try {
          const runtime = await runtimeFor(row.systemId);
          if (!runtime) return null;
          // A second monitor's reading is shown as it is; feeding it to the estimator would interleave two banks'
          // worth of offsets and clocks into one state.
          if (runtime.leadDeviceId !== null && row.deviceId !== runtime.leadDeviceId) return null;
          const turn = runtime.queue.then(async () => {
            if (runtime.lastMeasuredAt !== undefined && row.reading.measuredAt < runtime.lastMeasuredAt) {
              scheduleReplay(row.systemId, runtime, row.reading.measuredAt);
              return runtime.derived ?? null;
            }
            const { derived, events } = step(runtime, row.systemId, row.reading);
            if (events.length > 0) await deps.alerts.record(row.systemId, runtime, events);
            return derived;
          });
          runtime.queue = turn.catch(() => undefined);
          return await turn;
        } catch (error) {
          deps.logger.error('analytics failed for a reading', {
            systemId: row.systemId,
            error: (error as Error).message,
          });
          return null;
        }
      });
      return Promise.all(results);
    },

    /** The latest derived state, or one worked out from the latest reading alone after a restart. */
    async derivedFor(systemId: string, latest: BatteryReading | null): Promise<DerivedState | null> {
      const runtime = await runtimeFor(systemId);
      if (!runtime) return null;
      if (runtime.derived) return runtime.derived;
      return latest ? deriveSystemState(undefined, latest, runtime.settings).derived : null;
    },

    /** Device silence has no reading to trigger it: checked on a timer, on the device's clock. */
    async sweepSilence(): Promise<void> {
      if (!adoptedQuiet) {
        adoptedQuiet = true;
        await adoptQuietSystems();
      }
      const now = deps.now();
      for (const [systemId, runtime] of runtimes) {
        if (!runtime.state || runtime.lastReceivedAt === undefined || runtime.lastMeasuredAt === undefined)
          continue;
        const deviceNow = runtime.lastMeasuredAt + (now - runtime.lastReceivedAt);
        const result = checkSilence(runtime.state.flags, deviceNow);
        runtime.state = { ...runtime.state, flags: result.state };
        if (result.events.length > 0) await deps.alerts.record(systemId, runtime, result.events);
      }
    },

    /** Forgets a system's cached settings after they changed. */
    settingsChanged(systemId: string) {
      const runtime = runtimes.get(systemId);
      if (runtime) runtime.loadedAt = 0;
    },
  };
}

export type LiveAnalytics = ReturnType<typeof createLiveAnalytics>;
