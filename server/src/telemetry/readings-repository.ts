import { QueryTypes, type Sequelize } from 'sequelize';
import type { BatteryReading, HistoryPoint } from '@cellwarden/shared';
import { RECOMPUTE_HOURS, RECOMPUTE_MINUTES } from './rollups-sql';

/** A reading bound for storage, with the system and device it came from. */
export interface ReadingRow {
  systemId: string;
  deviceId: string;
  reading: BatteryReading;
}

const COLUMNS = 10;

/** Data access for readings; history, export and energy reads go to `reader` (a replica) when given. */
export function createReadingsRepository(sequelize: Sequelize, reader: Sequelize = sequelize) {
  const knownMonths = new Set<string>();

  async function ensurePartitions(rows: readonly ReadingRow[]): Promise<void> {
    for (const row of rows) {
      const month = new Date(row.reading.measuredAt).toISOString().slice(0, 7);
      if (knownMonths.has(month)) continue;
      await sequelize.query('SELECT cw_ensure_reading_partitions(:from, 2)', {
        replacements: { from: new Date(row.reading.measuredAt) },
      });
      knownMonths.add(month);
    }
  }

  return {
    /**
     * Stores a batch in one multi-row INSERT (a reading already stored, same system and time, is skipped) and
     * brings the minute and hour rollups up to date, all in one transaction. Returns the rows newly stored.
     */
    async insertBatch(rows: readonly ReadingRow[]): Promise<ReadingRow[]> {
      if (rows.length === 0) return [];
      await ensurePartitions(rows);
      const bind: unknown[] = [];
      const tuples = rows.map(({ systemId, deviceId, reading }, i) => {
        bind.push(
          systemId,
          new Date(reading.measuredAt),
          deviceId,
          reading.voltage,
          reading.current,
          reading.temperature,
          reading.stateOfCharge ?? null,
          reading.power ?? null,
          reading.sourceCurrents ? JSON.stringify(reading.sourceCurrents) : null,
          new Date(),
        );
        const base = i * COLUMNS;
        return `(${Array.from({ length: COLUMNS }, (_, c) => `$${base + c + 1}`).join(', ')})`;
      });
      return sequelize.transaction(async (transaction) => {
        const inserted = await sequelize.query<{ systemId: string; measuredAt: Date; deviceId: string }>(
          `INSERT INTO readings (system_id, measured_at, device_id, voltage, current, temperature,
             state_of_charge, power, source_currents, received_at)
           VALUES ${tuples.join(', ')} ON CONFLICT (system_id, measured_at, device_id) DO NOTHING
           RETURNING system_id AS "systemId", measured_at AS "measuredAt", device_id AS "deviceId"`,
          { bind, type: QueryTypes.SELECT, transaction },
        );
        if (inserted.length === 0) return [];
        const touched = [inserted.map((r) => r.systemId), inserted.map((r) => r.measuredAt)];
        await sequelize.query(RECOMPUTE_MINUTES, { bind: touched, transaction });
        await sequelize.query(RECOMPUTE_HOURS, { bind: touched, transaction });
        const stored = new Set(inserted.map((r) => `${r.systemId}/${r.measuredAt.getTime()}/${r.deviceId}`));
        return rows.filter((r) => stored.delete(`${r.systemId}/${r.reading.measuredAt}/${r.deviceId}`));
      });
    },

    async countForSystem(systemId: string): Promise<number> {
      const rows = await sequelize.query<{ count: string }>(
        'SELECT count(*) FROM readings WHERE system_id = :systemId',
        {
          replacements: { systemId },
          type: QueryTypes.SELECT,
        },
      );
      return Number(rows[0].count);
    },

    /** Readings of one system in [from, to], averaged into buckets of `bucketMs`, raw when a bucket is ≤ 1 s. */
    async listDownsampled(
      systemId: string,
      from: Date,
      to: Date,
      bucketMs: number,
      limit: number,
    ): Promise<HistoryPoint[]> {
      const bucket = `${Math.max(1, Math.ceil(bucketMs / 1000))} seconds`;
      const replacements = { systemId, from, to, bucket, limit };
      // Long ranges read the rollups: a year of hours is 8,760 rows however often the device reports.
      const rollup = bucketMs >= 3600_000 ? 'rollups_1h' : bucketMs >= 60_000 ? 'rollups_1m' : undefined;
      if (!rollup)
        return reader.query<HistoryPoint>(
          `SELECT (extract(epoch FROM date_bin(:bucket::interval, measured_at, :from)) * 1000)::float8 AS "measuredAt",
             avg(voltage) AS voltage, avg(current) AS current, avg(temperature) AS temperature,
             avg(state_of_charge) AS "stateOfCharge"
           FROM readings WHERE system_id = :systemId AND measured_at >= :from AND measured_at <= :to
           GROUP BY 1 ORDER BY 1 LIMIT :limit`,
          { replacements, type: QueryTypes.SELECT },
        );
      return reader.query<HistoryPoint>(
        `SELECT (extract(epoch FROM date_bin(:bucket::interval, bucket_start, :from)) * 1000)::float8 AS "measuredAt",
           sum(voltage_sum) / sum(reading_count) AS voltage, sum(current_sum) / sum(reading_count) AS current,
           sum(temperature_sum) / sum(reading_count) AS temperature,
           sum(soc_sum) / nullif(sum(soc_count), 0) AS "stateOfCharge",
           min(voltage_min) AS "voltageMin", max(voltage_max) AS "voltageMax",
           min(current_min) AS "currentMin", max(current_max) AS "currentMax",
           sum(ah_in) AS "ahIn", sum(ah_out) AS "ahOut", sum(wh_in) AS "whIn", sum(wh_out) AS "whOut"
         FROM ${rollup} WHERE system_id = :systemId AND bucket_start >= date_trunc('minute', :from::timestamptz)
           AND bucket_start <= :to
         GROUP BY 1 ORDER BY 1 LIMIT :limit`,
        { replacements, type: QueryTypes.SELECT },
      );
    },

    /** Raw readings of one system in [from, to), oldest first. */
    listRaw: (systemId: string, from: Date, to: Date) =>
      reader
        .query<BatteryReading>(
          `SELECT (extract(epoch FROM measured_at) * 1000)::float8 AS "measuredAt", voltage, current, temperature,
           state_of_charge AS "stateOfCharge", power
         FROM readings WHERE system_id = :systemId AND measured_at >= :from AND measured_at < :to ORDER BY measured_at`,
          { replacements: { systemId, from, to }, type: QueryTypes.SELECT },
        )
        .then((rows) =>
          rows.map((r) => {
            if (r.stateOfCharge === null) delete r.stateOfCharge;
            if (r.power === null) delete r.power;
            return r;
          }),
        ),

    /** Energy in and out per day (UTC) over [from, to), from the hour rollups. */
    async dailyEnergy(systemId: string, from: Date, to: Date) {
      return reader.query<{ day: string; ahIn: number; ahOut: number; whIn: number; whOut: number }>(
        `SELECT to_char(date_trunc('day', bucket_start AT TIME ZONE 'UTC'), 'YYYY-MM-DD') AS day,
           sum(ah_in) AS "ahIn", sum(ah_out) AS "ahOut", sum(wh_in) AS "whIn", sum(wh_out) AS "whOut"
         FROM rollups_1h WHERE system_id = :systemId AND bucket_start >= :from AND bucket_start < :to
         GROUP BY 1 ORDER BY 1`,
        { replacements: { systemId, from, to }, type: QueryTypes.SELECT },
      );
    },
  };
}

export type ReadingsRepository = ReturnType<typeof createReadingsRepository>;
