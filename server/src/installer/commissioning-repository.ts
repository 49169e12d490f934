import { fn, type Sequelize } from 'sequelize';
import type { CommissioningCheck, CommissioningCheckRequest } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { CommissioningRun } from './installer-models';

/** A stored check with the request it was started with. */
export type StoredCheck = CommissioningCheck & { request: CommissioningCheckRequest };

// The API's view of a run: the source, rating and tolerance it was asked for come from its request (10 % when
// the request named none).
function toStoredCheck(row: CommissioningRun): StoredCheck {
  const { request, installer } = row;
  return {
    id: row.id,
    systemId: row.systemId,
    sourceId: request.sourceId,
    ratedCurrentA: request.ratedCurrentA,
    tolerancePercent: request.tolerancePercent ?? 10,
    status: row.status,
    progress: row.progress as CommissioningCheck['progress'],
    startedAt: row.startedAt.getTime(),
    finishedAt: row.finishedAt?.getTime() ?? null,
    installer: { id: installer!.id, displayName: installer!.displayName },
    result: row.result as CommissioningCheck['result'],
    request,
  };
}

/** Data access for commissioning checks. */
export function createCommissioningRepository(sequelize: Sequelize) {
  const { CommissioningRun, User } = initModels(sequelize);
  const installer = { model: User, as: 'installer', attributes: ['id', 'displayName'], required: true };
  return {
    async insert(
      systemId: string,
      installerId: string,
      request: CommissioningCheckRequest,
      progress: object,
    ) {
      const row = await CommissioningRun.create(
        { systemId, installerId, request, status: 'running', progress },
        { returning: ['id'] },
      );
      return row.id;
    },
    async saveProgress(id: string, progress: object) {
      await CommissioningRun.scope('running').update({ progress }, { where: { id } });
    },
    async finish(
      id: string,
      status: 'passed' | 'failed' | 'abandoned',
      progress: object,
      result: object | null,
    ) {
      await CommissioningRun.scope('running').update(
        { status, progress, result, finishedAt: fn('now') },
        { where: { id } },
      );
    },
    /** Checks left running by a previous process cannot finish: they are marked abandoned. */
    async abandonRunning() {
      await CommissioningRun.scope('running').update(
        { status: 'abandoned', finishedAt: fn('now') },
        { where: {} },
      );
    },
    async list(systemId: string): Promise<StoredCheck[]> {
      const rows = await CommissioningRun.findAll({
        where: { systemId },
        include: [installer],
        order: [['startedAt', 'DESC']],
        limit: 200,
      });
      return rows.map(toStoredCheck);
    },
    async find(systemId: string, id: string): Promise<StoredCheck | undefined> {
      const row = await CommissioningRun.findOne({ where: { systemId, id }, include: [installer] });
      return row ? toStoredCheck(row) : undefined;
    },
  };
}

export type CommissioningRepository = ReturnType<typeof createCommissioningRepository>;
