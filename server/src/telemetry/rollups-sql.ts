// Rollups are updated incrementally from the rows a batch's INSERT … ON CONFLICT DO NOTHING reports as new, in
// the batch's transaction: counts and sums add, minima and maxima combine, the last values go by measured time.
// A redelivered reading is not new, so it adds nothing; a late or out-of-order reading is placed between its
// stored neighbours: it takes its own gap from the reading before it and shortens the gap of the reading after
// it, whose energy is corrected by the difference (in that reading's own minute and hour). Each new reading is
// found by index lookups of its neighbours, so the cost does not grow with the history already stored.

import { epochMs } from '../database/sql-values';

// Energy between two readings is counted only across gaps up to this long; a longer gap is a silence, not a
// load, and a reading with no reading before it (the first ever, or the first after a silence) carries none.
export const MAX_INTEGRATION_GAP_SECONDS = 300;

const GAP = `interval '${MAX_INTEGRATION_GAP_SECONDS} seconds'`;

/** Hours a reading's current is held over, from the time of the reading before it (0 past the cap or none). */
const heldHours = (at: string, previousAt: string) =>
  `coalesce(CASE WHEN ${at} - ${previousAt} <= ${GAP}
    THEN extract(epoch FROM ${at} - ${previousAt}) / 3600.0 END, 0)`;

const METRICS = ['voltage', 'current', 'temperature'] as const;

// Readings are ordered by (measured time, device): two monitors on one bank may measure in the same instant.
// Measured times come as epoch milliseconds (whole numbers): to_timestamp of the seconds is exact to the
// microsecond for any date this product stores, since float8 carries 15–16 significant digits.
const NEW_ROWS = `incoming AS (
  SELECT system_id, to_timestamp(measured_ms / 1000.0) AS measured_at, device_id, voltage, current, temperature,
    state_of_charge, power, source_currents, $10::timestamptz AS received_at
  FROM unnest($1::uuid[], $2::float8[], $3::text[], $4::float8[], $5::float8[], $6::float8[],
    $7::float8[], $8::float8[], $9::text[])
    AS t(system_id, measured_ms, device_id, voltage, current, temperature, state_of_charge, power,
      source_currents)
), stored AS (
  INSERT INTO readings (system_id, measured_at, device_id, voltage, current, temperature, state_of_charge,
    power, source_currents, received_at)
  SELECT system_id, measured_at, device_id, voltage, current, temperature, state_of_charge, power,
    source_currents::jsonb, received_at
  FROM incoming
  ON CONFLICT (system_id, measured_at, device_id) DO NOTHING
  RETURNING system_id, measured_at, device_id, voltage, current, temperature, state_of_charge
), placed AS (
  SELECT s.*,
    lag(measured_at) OVER w AS new_before_at,
    lead(measured_at) OVER w AS new_after_at, lead(device_id) OVER w AS new_after_device
  FROM stored s
  WINDOW w AS (PARTITION BY system_id ORDER BY measured_at, device_id)
), neighbours AS (
  -- The statement's snapshot does not hold its own inserts, so these lookups see only the readings stored before.
  SELECT p.*, greatest(p.new_before_at, before.measured_at) AS before_at, before.measured_at AS stored_before_at
  FROM placed p
  LEFT JOIN LATERAL (
    SELECT r.measured_at FROM readings r
    WHERE r.system_id = p.system_id AND (r.measured_at, r.device_id) < (p.measured_at, p.device_id)
      AND r.measured_at >= p.measured_at - ${GAP} AND r.measured_at BETWEEN $11 AND $12
    ORDER BY r.measured_at DESC, r.device_id DESC LIMIT 1
  ) before ON true
), corrected AS (
  -- The stored reading right after each new one (unless another new one comes first) now has a shorter gap.
  SELECT n.system_id, a.measured_at, a.device_id, a.voltage, a.current,
    ${heldHours('a.measured_at', 'n.measured_at')} - ${heldHours('a.measured_at', 'n.stored_before_at')} AS hours
  FROM neighbours n
  CROSS JOIN LATERAL (
    SELECT r.measured_at, r.device_id, r.voltage, r.current FROM readings r
    WHERE r.system_id = n.system_id AND (r.measured_at, r.device_id) > (n.measured_at, n.device_id)
      AND r.measured_at <= n.measured_at + ${GAP} AND r.measured_at BETWEEN $11 AND $12
    ORDER BY r.measured_at, r.device_id LIMIT 1
  ) a
  WHERE n.new_after_at IS NULL OR (a.measured_at, a.device_id) < (n.new_after_at, n.new_after_device)
), contributions AS (
  SELECT system_id, measured_at, device_id, 1 AS new_reading, voltage, current, temperature, state_of_charge,
    ${heldHours('measured_at', 'before_at')} AS hours, voltage AS energy_voltage, current AS energy_current
  FROM neighbours
  UNION ALL
  SELECT system_id, measured_at, device_id, 0, NULL, NULL, NULL, NULL, hours, voltage, current
  FROM corrected
)`;

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
  'soc_last_at',
  'last_measured_at',
  'ah_in',
  'ah_out',
  'wh_in',
  'wh_out',
];

