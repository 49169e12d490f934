import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type {
  CapacitySample,
  CapacityTrackerState,
  HourSummary,
  LifeCycleState,
  MinuteSummary,
} from '@cellwarden/shared';
import { epochMs as ms } from '../database/sql-values';

/** What the health job has consumed of one system's rollups, and the state it resumes from. */
export interface HealthCheckpoint {
  systemId: string;
  capacityState: CapacityTrackerState | null;
  /** Every minute bucket that starts before this (ms) has been fed to the capacity tracker. */
  minutesThrough: number | null;
  lifecycleState: LifeCycleState | null;
  /** Every hour bucket that starts before this (ms) has been fed to the life-cycle accumulator. */
  hoursThrough: number | null;
  usableAh: number;
  /** Readings the consumed hours held when they were consumed. */
  hoursReadingCount: number;
  lateRebuilds: number;
  coveredFrom: number | null;
}

/** The battery facts of a system the health figures need. */
export interface HealthSystem {
  id: string;
  chemistry: 'lifepo4' | 'agm' | 'flooded';
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  usableCapacityAh: number;
  timeZone: string;
}

const MINUTE_COLUMNS = `${ms('bucket_start')} AS start, voltage_min AS "voltageMin", voltage_max AS "voltageMax",
  voltage_last AS "voltageLast", current_min AS "currentMin", current_max AS "currentMax",
  current_sum / reading_count AS "currentMean", temperature_sum / reading_count AS "temperatureMean",
  ah_in AS "ahIn", ah_out AS "ahOut", soc_last AS "socLast"`;
const HOUR_COLUMNS = `${ms('bucket_start')} AS start, ah_in AS "ahIn", ah_out AS "ahOut", wh_in AS "whIn",
  wh_out AS "whOut", temperature_min AS "temperatureMin", temperature_max AS "temperatureMax",
  temperature_sum / reading_count AS "temperatureMean", soc_min AS "socMin", soc_max AS "socMax",
  soc_last AS "socLast", reading_count AS "readingCount"`;
const SELECT_CHECKPOINT = `SELECT system_id AS "systemId", capacity_state AS "capacityState",
  ${ms('minutes_through')} AS "minutesThrough", lifecycle_state AS "lifecycleState",
  ${ms('hours_through')} AS "hoursThrough", usable_ah AS "usableAh",
  hours_reading_count::float8 AS "hoursReadingCount", late_rebuilds AS "lateRebuilds",
  ${ms('covered_from')} AS "coveredFrom"
  FROM battery_health_checkpoints`;
const SELECT_SAMPLE = `SELECT ${ms('at')} AS at, ${ms('full_at')} AS "fullAt", usable_ah AS "usableAh",
  sigma_ah AS "sigmaAh", counted_ah AS "countedAh", soc_at_end AS "socAtEnd", method, temperature
  FROM battery_capacity_samples`;
const toDate = (at: number | null) => (at === null ? null : new Date(at));

// Null columns come back as null; the domain types leave an unknown state of charge out.
function withoutNulls<T extends object>(row: T): T {
  for (const key of Object.keys(row) as (keyof T)[]) if (row[key] === null) delete row[key];
  return row;
}

