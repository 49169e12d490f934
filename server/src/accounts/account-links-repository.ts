import { QueryTypes, type Sequelize } from 'sequelize';
import type { Role } from '@cellwarden/shared';

/** An invitation as stored (the link's token only as a hash). */
export interface InvitationRecord {
  id: string;
  email: string;
  roles: Role[];
  companyId: string | null;
  companyName: string | null;
  expiresAt: Date;
  acceptedAt: Date | null;
}

const SELECT_INVITATION = `SELECT i.id, i.email, i.roles, i.company_id AS "companyId", c.name AS "companyName",
  i.expires_at AS "expiresAt", i.accepted_at AS "acceptedAt"
  FROM invitations i LEFT JOIN companies c ON c.id = i.company_id`;

/** Data access for the one-time links e-mailed to people: invitations and password resets. */
export function createAccountLinksRepository(sequelize: Sequelize) {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
    sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return {
    async createInvitation(invitation: {
      tokenHash: string;
      email: string;
      roles: Role[];
      companyId: string | null;
      invitedBy: string;
      expiresAt: Date;
    }): Promise<string> {
      const [row] = await select<{ id: string }>(
        `INSERT INTO invitations (token_hash, email, roles, company_id, invited_by, expires_at)
         VALUES (:tokenHash, :email, ARRAY[:roles]::text[], :companyId, :invitedBy, :expiresAt) RETURNING id`,
        invitation,
      );
      return row.id;
    },

    async findInvitation(tokenHash: string): Promise<InvitationRecord | undefined> {
      return (
        await select<InvitationRecord>(`${SELECT_INVITATION} WHERE i.token_hash = :tokenHash`, { tokenHash })
      )[0];
    },

    listInvitations: (companyId: string) =>
      select<InvitationRecord>(
        `${SELECT_INVITATION} WHERE i.company_id = :companyId ORDER BY i.created_at DESC`,
        {
          companyId,
        },
      ),

    /** Withdraws an open invitation of this company: its link stops working. False when there is none. */
    async withdrawInvitation(companyId: string, id: string): Promise<boolean> {
      const rows = await select<{ id: string }>(
        `UPDATE invitations SET expires_at = now()
         WHERE id = :id AND company_id = :companyId AND accepted_at IS NULL AND expires_at > now() RETURNING id`,
        { id, companyId },
      );
      return rows.length > 0;
    },

    /** Marks an invitation used, once; a second use (or a race) gets undefined. */
    async claimInvitation(tokenHash: string): Promise<InvitationRecord | undefined> {
      const [row] = await select<{ id: string }>(
        `UPDATE invitations SET accepted_at = now()
         WHERE token_hash = :tokenHash AND accepted_at IS NULL AND expires_at > now() RETURNING id`,
        { tokenHash },
      );
      return (
        row && (await select<InvitationRecord>(`${SELECT_INVITATION} WHERE i.id = :id`, { id: row.id }))[0]
      );
    },

    /** Stores a new reset link and voids every older unused one of the same person, in one transaction. */
    async createPasswordReset(reset: { tokenHash: string; userId: string; expiresAt: Date }) {
      await sequelize.transaction(async (transaction) => {
        await sequelize.query(
          `UPDATE password_resets SET used_at = now() WHERE user_id = :userId AND used_at IS NULL`,
          { replacements: reset, transaction },
        );
        await sequelize.query(
          `INSERT INTO password_resets (token_hash, user_id, expires_at) VALUES (:tokenHash, :userId, :expiresAt)`,
          { replacements: reset, transaction },
        );
      });
    },

    /** Voids every unused reset link of a person (after a completed reset). */
    async voidPasswordResets(userId: string): Promise<void> {
      await sequelize.query(
        `UPDATE password_resets SET used_at = now() WHERE user_id = :userId AND used_at IS NULL`,
        { replacements: { userId } },
      );
    },

    /** Uses a reset link once; undefined when unknown, used or expired. */
    async claimPasswordReset(tokenHash: string): Promise<string | undefined> {
      const [row] = await select<{ userId: string }>(
        `UPDATE password_resets SET used_at = now()
         WHERE token_hash = :tokenHash AND used_at IS NULL AND expires_at > now() RETURNING user_id AS "userId"`,
        { tokenHash },
      );
      return row?.userId;
    },
  };
}

export type AccountLinksRepository = ReturnType<typeof createAccountLinksRepository>;