// Each contribution's place in its minute: the newest new reading, and the newest one with a state of charge,
// come first (two window sorts, instead of one ordered aggregate per "last" column).
const RANKED = `ranked AS (
  SELECT c.*, date_trunc('minute', measured_at) AS minute,
    row_number() OVER (PARTITION BY system_id, date_trunc('minute', measured_at)
      ORDER BY new_reading DESC, measured_at DESC, device_id DESC) AS recency,
    row_number() OVER (PARTITION BY system_id, date_trunc('minute', measured_at)
      ORDER BY state_of_charge IS NULL, measured_at DESC, device_id DESC) AS soc_recency
  FROM contributions c
)`;

/** The change to each minute, from the batch's contributions. */
const MINUTE_CHANGES = `
  SELECT system_id, minute AS bucket_start, sum(new_reading)::int AS reading_count,
    ${METRICS.map(
      (m) => `min(${m}) AS ${m}_min, max(${m}) AS ${m}_max, coalesce(sum(${m}), 0) AS ${m}_sum,
    max(${m}) FILTER (WHERE recency = 1 AND new_reading = 1) AS ${m}_last`,
    ).join(',\n    ')},
    min(state_of_charge) AS soc_min, max(state_of_charge) AS soc_max, sum(state_of_charge) AS soc_sum,
    count(state_of_charge)::int AS soc_count, max(state_of_charge) FILTER (WHERE soc_recency = 1) AS soc_last,
    max(measured_at) FILTER (WHERE state_of_charge IS NOT NULL) AS soc_last_at,
    max(measured_at) FILTER (WHERE new_reading = 1) AS last_measured_at,
    coalesce(sum(greatest(energy_current, 0) * hours), 0) AS ah_in,
    coalesce(sum(greatest(-energy_current, 0) * hours), 0) AS ah_out,
    coalesce(sum(greatest(energy_current, 0) * energy_voltage * hours), 0) AS wh_in,
    coalesce(sum(greatest(-energy_current, 0) * energy_voltage * hours), 0) AS wh_out
  FROM ranked GROUP BY system_id, minute`;

const lastOf = (column: string, at: string) => `(array_agg(${column} ORDER BY ${at} DESC NULLS LAST))[1]`;

/** The change to each hour, combined from the changes to its minutes (a few rows, not every reading). */
const HOUR_CHANGES = `
  SELECT system_id, date_trunc('hour', bucket_start) AS bucket_start, sum(reading_count)::int AS reading_count,
    ${METRICS.map(
      (m) => `min(${m}_min) AS ${m}_min, max(${m}_max) AS ${m}_max, sum(${m}_sum) AS ${m}_sum,
    ${lastOf(`${m}_last`, 'last_measured_at')} AS ${m}_last`,
    ).join(',\n    ')},
    min(soc_min) AS soc_min, max(soc_max) AS soc_max, sum(soc_sum) AS soc_sum, sum(soc_count)::int AS soc_count,
    ${lastOf('soc_last', 'soc_last_at')} AS soc_last, max(soc_last_at) AS soc_last_at,
    max(last_measured_at) AS last_measured_at, sum(ah_in) AS ah_in, sum(ah_out) AS ah_out,
    sum(wh_in) AS wh_in, sum(wh_out) AS wh_out
  FROM minute_changes GROUP BY 1, 2`;

const newer = (table: string) => `excluded.last_measured_at > ${table}.last_measured_at`;
const newerSoc = (table: string) =>
  `excluded.soc_last_at IS NOT NULL AND (${table}.soc_last_at IS NULL OR excluded.soc_last_at > ${table}.soc_last_at)`;

