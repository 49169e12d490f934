import { Op, fn, type Sequelize } from 'sequelize';
import type { Grant } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { AccessGrant } from './grant-model';
import type { GrantFacts } from './access-policy';

/** The API's view of a grant, judged active at `now` (epoch ms). */
function toGrant(row: AccessGrant, now: number): Grant {
  const { system, granter, granteeCompany } = row;
  return {
    id: row.id,
    systemId: row.systemId,
    systemName: system!.name,
    access: row.access,
    granteeCompany: granteeCompany ? { id: granteeCompany.id, name: granteeCompany.name } : null,
    // A person is shown by the address the grant was made out to, the same whether or not it has an account
    // yet (a name or id would tell the granter which addresses sign in).
    granteeUser:
      row.granteeEmail === null ? null : { id: '', email: row.granteeEmail, displayName: row.granteeEmail },
    grantedBy: { id: granter!.id, displayName: granter!.displayName },
    createdAt: row.createdAt.getTime(),
    expiresAt: row.expiresAt.getTime(),
    revokedAt: row.revokedAt?.getTime() ?? null,
    active: row.revokedAt === null && row.expiresAt.getTime() > now,
  };
}

/** Data access for grants of access to systems. */
export function createGrantsRepository(sequelize: Sequelize) {
  const { AccessGrant, System, User, Company } = initModels(sequelize);
  const list = async (where: Record<PropertyKey, unknown>, now: number) => {
    const rows = await AccessGrant.findAll({
      where,
      include: [
        { model: System, as: 'system', attributes: ['name'], required: true },
        { model: User, as: 'granter', attributes: ['id', 'displayName'], required: true },
        { model: Company, as: 'granteeCompany', attributes: ['id', 'name'] },
      ],
      order: [['createdAt', 'DESC']],
    });
    return rows.map((row) => toGrant(row, now));
  };
  return {
    listForSystem: (systemId: string, now: number) => list({ systemId }, now),

    listReceived: (userId: string, companyId: string | null, now: number) =>
      list(
        {
          [Op.or]: [
            { granteeUserId: userId },
            ...(companyId === null ? [] : [{ granteeCompanyId: companyId }]),
          ],
        },
        now,
      ),

    async find(systemId: string, grantId: string, now: number): Promise<Grant | undefined> {
      return (await list({ systemId, id: grantId }, now))[0];
    },

    /** The grants on one system that could still give someone access (not revoked, not expired). */
    async factsForSystem(systemId: string, now: number): Promise<GrantFacts[]> {
      const rows = await AccessGrant.scope({ method: ['active', now] }).findAll({
        where: { systemId },
        attributes: ['access', 'granteeUserId', 'granteeCompanyId', 'expiresAt', 'revokedAt'],
        raw: true,
      });
      return rows.map((row) => ({
        access: row.access,
        granteeUserId: row.granteeUserId ?? null,
        granteeCompanyId: row.granteeCompanyId ?? null,
        expiresAt: row.expiresAt.getTime(),
        revokedAt: row.revokedAt?.getTime() ?? null,
      }));
    },

    async create(grant: {
      systemId: string;
      granteeCompanyId: string | null;
      granteeUserId: string | null;
      granteeEmail: string | null;
      access: 'view' | 'configure';
      grantedBy: string;
      expiresAt: Date;
    }): Promise<string> {
      const row = await AccessGrant.create(grant, { returning: ['id'] });
      return row.id;
    },

    /** Grants that waited for an account with this address now name the person who has it. */
    async attachWaiting(email: string, userId: string): Promise<void> {
      await AccessGrant.update(
        { granteeUserId: userId },
        { where: { granteeEmail: email, granteeUserId: null } },
      );
    },

    /** Marks a grant revoked; true when it was not revoked before. */
    async revoke(systemId: string, grantId: string): Promise<boolean> {
      const [count] = await AccessGrant.update(
        { revokedAt: fn('now') },
        { where: { systemId, id: grantId, revokedAt: null } },
      );
      return count > 0;
    },
  };
}

export type GrantsRepository = ReturnType<typeof createGrantsRepository>;
