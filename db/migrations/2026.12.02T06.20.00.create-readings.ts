import { inTransaction, type Migration } from './migration';

/**
 * Readings, partitioned by month of measured time so a year of a fleet stays manageable and old
 * months can be detached whole. The primary key (system, measured time) is what makes at-least-once
 * delivery store each reading exactly once.
 */
export const createReadings: Migration = {
  name: '2026.12.02T06.20.00.create-readings',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE readings (
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        measured_at timestamptz NOT NULL,
        device_id text NOT NULL,
        voltage double precision NOT NULL,
        current double precision NOT NULL,
        temperature double precision NOT NULL,
        state_of_charge double precision,
        power double precision,
        source_currents jsonb,
        received_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (system_id, measured_at)
      ) PARTITION BY RANGE (measured_at)`,
      // Creates the monthly partitions covering [from, from + months); safe to call repeatedly and concurrently.
      `CREATE FUNCTION cw_ensure_reading_partitions(from_time timestamptz, months integer)
       RETURNS void LANGUAGE plpgsql AS $$
       DECLARE
         month_start timestamptz := date_trunc('month', from_time AT TIME ZONE 'UTC') AT TIME ZONE 'UTC';
         part_name text;
       BEGIN
         FOR i IN 0 .. months - 1 LOOP
           part_name := 'readings_' || to_char(month_start AT TIME ZONE 'UTC', 'YYYY_MM');
           PERFORM pg_advisory_xact_lock(hashtext(part_name));
           IF to_regclass(part_name) IS NULL THEN
             EXECUTE format('CREATE TABLE %I PARTITION OF readings FOR VALUES FROM (%L) TO (%L)',
               part_name, month_start, month_start + interval '1 month');
           END IF;
           month_start := month_start + interval '1 month';
         END LOOP;
       END $$`,
      `SELECT cw_ensure_reading_partitions(now() - interval '13 months', 16)`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      'DROP TABLE readings',
      'DROP FUNCTION cw_ensure_reading_partitions(timestamptz, integer)',
    ]),
};
