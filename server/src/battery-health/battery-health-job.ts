import {
  createCapacityTracker,
  createLifeCycleAccumulator,
  type BatterySetup,
  type CapacitySample,
  type LifeCycleAccumulator,
} from '@cellwarden/shared';
import type { Transaction } from 'sequelize';
import type { Logger } from '../logger';
import type { BatteryHealthRepository, HealthCheckpoint, HealthSystem } from './battery-health-repository';

/** Bounds of one run per system, so a system with a long backlog is worked through over several runs. */
export interface HealthJobLimits {
  /** Minute rollups fed to the capacity tracker per system and run (default 20,160: two weeks). */
  minutesPerRun?: number;
  /** Hour rollups fed to the life-cycle accumulator per system and run (default 9,000: a year). */
  hoursPerRun?: number;
}

/** What one run did for one system. */
export interface HealthRunResult {
  systemId: string;
  minutes: number;
  hours: number;
  samples: number;
  /** Whether late hours made the life-cycle figures start again from the hour rollups. */
  rebuilt: boolean;
}

const HOUR_MS = 3600_000;
const MINUTE_MS = 60_000;
const REBUILD_PAGE = 5000;

/** The battery setup of a system, as the capacity tracker reads it. */
export function batterySetupOf(system: HealthSystem): BatterySetup {
  return {
    chemistry: system.chemistry,
    nominalVoltage: system.nominalVoltage,
    ratedCapacityAh: system.ratedCapacityAh,
    usableCapacityAh: system.usableCapacityAh,
  };
}

/** A checkpoint for a system the job has not seen, or whose usable capacity the owner changed. */
export function emptyCheckpoint(system: HealthSystem): HealthCheckpoint {
  return {
    systemId: system.id,
    capacityState: null,
    minutesThrough: null,
    lifecycleState: null,
    hoursThrough: null,
    usableAh: system.usableCapacityAh,
    hoursReadingCount: 0,
    lateRebuilds: 0,
    coveredFrom: null,
  };
}

/**
 * The incremental battery-health job: for each system, feeds only the complete minute rollups after its
 * checkpoint to the capacity tracker and the complete hour rollups after it to the life-cycle accumulator,
 * then stores the new samples and the new checkpoint in the same transaction. Hours that gained readings
 * after they were consumed (late data) make the life-cycle figures start again from the hour rollups; the
 * capacity tracker never goes back (the minutes it passed are not read again, see DEVELOPERS.md).
 */
export function createBatteryHealthJob(deps: {
  repository: BatteryHealthRepository;
  logger: Pick<Logger, 'warn'>;
  limits?: HealthJobLimits;
}) {
  const minutesPerRun = deps.limits?.minutesPerRun ?? 20_160;
  const hoursPerRun = deps.limits?.hoursPerRun ?? 9000;
  const { repository } = deps;

  async function rebuildLifeCycle(
    checkpoint: HealthCheckpoint,
    transaction: Transaction,
  ): Promise<{ accumulator: LifeCycleAccumulator; readings: number }> {
    const accumulator = createLifeCycleAccumulator(checkpoint.usableAh);
    let readings = 0;
    for (let from: number | null = null; ;) {
      const hours = await repository.completeHours(
        checkpoint.systemId,
        { from, to: checkpoint.hoursThrough! },
        REBUILD_PAGE,
        transaction,
      );
      for (const hour of hours) {
        accumulator.push(hour);
        readings += hour.readingCount;
      }
      if (hours.length < REBUILD_PAGE) break;
      from = hours[hours.length - 1].start + HOUR_MS;
    }
    return { accumulator, readings };
  }

  async function runSystem(systemId: string, transaction: Transaction): Promise<HealthRunResult> {
    const system = (await repository.findSystem(systemId, transaction))!;
    let checkpoint = (await repository.findCheckpoint(systemId, transaction)) ?? emptyCheckpoint(system);
    // Cycles are counted against the usable capacity: a changed capacity starts the figures again.
    if (checkpoint.usableAh !== system.usableCapacityAh)
      checkpoint = { ...emptyCheckpoint(system), lateRebuilds: checkpoint.lateRebuilds };

    let accumulator = createLifeCycleAccumulator(checkpoint.usableAh, checkpoint.lifecycleState ?? undefined);
    let rebuilt = false;
    if (checkpoint.hoursThrough !== null) {
      const held = await repository.hourReadingCount(systemId, checkpoint.hoursThrough, transaction);
      if (held !== checkpoint.hoursReadingCount) {
        const again = await rebuildLifeCycle(checkpoint, transaction);
        accumulator = again.accumulator;
        checkpoint = {
          ...checkpoint,
          hoursReadingCount: again.readings,
          lateRebuilds: checkpoint.lateRebuilds + 1,
        };
        rebuilt = true;
      }
    }

    const tracker = createCapacityTracker(batterySetupOf(system), checkpoint.capacityState ?? undefined);
    const minutes = await repository.completeMinutes(
      systemId,
      checkpoint.minutesThrough,
      minutesPerRun,
      transaction,
    );
    const samples: CapacitySample[] = [];
    for (const minute of minutes) {
      const sample = tracker.push(minute);
      if (sample) samples.push(sample);
    }
    const hours = await repository.completeHours(
      systemId,
      { from: checkpoint.hoursThrough },
      hoursPerRun,
      transaction,
    );
    for (const hour of hours) accumulator.push(hour);

    const next: HealthCheckpoint = {
      ...checkpoint,
      capacityState: minutes.length > 0 ? tracker.state() : checkpoint.capacityState,
      minutesThrough:
        minutes.length > 0 ? minutes[minutes.length - 1].start + MINUTE_MS : checkpoint.minutesThrough,
      lifecycleState: accumulator.state(),
      hoursThrough: hours.length > 0 ? hours[hours.length - 1].start + HOUR_MS : checkpoint.hoursThrough,
      hoursReadingCount: checkpoint.hoursReadingCount + hours.reduce((sum, h) => sum + h.readingCount, 0),
      coveredFrom: checkpoint.coveredFrom ?? hours[0]?.start ?? null,
    };
    await repository.saveProgress(next, samples, transaction);
    return { systemId, minutes: minutes.length, hours: hours.length, samples: samples.length, rebuilt };
  }

  return {
    /** One pass over every system with new complete rollups; a system another run holds is skipped. */
    async runOnce(): Promise<HealthRunResult[]> {
      const results: HealthRunResult[] = [];
      for (const systemId of await repository.systemsWithNewRollups()) {
        try {
          const result = await repository.withSystemLock(systemId, (tx) => runSystem(systemId, tx));
          if (result) results.push(result);
        } catch (error) {
          // One system's failure (a corrupt state, a refused setup) must not stop the others.
          deps.logger.warn('battery health not updated', { systemId, error: String(error) });
        }
      }
      return results;
    },

    /** Runs until no system has new complete rollups (after seeding, or in tests); at most `maxRuns` passes. */
    async catchUp(maxRuns = 100): Promise<HealthRunResult[]> {
      const all: HealthRunResult[] = [];
      for (let run = 0; run < maxRuns; run++) {
        const results = (await this.runOnce()).filter((r) => r.minutes + r.hours > 0 || r.rebuilt);
        if (results.length === 0) break;
        all.push(...results);
      }
      return all;
    },
  };
}

export type BatteryHealthJob = ReturnType<typeof createBatteryHealthJob>;
