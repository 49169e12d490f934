import { inTransaction, type Migration } from './migration';

/** A battery system (a van's, a boat's, a cabin's) and the monitors that report on it. */
export const createSystems: Migration = {
  name: '2026.12.02T06.10.00.create-systems',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE systems (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
        kind text NOT NULL CHECK (kind IN ('van','cabin','boat')),
        chemistry text NOT NULL CHECK (chemistry IN ('lifepo4','agm','flooded')),
        nominal_voltage integer NOT NULL CHECK (nominal_voltage IN (12,24,48)),
        rated_capacity_ah double precision NOT NULL CHECK (rated_capacity_ah > 0 AND rated_capacity_ah <= 10000),
        usable_capacity_ah double precision NOT NULL CHECK (usable_capacity_ah > 0 AND usable_capacity_ah <= rated_capacity_ah),
        bms_continuous_discharge_a double precision CHECK (bms_continuous_discharge_a > 0),
        owner_id uuid NOT NULL REFERENCES users(id) ON DELETE RESTRICT,
        installer_company_id uuid REFERENCES companies(id) ON DELETE SET NULL,
        time_zone text NOT NULL DEFAULT 'UTC',
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX systems_owner_idx ON systems (owner_id)`,
      `CREATE INDEX systems_installer_company_idx ON systems (installer_company_id)`,
      `CREATE TABLE devices (
        id text PRIMARY KEY CHECK (id ~ '^[a-z0-9][a-z0-9-]{2,62}$'),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        label text NOT NULL DEFAULT 'battery monitor',
        secret_hash text NOT NULL,
        revoked_at timestamptz,
        last_seen_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX devices_system_idx ON devices (system_id)`,
    ]),
  down: (sequelize) => inTransaction(sequelize, ['DROP TABLE devices', 'DROP TABLE systems']),
};
