import { inTransaction, type Migration } from './migration';

/**
 * Onboarding and support requests: the BMS figures a new system is set up with, the hand-over of a system an
 * installer set up for a customer (waiting for the owner's address to accept, like a grant to an address
 * without an account), the short share codes an owner reads out on the phone, and the access requests
 * support people make. A request that matched nothing is kept too, so the requester's list looks the same
 * whether or not the address or system exists.
 */
export const createOnboardingAndRequests: Migration = {
  name: '2026.12.03T16.20.00.create-onboarding-and-requests',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `ALTER TABLE systems ADD COLUMN bms_peak_discharge_a double precision CHECK (bms_peak_discharge_a > 0)`,
      // NULL for systems set up before the question was asked: unknown, not "no cut-off".
      `ALTER TABLE systems ADD COLUMN bms_cold_charge_cutoff boolean`,
      `CREATE TABLE system_handovers (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        owner_email text NOT NULL CHECK (owner_email = lower(owner_email) AND length(owner_email) <= 254),
        offered_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        accepted_by uuid REFERENCES users(id) ON DELETE SET NULL
      )`,
      `CREATE UNIQUE INDEX system_handovers_open_idx ON system_handovers (system_id) WHERE accepted_at IS NULL`,
      `CREATE INDEX system_handovers_email_idx ON system_handovers (owner_email) WHERE accepted_at IS NULL`,
      `CREATE TABLE access_share_codes (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        system_id uuid NOT NULL REFERENCES systems(id) ON DELETE CASCADE,
        code_hash text NOT NULL UNIQUE,
        created_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        used_by uuid REFERENCES users(id) ON DELETE SET NULL
      )`,
      `CREATE INDEX access_share_codes_system_idx ON access_share_codes (system_id) WHERE used_at IS NULL`,
      `CREATE TABLE access_requests (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        requester_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        requester_company_id uuid REFERENCES companies(id) ON DELETE SET NULL,
        via text NOT NULL CHECK (via IN ('owner-and-name', 'share-code')),
        owner_email text CHECK (owner_email = lower(owner_email) AND length(owner_email) <= 254),
        system_name text CHECK (length(system_name) <= 120),
        system_id uuid REFERENCES systems(id) ON DELETE CASCADE,
        note text NOT NULL DEFAULT '' CHECK (length(note) <= 300),
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        decision text CHECK (decision IN ('approved', 'declined')),
        decided_at timestamptz,
        decided_by uuid REFERENCES users(id) ON DELETE SET NULL,
        grant_id uuid REFERENCES grants(id) ON DELETE SET NULL
      )`,
      `CREATE INDEX access_requests_system_idx ON access_requests (system_id) WHERE decision IS NULL`,
      `CREATE INDEX access_requests_requester_idx ON access_requests (requester_id, created_at DESC)`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      'DROP TABLE access_requests',
      'DROP TABLE access_share_codes',
      'DROP TABLE system_handovers',
      'ALTER TABLE systems DROP COLUMN bms_cold_charge_cutoff',
      'ALTER TABLE systems DROP COLUMN bms_peak_discharge_a',
    ]),
};
