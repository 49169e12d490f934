import { Op, fn, literal, type Sequelize } from 'sequelize';
import type { AuditAction, AuditEntry } from '@cellwarden/shared';
import { epochMs } from '../database/sql-values';
import { initModels } from '../database/models';

/** Data access for the audit trail. */
export function createAuditRepository(sequelize: Sequelize) {
  const { AuditEntry: Entry, User } = initModels(sequelize);
  return {
    async insert(entry: { systemId: string; actorId: string | null; action: AuditAction; detail: string }) {
      await Entry.create(entry, { returning: false });
    },
    async list(systemId: string, limit: number, before: number | null): Promise<AuditEntry[]> {
      const rows = await Entry.findAll({
        where: {
          systemId,
          // Paging by the API's millisecond time, compared in the database at full (microsecond) precision.
          ...(before === null ? {} : { at: { [Op.lt]: fn('to_timestamp', before / 1000) } }),
        },
        // `at` in milliseconds with its microseconds kept (a JS Date would drop them, and the next page's
        // `before` would skip entries written within the same millisecond).
        attributes: ['id', [literal(epochMs('"AuditEntry"."at"')), 'at'], 'action', 'detail'],
        include: [{ model: User, as: 'actor', attributes: ['id', 'displayName', 'email'] }],
        order: [
          ['at', 'DESC'],
          ['id', 'DESC'],
        ],
        limit,
      });
      return rows.map((row) => {
        const { id, at, action, detail, actor } = row.get({ plain: true }) as unknown as AuditEntry;
        return { id, at, action, detail, actor: actor ?? null };
      });
    },
  };
}

export type AuditRepository = ReturnType<typeof createAuditRepository>;
