import { inTransaction, type Migration } from './migration';

// The minute's last state of charge from the readings that carried one; an hour's from its minutes.
const backfillMinutes = `UPDATE rollups_1m m SET soc_last_at = r.at
  FROM (SELECT system_id, date_trunc('minute', measured_at) AS bucket, max(measured_at) AS at FROM readings
        WHERE state_of_charge IS NOT NULL GROUP BY 1, 2) r
  WHERE m.system_id = r.system_id AND m.bucket_start = r.bucket`;
const backfillHours = `UPDATE rollups_1h h SET soc_last_at = m.at
  FROM (SELECT system_id, date_trunc('hour', bucket_start) AS bucket, max(soc_last_at) AS at FROM rollups_1m
        GROUP BY 1, 2) m
  WHERE h.system_id = m.system_id AND h.bucket_start = m.bucket`;

/**
 * Rollups are updated from each batch's new readings rather than recomputed, so a bucket keeps the time of its
 * last state of charge: a late reading replaces `soc_last` only when it was measured after that.
 */
export const alterRollups: Migration = {
  name: '2026.12.03T12.50.00.alter-rollups',
  up: (sequelize) =>
    inTransaction(sequelize, [
      'ALTER TABLE rollups_1m ADD COLUMN soc_last_at timestamptz',
      'ALTER TABLE rollups_1h ADD COLUMN soc_last_at timestamptz',
      backfillMinutes,
      backfillHours,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      'ALTER TABLE rollups_1h DROP COLUMN soc_last_at',
      'ALTER TABLE rollups_1m DROP COLUMN soc_last_at',
    ]),
};
