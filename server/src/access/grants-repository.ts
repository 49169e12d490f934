import { QueryTypes, type Sequelize } from 'sequelize';
import type { Grant } from '@cellwarden/shared';
import type { GrantFacts } from './access-policy';

const SELECT_GRANT = `
  SELECT g.id, g.system_id AS "systemId", s.name AS "systemName", g.access,
    CASE WHEN c.id IS NULL THEN NULL ELSE json_build_object('id', c.id, 'name', c.name) END AS "granteeCompany",
    -- A person is shown by the address the grant was made out to, the same whether or not it has an account
    -- yet (a name or id would tell the granter which addresses sign in).
    CASE WHEN g.grantee_email IS NULL THEN NULL
      ELSE json_build_object('id', '', 'email', g.grantee_email, 'displayName', g.grantee_email) END AS "granteeUser",
    json_build_object('id', b.id, 'displayName', b.display_name) AS "grantedBy",
    (extract(epoch FROM g.created_at) * 1000)::float8 AS "createdAt",
    (extract(epoch FROM g.expires_at) * 1000)::float8 AS "expiresAt",
    (extract(epoch FROM g.revoked_at) * 1000)::float8 AS "revokedAt",
    (g.revoked_at IS NULL AND g.expires_at > to_timestamp(:now / 1000.0)) AS active
  FROM grants g
  JOIN systems s ON s.id = g.system_id
  JOIN users b ON b.id = g.granted_by
  LEFT JOIN companies c ON c.id = g.grantee_company_id`;

/** Data access for grants of access to systems. */
export function createGrantsRepository(sequelize: Sequelize) {
  const select = (where: string, replacements: Record<string, unknown>) =>
    sequelize.query<Grant>(`${SELECT_GRANT} ${where} ORDER BY g.created_at DESC`, {
      replacements,
      type: QueryTypes.SELECT,
    });
  return {
    listForSystem: (systemId: string, now: number) =>
      select('WHERE g.system_id = :systemId', { systemId, now }),

    listReceived: (userId: string, companyId: string | null, now: number) =>
      select(
        'WHERE g.grantee_user_id = :userId OR (:companyId::uuid IS NOT NULL AND g.grantee_company_id = :companyId)',
        {
          userId,
          companyId,
          now,
        },
      ),

    async find(systemId: string, grantId: string, now: number): Promise<Grant | undefined> {
      return (
        await select('WHERE g.system_id = :systemId AND g.id = :grantId', { systemId, grantId, now })
      )[0];
    },

    /** The grants on one system that could still give someone access (not revoked, not expired). */
    async factsForSystem(systemId: string, now: number): Promise<GrantFacts[]> {
      return sequelize.query<GrantFacts>(
        `SELECT access, grantee_user_id AS "granteeUserId", grantee_company_id AS "granteeCompanyId",
           (extract(epoch FROM expires_at) * 1000)::float8 AS "expiresAt",
           (extract(epoch FROM revoked_at) * 1000)::float8 AS "revokedAt"
         FROM grants WHERE system_id = :systemId AND revoked_at IS NULL AND expires_at > to_timestamp(:now / 1000.0)`,
        { replacements: { systemId, now }, type: QueryTypes.SELECT },
      );
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
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO grants (system_id, grantee_company_id, grantee_user_id, grantee_email, access, granted_by, expires_at)
         VALUES (:systemId, :granteeCompanyId, :granteeUserId, :granteeEmail, :access, :grantedBy, :expiresAt)
         RETURNING id`,
        { replacements: grant, type: QueryTypes.SELECT },
      );
      return row.id;
    },

    /** Grants that waited for an account with this address now name the person who has it. */
    async attachWaiting(email: string, userId: string): Promise<void> {
      await sequelize.query(
        `UPDATE grants SET grantee_user_id = :userId WHERE grantee_email = :email AND grantee_user_id IS NULL`,
        { replacements: { email, userId } },
      );
    },

    /** Marks a grant revoked; true when it was not revoked before. */
    async revoke(systemId: string, grantId: string): Promise<boolean> {
      const rows = await sequelize.query(
        `UPDATE grants SET revoked_at = now()
         WHERE system_id = :systemId AND id = :grantId AND revoked_at IS NULL RETURNING id`,
        { replacements: { systemId, grantId }, type: QueryTypes.SELECT },
      );
      return rows.length > 0;
    },
  };
}

export type GrantsRepository = ReturnType<typeof createGrantsRepository>;
