import { QueryTypes, type Sequelize } from 'sequelize';
import type { BatteryReading } from '@cellwarden/shared';

/** A reading bound for storage, with the system and device it came from. */
export interface ReadingRow {
  systemId: string;
  deviceId: string;
  reading: BatteryReading;
}

const COLUMNS = 10;

/** Data access for readings. */
export function createReadingsRepository(sequelize: Sequelize) {
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
    /** Stores a batch in one multi-row INSERT; a reading already stored (same system and time) is skipped. */
    async insertBatch(rows: readonly ReadingRow[]): Promise<number> {
      if (rows.length === 0) return 0;
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
      const [, inserted] = await sequelize.query(
        `INSERT INTO readings (system_id, measured_at, device_id, voltage, current, temperature,
           state_of_charge, power, source_currents, received_at)
         VALUES ${tuples.join(', ')} ON CONFLICT (system_id, measured_at) DO NOTHING`,
        { bind, type: QueryTypes.INSERT },
      );
      return Number(inserted ?? 0);
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

    /** Readings of one system in [from, to], averaged into buckets of `bucketMs` (raw when a bucket is ≤ 1 s). */
    async listDownsampled(
      systemId: string,
      from: Date,
      to: Date,
      bucketMs: number,
      limit: number,
    ): Promise<BatteryReading[]> {
      const bucket = `${Math.max(1, Math.ceil(bucketMs / 1000))} seconds`;
      return sequelize.query<BatteryReading>(
        `SELECT (extract(epoch FROM date_bin(:bucket::interval, measured_at, :from)) * 1000)::float8 AS "measuredAt",
           avg(voltage) AS voltage, avg(current) AS current, avg(temperature) AS temperature,
           avg(state_of_charge) AS "stateOfCharge"
         FROM readings WHERE system_id = :systemId AND measured_at >= :from AND measured_at <= :to
         GROUP BY 1 ORDER BY 1 LIMIT :limit`,
        { replacements: { systemId, from, to, bucket, limit }, type: QueryTypes.SELECT },
      );
    },
  };
}

export type ReadingsRepository = ReturnType<typeof createReadingsRepository>;
