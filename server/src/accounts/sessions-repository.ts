import { QueryTypes, type Sequelize } from 'sequelize';

/** One refresh token, as stored (by hash). */
export interface RefreshTokenRecord {
  tokenHash: string;
  familyId: string;
  userId: string;
  expiresAt: Date;
  rotatedAt: Date | null;
  revokedAt: Date | null;
}

/** Data access for refresh tokens. */
export function createSessionsRepository(sequelize: Sequelize) {
  return {
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
      const rows = await sequelize.query<{ familyId: string }>(
        `SELECT family_id AS "familyId" FROM refresh_tokens WHERE token_hash = :tokenHash`,
        { replacements: { tokenHash }, type: QueryTypes.SELECT },
      );
      return rows[0]?.familyId;
    },

    async revokeFamily(familyId: string): Promise<void> {
      await sequelize.query(
        `UPDATE refresh_tokens SET revoked_at = now() WHERE family_id = :familyId AND revoked_at IS NULL`,
        { replacements: { familyId } },
      );
    },

    async revokeAllForUser(userId: string): Promise<void> {
      await sequelize.query(
        `UPDATE refresh_tokens SET revoked_at = now() WHERE user_id = :userId AND revoked_at IS NULL`,
        { replacements: { userId } },
      );
    },
  };
}

export type SessionsRepository = ReturnType<typeof createSessionsRepository>;
