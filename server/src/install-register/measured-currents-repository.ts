// What the monitor measured on a circuit, read from the raw readings over a bounded window. SQL, not a model:
// readings is the partitioned table, and the percentile is computed by PostgreSQL (percentile_disc, the
// nearest rank) so the window's rows never travel to Node — only the few around the peak do.
import { QueryTypes, type Sequelize } from 'sequelize';

/** Whose current: the pack's (the main battery feed) or one charge source's, as the monitor reports it. */
export type MeasuredChannel = { kind: 'battery-feed' } | { kind: 'source'; sourceId: string };

/** Around the peak, this much either side is read to see how long it lasted. */
const PEAK_SURROUNDINGS_MS = 10 * 60_000;
/** At most this many readings around the peak (10 min either side at 1 Hz is 1,200). */
const PEAK_SURROUNDINGS_LIMIT = 1500;
/** At most this many readings for a check's chart (a 30-minute window at 1 Hz is 1,800). */
const CHART_LIMIT = 2000;

function channelExpression(channel: MeasuredChannel): string {
  return channel.kind === 'battery-feed' ? 'current' : `(source_currents->>:sourceId)::float8`;
}

/** Window statistics of one channel: count, 99th percentile and the peak of the magnitude, and the peak's time. */
export function createMeasuredCurrentsRepository(sequelize: Sequelize) {
  return {
    async windowStatistics(systemId: string, channel: MeasuredChannel, from: number, to: number) {
      const value = channelExpression(channel);
      const [row] = await sequelize.query<{
        samples: number;
        p99: number | null;
        peak: number | null;
        peakAt: string | null;
      }>(
        `WITH w AS (
           SELECT measured_at, abs(${value}) AS a FROM readings
           WHERE system_id = :systemId AND measured_at >= to_timestamp(:from / 1000.0)
             AND measured_at < to_timestamp(:to / 1000.0) AND ${value} IS NOT NULL)
         SELECT (SELECT count(*)::int FROM w) AS samples,
           (SELECT percentile_disc(0.99) WITHIN GROUP (ORDER BY a) FROM w) AS p99,
           p.a AS peak, (extract(epoch FROM p.measured_at) * 1000)::bigint AS "peakAt"
         FROM (SELECT 1) one LEFT JOIN LATERAL (SELECT a, measured_at FROM w ORDER BY a DESC, measured_at LIMIT 1) p ON true`,
        {
          replacements: {
            systemId,
            from,
            to,
            sourceId: channel.kind === 'source' ? channel.sourceId : null,
          },
          type: QueryTypes.SELECT,
        },
      );
      return {
        samples: row?.samples ?? 0,
        p99A: row?.p99 ?? null,
        peakA: row?.peak ?? null,
        peakAt: row?.peakAt === null || row?.peakAt === undefined ? null : Number(row.peakAt),
      };
    },

    /** The channel's readings within ten minutes of an instant, oldest first. */
    async around(systemId: string, channel: MeasuredChannel, at: number) {
      const value = channelExpression(channel);
      const rows = await sequelize.query<{ at: string; currentA: number }>(
        `SELECT (extract(epoch FROM measured_at) * 1000)::bigint AS at, ${value} AS "currentA" FROM readings
         WHERE system_id = :systemId AND measured_at BETWEEN to_timestamp(:from / 1000.0) AND to_timestamp(:to / 1000.0)
           AND ${value} IS NOT NULL
         ORDER BY measured_at LIMIT ${PEAK_SURROUNDINGS_LIMIT}`,
        {
          replacements: {
            systemId,
            from: at - PEAK_SURROUNDINGS_MS,
            to: at + PEAK_SURROUNDINGS_MS,
            sourceId: channel.kind === 'source' ? channel.sourceId : null,
          },
          type: QueryTypes.SELECT,
        },
      );
      return rows.map((r) => ({ at: Number(r.at), currentA: r.currentA }));
    },

    /** Current (the source's when it reports one, else the pack's) and voltage over a check's window, oldest first. */
    async chart(systemId: string, sourceId: string, from: number, to: number) {
      const rows = await sequelize.query<{ at: string; currentA: number; voltage: number }>(
        `SELECT (extract(epoch FROM measured_at) * 1000)::bigint AS at,
           coalesce((source_currents->>:sourceId)::float8, current) AS "currentA", voltage FROM readings
         WHERE system_id = :systemId AND measured_at BETWEEN to_timestamp(:from / 1000.0) AND to_timestamp(:to / 1000.0)
         ORDER BY measured_at LIMIT ${CHART_LIMIT}`,
        { replacements: { systemId, sourceId, from, to }, type: QueryTypes.SELECT },
      );
      return rows.map((r) => ({ at: Number(r.at), currentA: r.currentA, voltage: r.voltage }));
    },
  };
}

export type MeasuredCurrentsRepository = ReturnType<typeof createMeasuredCurrentsRepository>;
