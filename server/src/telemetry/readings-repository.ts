import { QueryTypes, type Sequelize } from 'sequelize';
import type { BatteryReading, HistoryPoint } from '@cellwarden/shared';
import { arrayLiteral, isUuid } from '../database/sql-values';
import { LEAD_MONITOR_SQL } from './lead-monitor';
import { INSERT_READINGS_WITH_ROLLUPS, LOCK_SYSTEMS, MAX_INTEGRATION_GAP_SECONDS } from './rollups-sql';

/** The driver connection under a Sequelize transaction (node-postgres), for its named prepared statements. */
interface PreparingClient {
  query<R>(config: { name: string; text: string; values: unknown[] }): Promise<{ rows: R[] }>;
}

/**
 * A computed figure rounded to thousandths (mV, mA, m°C, 0.001 % charge, mAh, mWh): finer than any battery
 * monitor resolves, and it spares every answer the binary noise of an average ("13.107499999999998"), which
 * is also about a third of a history answer's bytes to write, send and parse.
 */
const milli = (expression: string) => `round((${expression}) * 1000) / 1000`;

/** What the readings insert answers: how many were new, and their keys only when some were not. */
interface InsertedReadings {
  stored: number;
  systemIds: string[] | null;
  measuredAts: number[] | null;
  deviceIds: string[] | null;
}

/** A reading bound for storage, with the system and device it came from. */
export interface ReadingRow {
  systemId: string;
  deviceId: string;
  reading: BatteryReading;
}

