// Rollups are recomputed from the stored readings for every minute a batch touched, then every hour from its
// minutes, inside the batch's transaction. Recomputing (rather than adding to running totals) makes them exact
// for late, duplicated and out-of-order readings, e.g. a device's buffered readings after hours offline.

// Energy between two readings is counted only across gaps up to this long; a longer gap is a silence, not a load.
export const MAX_INTEGRATION_GAP_SECONDS = 300;

// The stored readings' times, and for each the next reading after it: a late reading shortens that one's gap,
// so its bucket changes too even when it lies in another minute or hour.
const AFFECTED = `inserted AS (
  SELECT * FROM unnest($1::uuid[], $2::timestamptz[]) AS t(system_id, measured_at)
), affected AS (
  SELECT system_id, measured_at FROM inserted
  UNION
  SELECT i.system_id, n.measured_at FROM inserted i
  CROSS JOIN LATERAL (
    SELECT r.measured_at FROM readings r
    WHERE r.system_id = i.system_id AND r.measured_at > i.measured_at
      AND r.measured_at <= i.measured_at + interval '${MAX_INTEGRATION_GAP_SECONDS} seconds'
    ORDER BY r.measured_at LIMIT 1
  ) n
)`;

const METRICS = ['voltage', 'current', 'temperature'] as const;

const metricAggregates = METRICS.map(
  (m) => `min(${m}) AS ${m}_min, max(${m}) AS ${m}_max, sum(${m}) AS ${m}_sum,
    (array_agg(${m} ORDER BY measured_at DESC))[1] AS ${m}_last`,
).join(',\n');

const ROLLUP_COLUMNS = [
  'system_id',
  'bucket_start',
  'reading_count',
  ...METRICS.flatMap((m) => [`${m}_min`, `${m}_max`, `${m}_sum`, `${m}_last`]),
  'soc_min',
  'soc_max',
  'soc_sum',
  'soc_count',
  'soc_last',
  'last_measured_at',
  'ah_in',
  'ah_out',
  'wh_in',
  'wh_out',
];

const overwrite = ROLLUP_COLUMNS.slice(2)
  .map((c) => `${c} = excluded.${c}`)
  .join(', ');

/** Recomputes rollups_1m for the (system, minute) pairs of the readings bound as $1 uuid[] and $2 timestamptz[]. */
export const RECOMPUTE_MINUTES = `
WITH ${AFFECTED}, touched AS (
  SELECT DISTINCT system_id, date_trunc('minute', measured_at) AS bucket FROM affected
), source AS (
  SELECT t.system_id, t.bucket, r.measured_at, r.voltage, r.current, r.temperature, r.state_of_charge,
    least(extract(epoch FROM r.measured_at - lag(r.measured_at) OVER w), ${MAX_INTEGRATION_GAP_SECONDS}) / 3600.0 AS hours
  FROM touched t
  JOIN readings r ON r.system_id = t.system_id
    AND r.measured_at >= t.bucket - interval '${MAX_INTEGRATION_GAP_SECONDS} seconds'
    AND r.measured_at < t.bucket + interval '1 minute'
  WINDOW w AS (PARTITION BY t.system_id, t.bucket ORDER BY r.measured_at)
)
INSERT INTO rollups_1m (${ROLLUP_COLUMNS.join(', ')})
SELECT system_id, bucket, count(*),
  ${metricAggregates},
  min(state_of_charge), max(state_of_charge), sum(state_of_charge), count(state_of_charge),
  (array_agg(state_of_charge ORDER BY measured_at DESC) FILTER (WHERE state_of_charge IS NOT NULL))[1],
  max(measured_at),
  coalesce(sum(greatest(current, 0) * hours), 0), coalesce(sum(greatest(-current, 0) * hours), 0),
  coalesce(sum(greatest(current, 0) * voltage * hours), 0), coalesce(sum(greatest(-current, 0) * voltage * hours), 0)
FROM source WHERE measured_at >= bucket
GROUP BY system_id, bucket
ON CONFLICT (system_id, bucket_start) DO UPDATE SET ${overwrite}`;

const lastOf = (column: string) => `(array_agg(${column} ORDER BY bucket_start DESC))[1]`;

/** Recomputes rollups_1h from rollups_1m for the hours of the readings bound as $1 uuid[] and $2 timestamptz[]. */
export const RECOMPUTE_HOURS = `
WITH ${AFFECTED}, touched AS (
  SELECT DISTINCT system_id, date_trunc('hour', measured_at) AS bucket FROM affected
)
INSERT INTO rollups_1h (${ROLLUP_COLUMNS.join(', ')})
SELECT m.system_id, t.bucket, sum(reading_count),
  ${METRICS.map((c) => `min(${c}_min), max(${c}_max), sum(${c}_sum), ${lastOf(`${c}_last`)}`).join(',\n  ')},
  min(soc_min), max(soc_max), sum(soc_sum), sum(soc_count),
  (array_agg(soc_last ORDER BY bucket_start DESC) FILTER (WHERE soc_last IS NOT NULL))[1],
  max(last_measured_at), sum(ah_in), sum(ah_out), sum(wh_in), sum(wh_out)
FROM touched t
JOIN rollups_1m m ON m.system_id = t.system_id AND m.bucket_start >= t.bucket AND m.bucket_start < t.bucket + interval '1 hour'
GROUP BY m.system_id, t.bucket
ON CONFLICT (system_id, bucket_start) DO UPDATE SET ${overwrite}`;
