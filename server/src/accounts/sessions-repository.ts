import { QueryTypes, type Sequelize } from 'sequelize';
import type { UserRecord } from './accounts-repository';

/** One refresh token, as stored (by hash). */
export interface RefreshTokenRecord {
  tokenHash: string;
  familyId: string;
  userId: string;
  expiresAt: Date;
  rotatedAt: Date | null;
  revokedAt: Date | null;
}

/** Why a sign-in session ended; kept for the audit trail of a person's own sessions. */
export type SessionEndReason =
  | 'signed-out'
  | 'refresh-token-reused'
  | 'password-reset'
  | 'password-changed'
  | 'roles-changed'
  | 'removed-from-company';

/**
 * Data access for sign-in sessions and their refresh tokens. A session's id is its refresh-token family id,
 * and every access token carries it, so ending the session row ends them all.
 */
export function createSessionsRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    async startSession(sessionId: string, userId: string): Promise<void> {
      await sequelize.query(`INSERT INTO sign_in_sessions (id, user_id) VALUES (:sessionId, :userId)`, {
        replacements: { sessionId, userId },
      });
    },

    /** The person of a session that is still open, or undefined: the one check behind every access token. */
    async openSessionUser(sessionId: string, userId: string): Promise<UserRecord | undefined> {
      const rows = await select<UserRecord>(
        `SELECT u.id, u.email, u.display_name AS "displayName", u.password_hash AS "passwordHash", u.roles,
           u.company_id AS "companyId"
         FROM sign_in_sessions s JOIN users u ON u.id = s.user_id
         WHERE s.id = :sessionId AND s.user_id = :userId AND s.ended_at IS NULL`,
        { sessionId, userId },
      );
      return rows[0];
    },

    /** Of these session ids, the ones still open (the live stream checks its sockets with one query). */
    async stillOpen(sessionIds: readonly string[]): Promise<Set<string>> {
      if (sessionIds.length === 0) return new Set();
      const rows = await select<{ id: string }>(
        `SELECT id FROM sign_in_sessions WHERE id = ANY(ARRAY[:sessionIds]::uuid[]) AND ended_at IS NULL`,
        { sessionIds: [...sessionIds] },
      );
      return new Set(rows.map((r) => r.id));
    },

    async insert(token: { tokenHash: string; familyId: string; userId: string; expiresAt: Date }) {
      await sequelize.query(
        `INSERT INTO refresh_tokens (token_hash, family_id, user_id, expires_at)
         VALUES (:tokenHash, :familyId, :userId, :expiresAt)`,
        { replacements: token },
      );
    },

    /** Marks the token rotated, once: only one of two concurrent refreshes with the same token wins. */
    async claimForRotation(tokenHash: string): Promise<RefreshTokenRecord | undefined> {
      const rows = await sequelize.query<RefreshTokenRecord>(
        `UPDATE refresh_tokens SET rotated_at = now()
         WHERE token_hash = :tokenHash AND rotated_at IS NULL AND revoked_at IS NULL AND expires_at > now()
         RETURNING token_hash AS "tokenHash", family_id AS "familyId", user_id AS "userId",
           expires_at AS "expiresAt", rotated_at AS "rotatedAt", revoked_at AS "revokedAt"`,
        { replacements: { tokenHash }, type: QueryTypes.SELECT },
      );
      return rows[0];
    },

    async findFamily(tokenHash: string): Promise<string | undefined> {
      const rows = await select<{ familyId: string }>(
        `SELECT family_id AS "familyId" FROM refresh_tokens WHERE token_hash = :tokenHash`,
        { tokenHash },
      );
      return rows[0]?.familyId;
    },

    /** Ends one session: its refresh tokens and (through the session row) its access tokens. */
    async endSession(sessionId: string, reason: SessionEndReason): Promise<void> {
      await sequelize.transaction(async (transaction) => {
        await sequelize.query(
          `UPDATE refresh_tokens SET revoked_at = now() WHERE family_id = :sessionId AND revoked_at IS NULL`,
          { replacements: { sessionId }, transaction },
        );
        await sequelize.query(
          `UPDATE sign_in_sessions SET ended_at = now(), ended_reason = :reason
           WHERE id = :sessionId AND ended_at IS NULL`,
          { replacements: { sessionId, reason }, transaction },
        );
      });
    },

    /** Ends every session of a person, except `keep` (the one that asked, after a password change). */
    async endAllForUser(userId: string, reason: SessionEndReason, keep?: string): Promise<void> {
      const replacements = { userId, reason, keep: keep ?? null };
      await sequelize.transaction(async (transaction) => {
        await sequelize.query(
          `UPDATE refresh_tokens SET revoked_at = now()
           WHERE user_id = :userId AND revoked_at IS NULL AND family_id IS DISTINCT FROM :keep::uuid`,
          { replacements, transaction },
        );
        await sequelize.query(
          `UPDATE sign_in_sessions SET ended_at = now(), ended_reason = :reason
           WHERE user_id = :userId AND ended_at IS NULL AND id IS DISTINCT FROM :keep::uuid`,
          { replacements, transaction },
        );
      });
    },
  };
}

export type SessionsRepository = ReturnType<typeof createSessionsRepository>;