/** Data access for capacity samples, health checkpoints and the rollups the health job reads. */
export function createBatteryHealthRepository(sequelize: Sequelize) {
  const select = async <T extends object>(
    sql: string,
    replacements: Record<string, unknown>,
    transaction?: Transaction,
  ): Promise<T[]> =>
    (await sequelize.query(sql, { replacements, transaction, type: QueryTypes.SELECT })) as T[];

  return {
    /** Runs `work` in one transaction holding this system's health lock; undefined when another run holds it. */
    async withSystemLock<T>(
      systemId: string,
      work: (transaction: Transaction) => Promise<T>,
    ): Promise<T | undefined> {
      return sequelize.transaction(async (transaction) => {
        const [{ locked }] = await select<{ locked: boolean }>(
          `SELECT pg_try_advisory_xact_lock(hashtext('battery-health'), hashtext(:systemId)) AS locked`,
          { systemId },
          transaction,
        );
        return locked ? work(transaction) : undefined;
      });
    },

    async findSystem(systemId: string, transaction?: Transaction): Promise<HealthSystem | undefined> {
      const [row] = await select<HealthSystem>(
        `SELECT id, chemistry, nominal_voltage AS "nominalVoltage", rated_capacity_ah AS "ratedCapacityAh",
           usable_capacity_ah AS "usableCapacityAh", time_zone AS "timeZone" FROM systems WHERE id = :systemId`,
        { systemId },
        transaction,
      );
      return row;
    },

    /** Systems with a complete minute or hour bucket the job has not yet consumed. */
    async systemsWithNewRollups(): Promise<string[]> {
      const rows = await select<{ id: string }>(
        `SELECT s.id FROM systems s LEFT JOIN battery_health_checkpoints c ON c.system_id = s.id
         WHERE EXISTS (SELECT 1 FROM rollups_1m m WHERE m.system_id = s.id
             AND m.bucket_start >= coalesce(c.minutes_through, '-infinity') + interval '1 minute')
           OR EXISTS (SELECT 1 FROM rollups_1h h WHERE h.system_id = s.id
             AND h.bucket_start >= coalesce(c.hours_through, '-infinity') + interval '1 hour')`,
        {},
      );
      return rows.map((row) => row.id);
    },

    async findCheckpoint(systemId: string, transaction?: Transaction): Promise<HealthCheckpoint | undefined> {
      const [row] = await select<HealthCheckpoint>(
        `${SELECT_CHECKPOINT} WHERE system_id = :systemId`,
        { systemId },
        transaction,
      );
      return row;
    },

    /**
     * Complete minute rollups from `through` on, oldest first: a bucket counts as complete once a later one
     * exists, so the minute being filled now is left for the next run.
     */
    async completeMinutes(
      systemId: string,
      through: number | null,
      limit: number,
      transaction?: Transaction,
    ) {
      const rows = await select<MinuteSummary>(
        `SELECT ${MINUTE_COLUMNS} FROM rollups_1m WHERE system_id = :systemId
           AND bucket_start >= coalesce(:through, '-infinity'::timestamptz)
           AND bucket_start < (SELECT max(bucket_start) FROM rollups_1m WHERE system_id = :systemId)
         ORDER BY bucket_start LIMIT :limit`,
        { systemId, through: toDate(through), limit },
        transaction,
      );
      return rows.map(withoutNulls);
    },

    /** Complete hour rollups from `from` (inclusive) to `to` (exclusive), oldest first. */
    async completeHours(
      systemId: string,
      range: { from: number | null; to?: number },
      limit: number,
      transaction?: Transaction,
    ): Promise<HourSummary[]> {
      const rows = await select<HourSummary>(
        `SELECT ${HOUR_COLUMNS} FROM rollups_1h WHERE system_id = :systemId
           AND bucket_start >= coalesce(:from, '-infinity'::timestamptz)
           AND bucket_start < least(coalesce(:to, 'infinity'::timestamptz),
             (SELECT max(bucket_start) FROM rollups_1h WHERE system_id = :systemId))
         ORDER BY bucket_start LIMIT :limit`,
        { systemId, from: toDate(range.from), to: toDate(range.to ?? null), limit },
        transaction,
      );
      return rows.map(withoutNulls);
    },

    /** Readings held by the hour buckets that start before `before` (the late-data check). */
    async hourReadingCount(systemId: string, before: number, transaction?: Transaction): Promise<number> {
      const [row] = await select<{ count: number }>(
        `SELECT coalesce(sum(reading_count), 0)::float8 AS count FROM rollups_1h
         WHERE system_id = :systemId AND bucket_start < :before`,
        { systemId, before: new Date(before) },
        transaction,
      );
      return row.count;
    },

    /** Stores new samples (a sample already stored is kept) and the checkpoint, inside the caller's transaction. */
    async saveProgress(
      checkpoint: HealthCheckpoint,
      samples: readonly CapacitySample[],
      transaction: Transaction,
    ): Promise<void> {
      for (let i = 0; i < samples.length; i += 500) await insertSamples(samples.slice(i, i + 500));
      await sequelize.query(
        `INSERT INTO battery_health_checkpoints (system_id, capacity_state, minutes_through, lifecycle_state,
           hours_through, usable_ah, hours_reading_count, late_rebuilds, covered_from, updated_at)
         VALUES (:systemId, :capacityState::jsonb, :minutesThrough, :lifecycleState::jsonb, :hoursThrough,
           :usableAh, :hoursReadingCount, :lateRebuilds, :coveredFrom, now())
         ON CONFLICT (system_id) DO UPDATE SET capacity_state = excluded.capacity_state,
           minutes_through = excluded.minutes_through, lifecycle_state = excluded.lifecycle_state,
           hours_through = excluded.hours_through, usable_ah = excluded.usable_ah,
           hours_reading_count = excluded.hours_reading_count, late_rebuilds = excluded.late_rebuilds,
           covered_from = excluded.covered_from, updated_at = now()`,
        {
          replacements: {
            ...checkpoint,
            capacityState: JSON.stringify(checkpoint.capacityState),
            lifecycleState: JSON.stringify(checkpoint.lifecycleState),
            minutesThrough: toDate(checkpoint.minutesThrough),
            hoursThrough: toDate(checkpoint.hoursThrough),
            coveredFrom: toDate(checkpoint.coveredFrom),
          },
          transaction,
        },
      );

      async function insertSamples(batch: readonly CapacitySample[]) {
        if (batch.length === 0) return;
        const values = batch.map(
          (_, i) =>
            `(:systemId, to_timestamp(:at${i} / 1000.0), to_timestamp(:fullAt${i} / 1000.0), :usableAh${i},
              :sigmaAh${i}, :countedAh${i}, :socAtEnd${i}, :method${i}, :temperature${i})`,
        );
        const replacements: Record<string, unknown> = { systemId: checkpoint.systemId };
        batch.forEach((sample, i) => {
          for (const [key, value] of Object.entries(sample)) replacements[`${key}${i}`] = value;
        });
        await sequelize.query(
          `INSERT INTO battery_capacity_samples (system_id, at, full_at, usable_ah, sigma_ah, counted_ah,
             soc_at_end, method, temperature) VALUES ${values.join(', ')} ON CONFLICT DO NOTHING`,
          { replacements, transaction },
        );
      }
    },

    /** Capacity samples of a system, oldest first, optionally within [from, to). */
    async listSamples(
      systemId: string,
      range: { from?: number; to?: number } = {},
    ): Promise<CapacitySample[]> {
      return select<CapacitySample>(
        `${SELECT_SAMPLE} WHERE system_id = :systemId
           AND at >= coalesce(:from, '-infinity'::timestamptz) AND at < coalesce(:to, 'infinity'::timestamptz)
         ORDER BY at`,
        { systemId, from: toDate(range.from ?? null), to: toDate(range.to ?? null) },
      );
    },
  };
}

export type BatteryHealthRepository = ReturnType<typeof createBatteryHealthRepository>;
