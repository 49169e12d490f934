import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditAction, AuditEntry } from '@cellwarden/shared';

/** Data access for the audit trail. */
export function createAuditRepository(sequelize: Sequelize) {
  return {
    async insert(entry: { systemId: string; actorId: string | null; action: AuditAction; detail: string }) {
      await sequelize.query(
        `INSERT INTO audit_entries (system_id, actor_id, action, detail) VALUES (:systemId, :actorId, :action, :detail)`,
        { replacements: entry },
      );
    },
    list: (systemId: string, limit: number, before: number | null) =>
      sequelize.query<AuditEntry>(
        `SELECT a.id::text AS id, (extract(epoch FROM a.at) * 1000)::float8 AS at, a.action, a.detail,
           CASE WHEN u.id IS NULL THEN NULL
             ELSE json_build_object('id', u.id, 'displayName', u.display_name, 'email', u.email) END AS actor
         FROM audit_entries a LEFT JOIN users u ON u.id = a.actor_id
         WHERE a.system_id = :systemId AND (:before::float8 IS NULL OR a.at < to_timestamp(:before::float8 / 1000.0))
         ORDER BY a.at DESC, a.id DESC LIMIT :limit`,
        { replacements: { systemId, limit, before }, type: QueryTypes.SELECT },
      ),
  };
}

export type AuditRepository = ReturnType<typeof createAuditRepository>;