/** How a stored bucket absorbs a change: sums add, extremes combine, the last values go by measured time. */
const combine = (table: string) =>
  [
    `reading_count = ${table}.reading_count + excluded.reading_count`,
    ...METRICS.flatMap((m) => [
      `${m}_min = least(${table}.${m}_min, excluded.${m}_min)`,
      `${m}_max = greatest(${table}.${m}_max, excluded.${m}_max)`,
      `${m}_sum = ${table}.${m}_sum + excluded.${m}_sum`,
      `${m}_last = CASE WHEN ${newer(table)} THEN excluded.${m}_last ELSE ${table}.${m}_last END`,
    ]),
    `soc_min = least(${table}.soc_min, excluded.soc_min)`,
    `soc_max = greatest(${table}.soc_max, excluded.soc_max)`,
    `soc_sum = CASE WHEN excluded.soc_count = 0 THEN ${table}.soc_sum
      ELSE coalesce(${table}.soc_sum, 0) + excluded.soc_sum END`,
    `soc_count = ${table}.soc_count + excluded.soc_count`,
    `soc_last = CASE WHEN ${newerSoc(table)} THEN excluded.soc_last ELSE ${table}.soc_last END`,
    `soc_last_at = greatest(${table}.soc_last_at, excluded.soc_last_at)`,
    `last_measured_at = greatest(${table}.last_measured_at, excluded.last_measured_at)`,
    ...['ah_in', 'ah_out', 'wh_in', 'wh_out'].map((c) => `${c} = ${table}.${c} + excluded.${c}`),
  ].join(',\n    ');

// Buckets with new readings are upserted; a bucket whose only change is a corrected gap already exists (its
// reading is stored) and only has its energy adjusted.
const applyTo = (table: 'rollups_1m' | 'rollups_1h', changes: string) => `
${changes}_new AS (
  INSERT INTO ${table} (${ROLLUP_COLUMNS.join(', ')})
  SELECT ${ROLLUP_COLUMNS.join(', ')} FROM ${changes} WHERE reading_count > 0
  ON CONFLICT (system_id, bucket_start) DO UPDATE SET
    ${combine(table)}
  RETURNING 1
), ${changes}_gaps AS (
  UPDATE ${table} t SET ah_in = t.ah_in + c.ah_in, ah_out = t.ah_out + c.ah_out,
    wh_in = t.wh_in + c.wh_in, wh_out = t.wh_out + c.wh_out
  FROM ${changes} c
  WHERE c.reading_count = 0 AND t.system_id = c.system_id AND t.bucket_start = c.bucket_start
  RETURNING 1
)`;

/**
 * Stores a batch bound as nine parallel arrays (system, measured time in epoch ms, device, voltage, current, temperature,
 * state of charge, power, source currents as JSON text) and the batch's received time ($10, one for all its rows:
 * not 500 copies of one timestamp to write and parse), and updates both rollups from the
 * rows that were new; returns one row: how many were new and, only when some were not, their keys (system, measured
 * time in epoch ms, device) as three arrays. Every row of a batch is usually new, and a row per reading (a uuid,
 * a timestamp and a text to parse each) was then read for nothing. $11 and $12 bound the neighbour lookups (the batch's
 * earliest time less the gap cap, its latest plus it), so the planner reads only the months they can lie in.
 */
export const INSERT_READINGS_WITH_ROLLUPS = `
WITH ${NEW_ROWS}, ${RANKED},
minute_changes AS (${MINUTE_CHANGES}),
hour_changes AS (${HOUR_CHANGES}),
${applyTo('rollups_1m', 'minute_changes')},
${applyTo('rollups_1h', 'hour_changes')}
SELECT count(*)::int AS stored,
  CASE WHEN count(*) < cardinality($1::uuid[]) THEN array_agg(system_id) END AS "systemIds",
  CASE WHEN count(*) < cardinality($1::uuid[]) THEN array_agg(${epochMs('measured_at')}) END AS "measuredAts",
  CASE WHEN count(*) < cardinality($1::uuid[]) THEN array_agg(device_id) END AS "deviceIds"
FROM stored`;

/**
 * Serialises writers of the same systems (bound as $1 uuid[]) until the transaction ends, so each batch's
 * neighbour lookups see every reading committed before it, whichever node or lane wrote it. Taken in one
 * order (by key) so two batches cannot deadlock.
 */
export const LOCK_SYSTEMS = `
SELECT pg_advisory_xact_lock(key) FROM (
  SELECT DISTINCT hashtextextended(system_id::text, 19) AS key FROM unnest($1::uuid[]) AS t(system_id) ORDER BY 1
) keys`;
