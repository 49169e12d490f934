import { Op, QueryTypes, type Sequelize, type Transaction, type WhereOptions } from 'sequelize';
import type {
  CapacitySample,
  CapacityTrackerState,
  HourSummary,
  LifeCycleState,
  MinuteSummary,
} from '@cellwarden/shared';
import { epochMs as ms } from '../database/sql-values';
import { initModels } from '../database/models';

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
const toDate = (at: number | null) => (at === null ? null : new Date(at));
const toMs = (at: Date | null) => (at === null ? null : at.getTime());

// Null columns come back as null; the domain types leave an unknown state of charge out.
function withoutNulls<T extends object>(row: T): T {
  for (const key of Object.keys(row) as (keyof T)[]) if (row[key] === null) delete row[key];
  return row;
}

/** Data access for capacity samples, health checkpoints and the rollups the health job reads. */
export function createBatteryHealthRepository(sequelize: Sequelize) {
  const { System, CapacitySampleRow, HealthCheckpointRow } = initModels(sequelize);
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
        // A transaction-level advisory lock (released at commit): no model says it.
        const [{ locked }] = await select<{ locked: boolean }>(
          `SELECT pg_try_advisory_xact_lock(hashtext('battery-health'), hashtext(:systemId)) AS locked`,
          { systemId },
          transaction,
        );
        return locked ? work(transaction) : undefined;
      });
    },

    async findSystem(systemId: string, transaction?: Transaction): Promise<HealthSystem | undefined> {
      const row = await System.findByPk(systemId, {
        attributes: ['id', 'chemistry', 'nominalVoltage', 'ratedCapacityAh', 'usableCapacityAh', 'timeZone'],
        raw: true,
        transaction,
      });
      return row ?? undefined;
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
      const row = await HealthCheckpointRow.findByPk(systemId, { raw: true, transaction });
      if (!row) return undefined;
      return {
        systemId: row.systemId,
        capacityState: row.capacityState,
        minutesThrough: toMs(row.minutesThrough),
        lifecycleState: row.lifecycleState,
        hoursThrough: toMs(row.hoursThrough),
        usableAh: row.usableAh,
        hoursReadingCount: Number(row.hoursReadingCount),
        lateRebuilds: row.lateRebuilds,
        coveredFrom: toMs(row.coveredFrom),
      };
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
      // Many rows at once, a sample already stored kept (bulkCreate's ignoreDuplicates: ON CONFLICT DO NOTHING).
      for (let i = 0; i < samples.length; i += 500)
        await CapacitySampleRow.bulkCreate(
          samples.slice(i, i + 500).map((sample) => ({
            systemId: checkpoint.systemId,
            at: new Date(sample.at),
            fullAt: new Date(sample.fullAt),
            usableAh: sample.usableAh,
            sigmaAh: sample.sigmaAh,
            countedAh: sample.countedAh,
            socAtEnd: sample.socAtEnd,
            method: sample.method,
            temperature: sample.temperature ?? null,
          })),
          { ignoreDuplicates: true, returning: false, transaction },
        );
      // INSERT … ON CONFLICT (system_id) DO UPDATE; updated_at is the database's now() (the model's default).
      await HealthCheckpointRow.upsert(
        {
          systemId: checkpoint.systemId,
          capacityState: checkpoint.capacityState,
          minutesThrough: toDate(checkpoint.minutesThrough),
          lifecycleState: checkpoint.lifecycleState,
          hoursThrough: toDate(checkpoint.hoursThrough),
          usableAh: checkpoint.usableAh,
          hoursReadingCount: checkpoint.hoursReadingCount,
          lateRebuilds: checkpoint.lateRebuilds,
          coveredFrom: toDate(checkpoint.coveredFrom),
        },
        { returning: false, transaction },
      );
    },

    /** Capacity samples of a system, oldest first, optionally within [from, to). */
    async listSamples(
      systemId: string,
      range: { from?: number; to?: number } = {},
    ): Promise<CapacitySample[]> {
      const at: WhereOptions = {};
      if (range.from !== undefined) Object.assign(at, { [Op.gte]: new Date(range.from) });
      if (range.to !== undefined) Object.assign(at, { [Op.lt]: new Date(range.to) });
      const rows = await CapacitySampleRow.findAll({
        where: Reflect.ownKeys(at).length > 0 ? { systemId, at } : { systemId },
        attributes: ['at', 'fullAt', 'usableAh', 'sigmaAh', 'countedAh', 'socAtEnd', 'method', 'temperature'],
        order: [['at', 'ASC']],
        raw: true,
      });
      // A sample with no temperature comes back with `temperature: null`, as it always has.
      return rows.map((row) => ({
        at: row.at.getTime(),
        fullAt: row.fullAt.getTime(),
        usableAh: row.usableAh,
        sigmaAh: row.sigmaAh,
        countedAh: row.countedAh,
        socAtEnd: row.socAtEnd,
        method: row.method,
        temperature: row.temperature as number,
      }));
    },
  };
}

export type BatteryHealthRepository = ReturnType<typeof createBatteryHealthRepository>;
