import {
  checkSilence,
  deriveSystemState,
  flagEpisodes,
  type BatteryReading,
  type DerivedState,
  type SystemAnalyticsState,
} from '@cellwarden/shared';
import type { Logger } from '../logger';
import type { SettingsRepository } from '../settings/settings-repository';
import type { ReadingRow, ReadingsRepository } from '../telemetry/readings-repository';
import { createAnalyticsSettingsLoader, type AnalyticsProfile } from './analytics-settings-loader';
import type { AlertsRepository } from './alerts-repository';
import type { AlertsService } from './alerts-service';

// A late backlog is replayed this long after its last pack arrived (packs come in quick succession) …
const REPLAY_DELAY_MS = 2000;
// … from this long before its first reading, so flags that need a run-up (minimum durations, trends) see it.
const REPLAY_LEAD_MS = 30 * 60_000;

// Settings are re-read at least this often, so a zone's change to or from summer time reaches the projection.
const SETTINGS_TTL_MS = 10 * 60_000;

interface SystemRuntime extends AnalyticsProfile {
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
  settings: Pick<SettingsRepository, 'findMany'>;
  alerts: Pick<AlertsService, 'record'>;
  /** For replaying a late backlog's span from the stored readings. */
  readings: Pick<ReadingsRepository, 'leadMonitors' | 'listRaw' | 'quietSystems'>;
  alertsRepository: Pick<AlertsRepository, 'insertPastEpisode'>;
  /** Pushes a past alert found in a backlog to the live subscribers. */
  publish: (alert: import('@cellwarden/shared').AlertEvent) => void;
  logger: Logger;
  now: () => number;
}) {
  const runtimes = new Map<string, SystemRuntime>();
  const pending = new Map<string, Promise<SystemRuntime | undefined>>();
  /** How often each system's settings were changed, to tell a load that began before a change. */
  const changes = new Map<string, number>();
  const loadProfile = createAnalyticsSettingsLoader({
    settings: deps.settings,
    readings: deps.readings,
    now: deps.now,
  });

  async function load(systemId: string): Promise<SystemRuntime | undefined> {
    const changesBefore = changes.get(systemId);
    const profile = await loadProfile(systemId);
    if (!profile) return undefined;
    const existing = runtimes.get(systemId);
    // Refreshed in place: readings queued on this runtime step the same state; a pending replay keeps its timer.
    const runtime: SystemRuntime = existing
      ? Object.assign(existing, profile)
      : { ...profile, queue: Promise.resolve() };
    // Changed while this load was under way: it may have read the old settings; the next reading asks again.
    if (changes.get(systemId) !== changesBefore) runtime.loadedAt = 0;
    runtimes.set(systemId, runtime);
    return runtime;
  }

  /** A system's runtime; loads for many systems asked in the same turn share one batched query. */
  function runtimeFor(systemId: string): Promise<SystemRuntime | undefined> {
    const existing = runtimes.get(systemId);
    if (existing && deps.now() - existing.loadedAt < SETTINGS_TTL_MS) return Promise.resolve(existing);
    let loading = pending.get(systemId);
    if (!loading) {
      loading = load(systemId).finally(() => pending.delete(systemId));
      pending.set(systemId, loading);
    }
    return loading;
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

  /** Runs one system's rows of a batch after the rows it already has in hand, one reading at a time. */
  async function processSystem(
    systemId: string,
    rows: readonly ReadingRow[],
    onDerived: (row: ReadingRow, derived: DerivedState | null) => void,
  ): Promise<void> {
    let runtime: SystemRuntime | undefined;
    try {
      runtime = await runtimeFor(systemId);
    } catch (error) {
      deps.logger.error('analytics failed for a reading', { systemId, error: (error as Error).message });
    }
    if (!runtime) {
      for (const row of rows) announce(onDerived, row, null);
      return;
    }
    const ready = runtime;
    const turn = ready.queue.then(() => stepRows(ready, systemId, rows, onDerived));
    ready.queue = turn.catch(() => undefined);
    await turn;
  }

  async function stepRows(
    runtime: SystemRuntime,
    systemId: string,
    rows: readonly ReadingRow[],
    onDerived: (row: ReadingRow, derived: DerivedState | null) => void,
  ): Promise<void> {
    for (const row of rows) {
      let derived: DerivedState | null = null;
      try {
        const stepped = stepRow(runtime, systemId, row);
        // Awaited only when an alert is being stored: an await per reading would cost a microtask turn each.
        derived = stepped instanceof Promise ? await stepped : stepped;
      } catch (error) {
        deps.logger.error('analytics failed for a reading', { systemId, error: (error as Error).message });
      }
      announce(onDerived, row, derived);
    }
  }

  /** One reading through the live state; a promise only when its flag events are stored. */
  function stepRow(
    runtime: SystemRuntime,
    systemId: string,
    row: ReadingRow,
  ): DerivedState | null | Promise<DerivedState | null> {
    // A second monitor's reading is shown as it is; feeding it to the estimator would interleave two banks'
    // worth of offsets and clocks into one state.
    if (runtime.leadDeviceId !== null && row.deviceId !== runtime.leadDeviceId) return null;
    if (runtime.lastMeasuredAt !== undefined && row.reading.measuredAt < runtime.lastMeasuredAt) {
      scheduleReplay(systemId, runtime, row.reading.measuredAt);
      return runtime.derived ?? null;
    }
    const { derived, events } = step(runtime, systemId, row.reading);
    if (events.length === 0) return derived;
    return deps.alerts.record(systemId, runtime, events).then(() => derived);
  }

  function announce(
    onDerived: (row: ReadingRow, derived: DerivedState | null) => void,
    row: ReadingRow,
    derived: DerivedState | null,
  ) {
    try {
      onDerived(row, derived);
    } catch (error) {
      deps.logger.error('derived state not announced', { error: (error as Error).message });
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
    // All asked at once, so their settings arrive through the same batched loads as the readings' systems.
    await Promise.all(
      quiet.map(async ({ systemId, receivedAt, reading }) => {
        if (runtimes.get(systemId)?.state) return;
        try {
          const runtime = await runtimeFor(systemId);
          if (!runtime || runtime.state) return;
          const result = deriveSystemState(undefined, reading, runtime.settings);
          runtime.state = result.state;
          runtime.derived = result.derived;
          runtime.lastReceivedAt = receivedAt;
          runtime.lastMeasuredAt = reading.measuredAt;
        } catch (error) {
          deps.logger.warn('quiet system not adopted', { systemId, error: (error as Error).message });
        }
      }),
    );
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

    /**
     * Runs the analytics over stored rows, in order per system, and hands each row's derived state to `onDerived`
     * as soon as that row is done (null for a second monitor's reading, a system without settings, or a failure).
     * One turn per system and batch, not one chain of promises per reading: a batch of 500 readings from 50
     * systems is 50 turns. A system's alert is stored before its next reading is stepped, as before; other
     * systems' readings do not wait for it.
     */
    processEach(
      rows: readonly ReadingRow[],
      onDerived: (row: ReadingRow, derived: DerivedState | null) => void,
    ) {
      for (const [systemId, systemRows] of bySystem(rows))
        void processSystem(systemId, systemRows, onDerived);
    },

    /** Runs the analytics over stored rows (in order per system); resolves with each row's derived state. */
    async process(rows: readonly ReadingRow[]): Promise<(DerivedState | null)[]> {
      const results: (DerivedState | null)[] = rows.map(() => null);
      const index = new Map(rows.map((row, i) => [row, i]));
      await Promise.all(
        [...bySystem(rows)].map(([systemId, systemRows]) =>
          processSystem(systemId, systemRows, (row, derived) => (results[index.get(row)!] = derived)),
        ),
      );
      return results;
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
      changes.set(systemId, (changes.get(systemId) ?? 0) + 1);
      const runtime = runtimes.get(systemId);
      if (runtime) runtime.loadedAt = 0;
    },
  };
}

/** The rows of each system, in the order they came. */
function bySystem(rows: readonly ReadingRow[]): Map<string, ReadingRow[]> {
  const groups = new Map<string, ReadingRow[]>();
  for (const row of rows) {
    const group = groups.get(row.systemId);
    if (group) group.push(row);
    else groups.set(row.systemId, [row]);
  }
  return groups;
}

export type LiveAnalytics = ReturnType<typeof createLiveAnalytics>;
