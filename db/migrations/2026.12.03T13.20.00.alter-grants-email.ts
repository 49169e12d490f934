import { inTransaction, type Migration } from './migration';

/**
 * A grant to a person is made out to their e-mail address. When the address has no account yet the grant
 * waits (no user), and applies from the moment an account with that address is created: so granting reveals
 * nothing about which addresses have accounts.
 */
export const alterGrantsEmail: Migration = {
  name: '2026.12.03T13.20.00.alter-grants-email',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `ALTER TABLE grants ADD COLUMN grantee_email text CHECK (grantee_email = lower(grantee_email))`,
      `UPDATE grants g SET grantee_email = u.email FROM users u WHERE u.id = g.grantee_user_id`,
      `ALTER TABLE grants DROP CONSTRAINT grants_check`,
      `ALTER TABLE grants ADD CONSTRAINT grants_grantee_check CHECK (
        (grantee_company_id IS NOT NULL AND grantee_user_id IS NULL AND grantee_email IS NULL)
        OR (grantee_company_id IS NULL AND grantee_email IS NOT NULL))`,
      `CREATE INDEX grants_waiting_email_idx ON grants (grantee_email) WHERE grantee_user_id IS NULL`,
    ]),
  down: (sequelize) =>
    inTransaction(sequelize, [
      `DELETE FROM grants WHERE grantee_company_id IS NULL AND grantee_user_id IS NULL`,
      `ALTER TABLE grants DROP CONSTRAINT grants_grantee_check`,
      `ALTER TABLE grants DROP COLUMN grantee_email`,
      `ALTER TABLE grants ADD CONSTRAINT grants_check CHECK ((grantee_company_id IS NULL) <> (grantee_user_id IS NULL))`,
    ]),
};
