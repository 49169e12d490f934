import { inTransaction, type Migration } from './migration';

/** Sessions, invitations, password resets, grants of access, the audit trail and personal preferences. */
export const createAccess: Migration = {
  name: '2026.12.02T07.00.00.create-access',
  up: (sequelize) =>
    inTransaction(sequelize, [
      // A refresh token is stored only as its SHA-256; a family is one sign-in, so reuse of a rotated
      // token revokes the whole family (the thief's and the owner's copies alike).
      `CREATE TABLE refresh_tokens (
        token_hash text PRIMARY KEY,
        family_id uuid NOT NULL,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        expires_at timestamptz NOT NULL,
        rotated_at timestamptz,
        revoked_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX refresh_tokens_family_idx ON refresh_tokens (family_id)`,
      `CREATE TABLE invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        token_hash text NOT NULL UNIQUE,
        email text NOT NULL CHECK (email = lower(email)),
        roles text[] NOT NULL CHECK (roles <@ ARRAY['owner','installer','support','admin']::text[]),
        company_id uuid REFERENCES companies(id) ON DELETE CASCADE,
        invited_by uuid REFERENCES users(id) ON DELETE SET NULL,
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE TABLE password_resets (
        token_hash text PRIMARY KEY,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE TABLE grants (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        grantee_company_id uuid REFERENCES companies(id) ON DELETE CASCADE,
        grantee_user_id uuid REFERENCES users(id) ON DELETE CASCADE,
        access text NOT NULL CHECK (access IN ('view','configure')),
        granted_by uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        expires_at timestamptz NOT NULL,
        revoked_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        CHECK ((grantee_company_id IS NULL) <> (grantee_user_id IS NULL))
      )`,
      `CREATE INDEX grants_system_idx ON grants (system_id)`,
      `CREATE INDEX grants_company_idx ON grants (grantee_company_id) WHERE grantee_company_id IS NOT NULL`,
      `CREATE INDEX grants_user_idx ON grants (grantee_user_id) WHERE grantee_user_id IS NOT NULL`,
      `CREATE TABLE audit_entries (
        id bigserial PRIMARY KEY,
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
        action text NOT NULL,
        detail text NOT NULL DEFAULT '',
        at timestamptz NOT NULL DEFAULT now()
      )`,
      `CREATE INDEX audit_entries_system_at_idx ON audit_entries (system_id, at DESC)`,
      `CREATE TABLE user_preferences (
        user_id uuid PRIMARY KEY REFERENCES users(id) ON DELETE CASCADE,
        temperature_unit text NOT NULL DEFAULT 'C' CHECK (temperature_unit IN ('C','F')),
        email_flags text[] NOT NULL DEFAULT ARRAY['low-charge','cold-charging','device-silent']::text[],
        updated_at timestamptz NOT NULL DEFAULT now()
      )`,
      `ALTER TABLE systems
        ADD COLUMN charge_sources jsonb NOT NULL DEFAULT '[]',
        ADD COLUMN flag_thresholds jsonb NOT NULL DEFAULT '{}',
        ADD COLUMN bms_low_voltage_cutoff_v double precision CHECK (bms_low_voltage_cutoff_v > 0)`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      `ALTER TABLE systems DROP COLUMN charge_sources, DROP COLUMN flag_thresholds, DROP COLUMN bms_low_voltage_cutoff_v`,
      'DROP TABLE user_preferences',
      'DROP TABLE audit_entries',
      'DROP TABLE grants',
      'DROP TABLE password_resets',
      'DROP TABLE invitations',
      'DROP TABLE refresh_tokens',
    ]),
};
