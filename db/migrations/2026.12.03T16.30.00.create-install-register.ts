import { inTransaction, type Migration } from './migration';

/**
 * A system's install register: every component fitted (with its ratings, by kind, as jsonb) and every
 * circuit as wired (conductor, run, surroundings, protection). A component a circuit feeds cannot be removed
 * before the circuit (RESTRICT), so no circuit ever points at nothing.
 */
export const createInstallRegister: Migration = {
  name: '2026.12.03T16.30.00.create-install-register',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE install_components (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
        kind text NOT NULL CHECK (kind IN ('battery','charge-source','inverter','heater','fridge','load')),
        ratings jsonb NOT NULL CHECK (ratings->>'kind' = kind),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX install_components_system_idx ON install_components (system_id)`,
      `CREATE TABLE install_circuits (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        component_id uuid NOT NULL REFERENCES install_components(id) ON DELETE RESTRICT,
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
        conductor_awg text,
        conductor_mm2 double precision CHECK (conductor_mm2 > 0),
        construction text NOT NULL CHECK (construction IN ('stranded','fine-stranded','solid')),
        one_way_length_m double precision NOT NULL CHECK (one_way_length_m > 0),
        insulation_rating_c integer NOT NULL CHECK (insulation_rating_c IN (60,75,90,105)),
        location text NOT NULL CHECK (location IN ('general','engine-space')),
        ambient_c double precision NOT NULL,
        bundled_conductors integer NOT NULL CHECK (bundled_conductors >= 1),
        protection_device text NOT NULL CHECK (protection_device IN ('fuse','breaker')),
        protection_rating_a double precision NOT NULL CHECK (protection_rating_a > 0),
        protection_type text NOT NULL DEFAULT '',
        fuse_distance_m double precision CHECK (fuse_distance_m >= 0),
        sheathed boolean NOT NULL DEFAULT false,
        design_current_a double precision CHECK (design_current_a > 0),
        allowed_drop_percent double precision NOT NULL CHECK (allowed_drop_percent > 0),
        monitoring text NOT NULL DEFAULT 'none' CHECK (monitoring IN ('battery-feed','source','none')),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK ((conductor_awg IS NULL) <> (conductor_mm2 IS NULL))
      )`,
      `CREATE INDEX install_circuits_system_idx ON install_circuits (system_id)`,
      `CREATE INDEX install_circuits_component_idx ON install_circuits (component_id)`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, ['DROP TABLE install_circuits', 'DROP TABLE install_components']),
};
