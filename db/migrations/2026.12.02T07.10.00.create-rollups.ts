import { inTransaction, type Migration } from './migration';

// One statement per resolution; the columns are the same so one upsert serves both.
const rollupTable = (name: string) => `CREATE TABLE ${name} (
  system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
  bucket_start timestamptz NOT NULL,
  reading_count integer NOT NULL,
  voltage_min double precision NOT NULL, voltage_max double precision NOT NULL,
  voltage_sum double precision NOT NULL, voltage_last double precision NOT NULL,
  current_min double precision NOT NULL, current_max double precision NOT NULL,
  current_sum double precision NOT NULL, current_last double precision NOT NULL,
  temperature_min double precision NOT NULL, temperature_max double precision NOT NULL,
  temperature_sum double precision NOT NULL, temperature_last double precision NOT NULL,
  soc_min double precision, soc_max double precision, soc_sum double precision, soc_count integer NOT NULL DEFAULT 0,
  soc_last double precision,
  last_measured_at timestamptz NOT NULL,
  ah_in double precision NOT NULL DEFAULT 0, ah_out double precision NOT NULL DEFAULT 0,
  wh_in double precision NOT NULL DEFAULT 0, wh_out double precision NOT NULL DEFAULT 0,
  PRIMARY KEY (system_id, bucket_start)
)`;

/**
 * Per-minute and per-hour summaries (min/max/mean/last, Ah and Wh in and out), kept current as readings
 * arrive, so a year of history is read from hours, not from millions of readings.
 */
export const createRollups: Migration = {
  name: '2026.12.02T07.10.00.create-rollups',
  up: (sequelize) => inTransaction(sequelize, [rollupTable('rollups_1m'), rollupTable('rollups_1h')]),
  down: (sequelize) => inTransaction(sequelize, ['DROP TABLE rollups_1h', 'DROP TABLE rollups_1m']),
};
