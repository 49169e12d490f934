import { QueryTypes, type Sequelize } from 'sequelize';
import type { CommissioningCheck, CommissioningCheckRequest } from '@cellwarden/shared';
import { epochMs as ms } from '../database/sql-values';

const SELECT_CHECK = `SELECT c.id, c.system_id AS "systemId", c.request->>'sourceId' AS "sourceId",
  (c.request->>'ratedCurrentA')::float8 AS "ratedCurrentA",
  coalesce((c.request->>'tolerancePercent')::float8, 10) AS "tolerancePercent",
  c.status, c.progress, ${ms('c.started_at')} AS "startedAt", ${ms('c.finished_at')} AS "finishedAt",
  json_build_object('id', u.id, 'displayName', u.display_name) AS installer, c.result, c.request
  FROM commissioning_checks c JOIN users u ON u.id = c.installer_id`;

/** A stored check with the request it was started with. */
export type StoredCheck = CommissioningCheck & { request: CommissioningCheckRequest };

/** Data access for commissioning checks. */
export function createCommissioningRepository(sequelize: Sequelize) {
  const select = (where: string, replacements: Record<string, unknown>) =>
    sequelize.query<StoredCheck>(`${SELECT_CHECK} ${where}`, { replacements, type: QueryTypes.SELECT });
  return {
    async insert(
      systemId: string,
      installerId: string,
      request: CommissioningCheckRequest,
      progress: object,
    ) {
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO commissioning_checks (system_id, installer_id, request, status, progress)
         VALUES (:systemId, :installerId, :request::jsonb, 'running', :progress::jsonb) RETURNING id`,
        {
          replacements: {
            systemId,
            installerId,
            request: JSON.stringify(request),
            progress: JSON.stringify(progress),
          },
          type: QueryTypes.SELECT,
        },
      );
      return row.id;
    },
    async saveProgress(id: string, progress: object) {
      await sequelize.query(
        `UPDATE commissioning_checks SET progress = :progress::jsonb WHERE id = :id AND status = 'running'`,
        {
          replacements: { id, progress: JSON.stringify(progress) },
        },
      );
    },
    async finish(
      id: string,
      status: 'passed' | 'failed' | 'abandoned',
      progress: object,
      result: object | null,
    ) {
      await sequelize.query(
        `UPDATE commissioning_checks SET status = :status, progress = :progress::jsonb, result = :result::jsonb,
           finished_at = now() WHERE id = :id AND status = 'running'`,
        {
          replacements: {
            id,
            status,
            progress: JSON.stringify(progress),
            result: result && JSON.stringify(result),
          },
        },
      );
    },
    /** Checks left running by a previous process cannot finish: they are marked abandoned. */
    async abandonRunning() {
      await sequelize.query(
        `UPDATE commissioning_checks SET status = 'abandoned', finished_at = now() WHERE status = 'running'`,
      );
    },
    list: (systemId: string) =>
      select('WHERE c.system_id = :systemId ORDER BY c.started_at DESC LIMIT 200', { systemId }),
    async find(systemId: string, id: string): Promise<StoredCheck | undefined> {
      return (await select('WHERE c.system_id = :systemId AND c.id = :id', { systemId, id }))[0];
    },
  };
}

export type CommissioningRepository = ReturnType<typeof createCommissioningRepository>;
