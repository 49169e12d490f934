import { inTransaction, type Migration } from './migration';

/**
 * One row per sign-in. Every access token names its session; ending the row (sign-out, password reset or
 * change, role change, removal from a company) ends that session's access tokens and stream at once.
 * Refresh-token families created before this table have no session and so end: those people sign in again.
 */
export const createSignInSessions: Migration = {
  name: '2026.12.03T09.00.00.create-sign-in-sessions',
  up: (sequelize) =>
    inTransaction(sequelize, [
      `CREATE TABLE sign_in_sessions (
        id uuid PRIMARY KEY,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        ended_at timestamptz,
        ended_reason text CHECK (length(ended_reason) <= 60)
      )`,
      `CREATE INDEX sign_in_sessions_open_idx ON sign_in_sessions (user_id) WHERE ended_at IS NULL`,
      `UPDATE refresh_tokens SET revoked_at = now() WHERE revoked_at IS NULL`,
    ]),
  down: (sequelize) => inTransaction(sequelize, ['DROP TABLE sign_in_sessions']),
};
