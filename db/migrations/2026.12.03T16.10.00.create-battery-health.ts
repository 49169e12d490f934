import { inTransaction, type Migration } from './migration';

/**
 * Battery life-cycle storage: each capacity estimate the tracker made, and per system the tracker's and the
 * life-cycle accumulator's state together with the rollup bucket each has consumed up to, so the job only
 * ever reads rollups newer than its checkpoint and a year of readings is never scanned again.
 */
export const createBatteryHealth: Migration = {
  name: '2026.12.03T16.10.00.create-battery-health',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE battery_capacity_samples (
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        at timestamptz NOT NULL,
        full_at timestamptz NOT NULL,
        usable_ah double precision NOT NULL CHECK (usable_ah > 0),
        sigma_ah double precision NOT NULL CHECK (sigma_ah >= 0),
        counted_ah double precision NOT NULL,
        soc_at_end double precision NOT NULL,
        method text NOT NULL CHECK (method IN ('rested-ocv','low-voltage-cutoff')),
        temperature double precision,
        PRIMARY KEY (system_id, at)
      )`,
      `CREATE TABLE battery_health_checkpoints (
        system_id uuid PRIMARY KEY REFERENCES systems(id) ON DELETE CASCADE,
        capacity_state jsonb,
        -- Every minute bucket that starts before this has been fed to the capacity tracker.
        minutes_through timestamptz,
        lifecycle_state jsonb,
        -- Every hour bucket that starts before this has been fed to the life-cycle accumulator.
        hours_through timestamptz,
        -- The usable capacity the accumulator counts cycles against; a change restarts the figures.
        usable_ah double precision NOT NULL,
        -- Readings the consumed hours held: when the hours before the checkpoint hold more (late data),
        -- the life-cycle figures are rebuilt from the hour rollups; the tracker goes on (see DEVELOPERS.md).
        hours_reading_count bigint NOT NULL DEFAULT 0,
        late_rebuilds integer NOT NULL DEFAULT 0,
        covered_from timestamptz,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      'DROP TABLE battery_health_checkpoints',
      'DROP TABLE battery_capacity_samples',
    ]),
};
