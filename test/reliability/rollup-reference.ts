import { QueryTypes, type Sequelize } from 'sequelize';

/** One bucket's count and energy, as stored in rollups_1m / rollups_1h or computed here. */
export interface BucketEnergy {
  bucketStart: number;
  readingCount: number;
  ahIn: number;
  ahOut: number;
  whIn: number;
  whOut: number;
}

/** A raw reading as the energy sums need it. */
export interface RawReading {
  measuredAt: number;
  voltage: number;
  current: number;
}

/** Longest gap a reading's current is integrated over, seconds; a longer gap is a silence, not a load. */
export const GAP_CAP_SECONDS = 300;

/**
 * The reference the rollups must equal, computed independently of the SQL: per bucket the number of
 * readings and Coulomb counting (Ah = Σ I·Δt), each reading's current held over the gap since the reading
 * before it when that gap is at most 300 s; a longer gap is a silence and counts nothing, and the first reading
 * has no reading before it, so it counts nothing either.
 */
export function expectedBuckets(readings: readonly RawReading[], bucketMs: number): BucketEnergy[] {
  const sorted = [...readings].sort((a, b) => a.measuredAt - b.measuredAt);
  const buckets = new Map<number, BucketEnergy>();
  sorted.forEach((r, i) => {
    const bucketStart = Math.floor(r.measuredAt / bucketMs) * bucketMs;
    const b = buckets.get(bucketStart) ?? {
      bucketStart,
      readingCount: 0,
      ahIn: 0,
      ahOut: 0,
      whIn: 0,
      whOut: 0,
    };
    b.readingCount++;
    const gapSeconds = i === 0 ? Infinity : (r.measuredAt - sorted[i - 1].measuredAt) / 1000;
    const hours = gapSeconds <= GAP_CAP_SECONDS ? gapSeconds / 3600 : 0;
    b.ahIn += Math.max(r.current, 0) * hours;
    b.ahOut += Math.max(-r.current, 0) * hours;
    b.whIn += Math.max(r.current, 0) * r.voltage * hours;
    b.whOut += Math.max(-r.current, 0) * r.voltage * hours;
    buckets.set(bucketStart, b);
  });
  return [...buckets.values()];
}

/** The stored readings of one system, oldest first. */
export async function rawReadings(sequelize: Sequelize, systemId: string) {
  return sequelize.query<RawReading & { receivedAt: number }>(
    `SELECT round(extract(epoch FROM measured_at) * 1000)::float8 AS "measuredAt", voltage, current,
       (extract(epoch FROM received_at) * 1000)::float8 AS "receivedAt"
     FROM readings WHERE system_id = :systemId ORDER BY measured_at`,
    { replacements: { systemId }, type: QueryTypes.SELECT },
  );
}

/** The stored rollups of one system from `table` (rollups_1m or rollups_1h), oldest first. */
export async function storedBuckets(
  sequelize: Sequelize,
  table: 'rollups_1m' | 'rollups_1h',
  systemId: string,
): Promise<BucketEnergy[]> {
  return sequelize.query<BucketEnergy>(
    `SELECT round(extract(epoch FROM bucket_start) * 1000)::float8 AS "bucketStart",
       reading_count::int AS "readingCount", ah_in AS "ahIn", ah_out AS "ahOut", wh_in AS "whIn", wh_out AS "whOut"
     FROM ${table} WHERE system_id = :systemId ORDER BY bucket_start`,
    { replacements: { systemId }, type: QueryTypes.SELECT },
  );
}

/** Buckets whose count differs, or whose energy differs by more than a rounding error (1e-9 relative). */
export function mismatchedBuckets(stored: readonly BucketEnergy[], expected: readonly BucketEnergy[]) {
  const byStart = new Map(stored.map((b) => [b.bucketStart, b]));
  const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));
  const missing = expected.filter((e) => !byStart.has(e.bucketStart));
  const differing = expected.filter((e) => {
    const s = byStart.get(e.bucketStart);
    if (!s) return false;
    return (
      s.readingCount !== e.readingCount ||
      !close(s.ahIn, e.ahIn) ||
      !close(s.ahOut, e.ahOut) ||
      !close(s.whIn, e.whIn) ||
      !close(s.whOut, e.whOut)
    );
  });
  const extra = stored.length - (expected.length - missing.length);
  return { missing, differing, extra };
}
