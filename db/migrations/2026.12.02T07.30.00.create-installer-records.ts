import { inTransaction, type Migration } from './migration';

/** What an installer leaves behind: commissioning checks, uploaded photos and logs, energy budgets. */
export const createInstallerRecords: Migration = {
  name: '2026.12.02T07.30.00.create-installer-records',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE commissioning_checks (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        installer_id uuid NOT NULL REFERENCES users(id) ON DELETE RESTRICT,
        request jsonb NOT NULL,
        status text NOT NULL CHECK (status IN ('running','passed','failed','abandoned')),
        progress jsonb NOT NULL DEFAULT '{}',
        result jsonb,
        started_at timestamptz NOT NULL DEFAULT now(),
        finished_at timestamptz
      )`,
      `CREATE INDEX commissioning_checks_system_idx ON commissioning_checks (system_id, started_at DESC)`,
      `CREATE TABLE uploads (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        uploaded_by uuid REFERENCES users(id) ON DELETE SET NULL,
        kind text NOT NULL CHECK (kind IN ('photo','log')),
        file_name text NOT NULL CHECK (length(file_name) BETWEEN 1 AND 200),
        stored_name text NOT NULL UNIQUE,
        content_type text NOT NULL,
        bytes integer NOT NULL CHECK (bytes > 0),
        caption text NOT NULL DEFAULT '' CHECK (length(caption) <= 300),
        uploaded_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX uploads_system_idx ON uploads (system_id, uploaded_at DESC)`,
      `CREATE TABLE energy_budgets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
        budget jsonb NOT NULL,
        created_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX energy_budgets_system_idx ON energy_budgets (system_id)`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      'DROP TABLE energy_budgets',
      'DROP TABLE uploads',
      'DROP TABLE commissioning_checks',
    ]),
};
