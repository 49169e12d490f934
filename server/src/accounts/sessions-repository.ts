import { Op, QueryTypes, fn, type Sequelize, type WhereOptions } from 'sequelize';
import { initModels } from '../database/models';
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

// Every signed-in request runs this check before its route, so it is one statement rather than the model
// query with its join: Sequelize building that cost about 1.1 ms of CPU per request, the statement 0.2 ms
// (DEVELOPERS.md, "Hand-written SQL"). "Open" is the sessions' active scope: not ended.
const OPEN_SESSION_USER = `
  SELECT u.id, u.email, u.display_name AS "displayName", u.password_hash AS "passwordHash", u.roles,
    u.company_id AS "companyId"
  FROM sign_in_sessions s JOIN users u ON u.id = s.user_id
  WHERE s.id = :sessionId AND s.user_id = :userId AND s.ended_at IS NULL`;

/**
 * Data access for sign-in sessions and their refresh tokens. A session's id is its refresh-token family id,
 * and every access token carries it, so ending the session row ends them all.
 */
export function createSessionsRepository(sequelize: Sequelize) {
  const { SignInSession, RefreshToken } = initModels(sequelize);
  // Ends sessions and revokes their tokens together, on the database's clock.
  const end = (tokens: WhereOptions, sessions: WhereOptions, reason: SessionEndReason) =>
    sequelize.transaction(async (transaction) => {
      await RefreshToken.update(
        { revokedAt: fn('now') },
        { where: { ...tokens, revokedAt: null }, transaction },
      );
      await SignInSession.scope('active').update(
        { endedAt: fn('now'), endedReason: reason },
        { where: sessions, transaction },
      );
    });
  return {
    async startSession(sessionId: string, userId: string): Promise<void> {
      await SignInSession.create({ id: sessionId, userId }, { returning: false });
    },

    /** The person of a session that is still open, or undefined: the one check behind every access token. */
    async openSessionUser(sessionId: string, userId: string): Promise<UserRecord | undefined> {
      const [user] = await sequelize.query<UserRecord>(OPEN_SESSION_USER, {
        replacements: { sessionId, userId },
        type: QueryTypes.SELECT,
      });
      return user;
    },

    /** Of these session ids, the ones still open (the live stream checks its sockets with one query). */
    async stillOpen(sessionIds: readonly string[]): Promise<Set<string>> {
      if (sessionIds.length === 0) return new Set();
      const rows = await SignInSession.scope('active').findAll({
        where: { id: [...sessionIds] },
        attributes: ['id'],
        raw: true,
      });
      return new Set(rows.map((r) => r.id));
    },

    async insert(token: { tokenHash: string; familyId: string; userId: string; expiresAt: Date }) {
      await RefreshToken.create(token, { returning: false });
    },

    /** Marks the token rotated, once: only one of two concurrent refreshes with the same token wins. */
    async claimForRotation(tokenHash: string): Promise<RefreshTokenRecord | undefined> {
      const [, rows] = await RefreshToken.scope('active').update(
        { rotatedAt: fn('now') },
        { where: { tokenHash, rotatedAt: null }, returning: true },
      );
      const row = rows[0]?.get({ plain: true });
      return (
        row && {
          tokenHash: row.tokenHash,
          familyId: row.familyId,
          userId: row.userId,
          expiresAt: row.expiresAt,
          rotatedAt: row.rotatedAt,
          revokedAt: row.revokedAt,
        }
      );
    },

    async findFamily(tokenHash: string): Promise<string | undefined> {
      const row = await RefreshToken.findOne({ where: { tokenHash }, attributes: ['familyId'], raw: true });
      return row?.familyId;
    },

    /** Ends one session: its refresh tokens and (through the session row) its access tokens. */
    async endSession(sessionId: string, reason: SessionEndReason): Promise<void> {
      await end({ familyId: sessionId }, { id: sessionId }, reason);
    },

    /** Ends every session of a person, except `keep` (the one that asked, after a password change). */
    async endAllForUser(userId: string, reason: SessionEndReason, keep?: string): Promise<void> {
      await end(
        keep ? { userId, familyId: { [Op.ne]: keep } } : { userId },
        keep ? { userId, id: { [Op.ne]: keep } } : { userId },
        reason,
      );
    },
  };
}

export type SessionsRepository = ReturnType<typeof createSessionsRepository>;