/** Data access for readings; history, export and energy reads go to `reader` (a replica) when given. */
export function createReadingsRepository(sequelize: Sequelize, reader: Sequelize = sequelize) {
  const knownMonths = new Set<number>();

  // The month last found known, as epoch ms bounds: nearly every reading of a batch falls in it, and a number
  // comparison is cheaper per reading than making a Date.
  let knownFrom = 0;
  let knownUntil = 0;

  async function ensurePartitions(rows: readonly ReadingRow[]): Promise<void> {
    for (const row of rows) {
      const measuredAt = row.reading.measuredAt;
      if (measuredAt >= knownFrom && measuredAt < knownUntil) continue;
      // Year and month (UTC) as one number.
      const at = new Date(measuredAt);
      const month = at.getUTCFullYear() * 12 + at.getUTCMonth();
      if (!knownMonths.has(month)) {
        await sequelize.query('SELECT cw_ensure_reading_partitions(:from, 2)', {
          replacements: { from: at },
        });
        knownMonths.add(month);
      }
      knownFrom = Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), 1);
      knownUntil = Date.UTC(at.getUTCFullYear(), at.getUTCMonth() + 1, 1);
    }
  }

  return {
    /**
     * Stores a batch in one INSERT (a reading already stored, same system, time and device, is skipped) and
     * updates the minute and hour rollups from the rows that were new, all in one transaction. Returns the
     * rows newly stored.
     */
    async insertBatch(rows: readonly ReadingRow[]): Promise<ReadingRow[]> {
      if (rows.length === 0) return [];
      await ensurePartitions(rows);
      // The columns in one pass over the rows (not a pass and a closure call per column and row), with the batch's
      // earliest and latest measured times for the neighbour lookups.
      const n = rows.length;
      const systemIds: string[] = new Array(n);
      // Epoch milliseconds, turned into timestamps by the statement: cheaper than an ISO string per reading.
      const measuredAts: number[] = new Array(n);
      const deviceIds: string[] = new Array(n);
      const voltages: number[] = new Array(n);
      const currents: number[] = new Array(n);
      const temperatures: number[] = new Array(n);
      const charges: (number | null)[] = new Array(n);
      const powers: (number | null)[] = new Array(n);
      const sources: (string | null)[] = new Array(n);
      let earliest = Number.POSITIVE_INFINITY;
      let latest = Number.NEGATIVE_INFINITY;
      for (let i = 0; i < n; i++) {
        const { systemId, deviceId, reading } = rows[i];
        systemIds[i] = systemId;
        measuredAts[i] = reading.measuredAt;
        deviceIds[i] = deviceId;
        voltages[i] = reading.voltage;
        currents[i] = reading.current;
        temperatures[i] = reading.temperature;
        charges[i] = reading.stateOfCharge ?? null;
        powers[i] = reading.power ?? null;
        sources[i] = reading.sourceCurrents ? JSON.stringify(reading.sourceCurrents) : null;
        if (reading.measuredAt < earliest) earliest = reading.measuredAt;
        if (reading.measuredAt > latest) latest = reading.measuredAt;
      }
      const bind = [
        arrayLiteral(systemIds),
        arrayLiteral(measuredAts),
        arrayLiteral(deviceIds),
        arrayLiteral(voltages),
        arrayLiteral(currents),
        arrayLiteral(temperatures),
        arrayLiteral(charges),
        arrayLiteral(powers),
        arrayLiteral(sources),
        new Date().toISOString(),
      ];
      const gapMs = MAX_INTEGRATION_GAP_SECONDS * 1000;
      const lookups = [new Date(earliest - gapMs), new Date(latest + gapMs)];
      return sequelize.transaction(async (transaction) => {
        // Both statements are prepared once per connection (named), so PostgreSQL parses and plans the long
        // rollup statement once instead of at every batch.
        const client = (transaction as unknown as { connection: PreparingClient }).connection;
        await client.query({ name: 'cw-lock-systems', text: LOCK_SYSTEMS, values: [bind[0]] });
        const {
          rows: [inserted],
        } = await client.query<InsertedReadings>({
          name: 'cw-insert-readings',
          text: INSERT_READINGS_WITH_ROLLUPS,
          values: [...bind, ...lookups],
        });
        // As many stored as were sent means all were new (the usual case): the statement then returns no keys at
        // all, and none need matching one by one.
        if (inserted.stored === rows.length) return [...rows];
        const stored = new Set(
          (inserted.systemIds ?? []).map(
            (id, i) => `${id}/${inserted.measuredAts![i]}/${inserted.deviceIds![i]}`,
          ),
        );
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
      // Raw points come from the lead monitor when it reported in the range, so two monitors never alternate.
      if (!rollup)
        return reader.query<HistoryPoint>(
          `WITH lead AS (SELECT ${LEAD_MONITOR_SQL(':systemId')} AS id),
             shown AS (SELECT CASE WHEN EXISTS (SELECT 1 FROM readings r, lead WHERE r.system_id = :systemId
               AND r.device_id = lead.id AND r.measured_at >= :from AND r.measured_at <= :to) THEN lead.id END AS id
               FROM lead)
           SELECT (extract(epoch FROM date_bin(:bucket::interval, measured_at, :from)) * 1000)::float8 AS "measuredAt",
             ${milli('avg(voltage)')} AS voltage, ${milli('avg(current)')} AS current,
             ${milli('avg(temperature)')} AS temperature, ${milli('avg(state_of_charge)')} AS "stateOfCharge"
           FROM readings, shown WHERE system_id = :systemId AND measured_at >= :from AND measured_at <= :to
             AND (shown.id IS NULL OR device_id = shown.id)
           GROUP BY 1 ORDER BY 1 LIMIT :limit`,
          { replacements, type: QueryTypes.SELECT },
        );
      return reader.query<HistoryPoint>(
        `SELECT (extract(epoch FROM date_bin(:bucket::interval, bucket_start, :from)) * 1000)::float8 AS "measuredAt",
           ${milli('sum(voltage_sum) / sum(reading_count)')} AS voltage,
           ${milli('sum(current_sum) / sum(reading_count)')} AS current,
           ${milli('sum(temperature_sum) / sum(reading_count)')} AS temperature,
           ${milli('sum(soc_sum) / nullif(sum(soc_count), 0)')} AS "stateOfCharge",
           min(voltage_min) AS "voltageMin", max(voltage_max) AS "voltageMax",
           min(current_min) AS "currentMin", max(current_max) AS "currentMax",
           ${milli('sum(ah_in)')} AS "ahIn", ${milli('sum(ah_out)')} AS "ahOut",
           ${milli('sum(wh_in)')} AS "whIn", ${milli('sum(wh_out)')} AS "whOut"
         FROM ${rollup} WHERE system_id = :systemId AND bucket_start >= date_trunc('minute', :from::timestamptz)
           AND bucket_start <= :to
         GROUP BY 1 ORDER BY 1 LIMIT :limit`,
        { replacements, type: QueryTypes.SELECT },
      );
    },

    /**
     * Each system's newest reading when it arrived before `before`: the systems whose monitors have gone quiet,
     * for the silence check to adopt after a restart.
     */
    async quietSystems(
      before: Date,
    ): Promise<{ systemId: string; receivedAt: number; reading: BatteryReading }[]> {
      const rows = await sequelize.query<{ systemId: string; receivedAt: number } & BatteryReading>(
        `SELECT s.id AS "systemId", (extract(epoch FROM r.received_at) * 1000)::float8 AS "receivedAt",
           (extract(epoch FROM r.measured_at) * 1000)::float8 AS "measuredAt", r.voltage, r.current, r.temperature,
           r.state_of_charge AS "stateOfCharge"
         FROM systems s
         JOIN LATERAL (SELECT * FROM readings WHERE system_id = s.id ORDER BY measured_at DESC LIMIT 1) r ON true
         WHERE r.received_at < :before`,
        { replacements: { before }, type: QueryTypes.SELECT },
      );
      return rows.map(({ systemId, receivedAt, stateOfCharge, ...reading }) => ({
        systemId,
        receivedAt,
        reading: stateOfCharge === null ? reading : { ...reading, stateOfCharge },
      }));
    },

    /**
     * The monitor each system's headline and analytics follow (see lead-monitor.ts), in one query; null for a
     * system without one, absent for a system that no longer exists.
     */
    async leadMonitors(systemIds: readonly string[]): Promise<Map<string, string | null>> {
      // An id that is no uuid names no system, and would fail the whole query.
      const ids = systemIds.filter(isUuid);
      if (ids.length === 0) return new Map();
      const rows = await sequelize.query<{ systemId: string; leadDeviceId: string | null }>(
        `SELECT s.id AS "systemId", ${LEAD_MONITOR_SQL('s.id')} AS "leadDeviceId"
         FROM systems s WHERE s.id IN (:systemIds)`,
        { replacements: { systemIds: ids }, type: QueryTypes.SELECT },
      );
      return new Map(rows.map((row) => [row.systemId, row.leadDeviceId]));
    },

    /** Raw readings of one system in [from, to), oldest first; of one of its monitors when `deviceId` is given. */
    listRaw: (systemId: string, from: Date, to: Date, deviceId?: string) =>
      reader
        .query<BatteryReading>(
          `SELECT (extract(epoch FROM measured_at) * 1000)::float8 AS "measuredAt", voltage, current, temperature,
           state_of_charge AS "stateOfCharge", power
         FROM readings WHERE system_id = :systemId AND measured_at >= :from AND measured_at < :to
           AND (CAST(:deviceId AS text) IS NULL OR device_id = :deviceId) ORDER BY measured_at`,
          { replacements: { systemId, from, to, deviceId: deviceId ?? null }, type: QueryTypes.SELECT },
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
