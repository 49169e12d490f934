import { fn, type Sequelize, type Transaction, type WhereOptions } from 'sequelize';
import type { Role } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { Invitation } from './link-models';

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

const toInvitationRecord = (row: Invitation): InvitationRecord => ({
  id: row.id,
  email: row.email,
  roles: row.roles,
  companyId: row.companyId,
  companyName: row.company?.name ?? null,
  expiresAt: row.expiresAt,
  acceptedAt: row.acceptedAt,
});

/** Data access for the one-time links e-mailed to people: invitations and password resets. */
export function createAccountLinksRepository(sequelize: Sequelize) {
  const { Invitation, PasswordReset, Company } = initModels(sequelize);
  const findInvitations = async (where: WhereOptions<Invitation>, newestFirst = false) =>
    (
      await Invitation.findAll({
        where,
        attributes: ['id', 'email', 'roles', 'companyId', 'expiresAt', 'acceptedAt'],
        include: [{ model: Company, as: 'company', attributes: ['name'] }],
        order: newestFirst ? [['createdAt', 'DESC']] : undefined,
      })
    ).map(toInvitationRecord);
  // Voids every unused reset link of a person, on the database's clock.
  const voidResets = (userId: string, transaction?: Transaction) =>
    PasswordReset.update({ usedAt: fn('now') }, { where: { userId, usedAt: null }, transaction });
  return {
    async createInvitation(invitation: {
      tokenHash: string;
      email: string;
      roles: Role[];
      companyId: string | null;
      invitedBy: string;
      expiresAt: Date;
    }): Promise<string> {
      return (await Invitation.create(invitation)).id;
    },

    async findInvitation(tokenHash: string): Promise<InvitationRecord | undefined> {
      return (await findInvitations({ tokenHash }))[0];
    },

    listInvitations: (companyId: string) => findInvitations({ companyId }, true),

    /** Withdraws an open invitation of this company: its link stops working. False when there is none. */
    async withdrawInvitation(companyId: string, id: string): Promise<boolean> {
      const [count] = await Invitation.scope('active').update(
        { expiresAt: fn('now') },
        { where: { id, companyId } },
      );
      return count > 0;
    },

    /** Marks an invitation used, once; a second use (or a race) gets undefined. */
    async claimInvitation(tokenHash: string): Promise<InvitationRecord | undefined> {
      const [, rows] = await Invitation.scope('active').update(
        { acceptedAt: fn('now') },
        { where: { tokenHash }, returning: true },
      );
      return rows[0] && (await findInvitations({ id: rows[0].id }))[0];
    },

    /** Stores a new reset link and voids every older unused one of the same person, in one transaction. */
    async createPasswordReset(reset: { tokenHash: string; userId: string; expiresAt: Date }) {
      await sequelize.transaction(async (transaction) => {
        await voidResets(reset.userId, transaction);
        await PasswordReset.create(reset, { transaction, returning: false });
      });
    },

    /** Voids every unused reset link of a person (after a completed reset). */
    async voidPasswordResets(userId: string): Promise<void> {
      await voidResets(userId);
    },

    /** Uses a reset link once; undefined when unknown, used or expired. */
    async claimPasswordReset(tokenHash: string): Promise<string | undefined> {
      const [, rows] = await PasswordReset.scope('active').update(
        { usedAt: fn('now') },
        { where: { tokenHash }, returning: true },
      );
      return rows[0]?.userId;
    },
  };
}

export type AccountLinksRepository = ReturnType<typeof createAccountLinksRepository>;
