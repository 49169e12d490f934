import { inTransaction, type Migration } from './migration';

/** Companies (installers, support desks) and the people who sign in. */
export const createAccounts: Migration = {
  name: '2026.12.02T06.00.00.create-accounts',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE companies (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL CHECK (email = lower(email) AND length(email) BETWEEN 3 AND 254),
        display_name text NOT NULL CHECK (length(display_name) BETWEEN 1 AND 120),
        password_hash text NOT NULL,
        roles text[] NOT NULL DEFAULT '{}' CHECK (roles <@ ARRAY['owner','installer','support','admin']::text[]),
        company_id uuid REFERENCES companies(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE UNIQUE INDEX users_email_key ON users (email)`,
    ]),
  down: (sequelize) => inTransaction(sequelize, ['DROP TABLE users', 'DROP TABLE companies']),
};
