import { QueryTypes, type Sequelize } from 'sequelize';
import {
  compareBudgetWithActual,
  energyBudget,
  type EnergyBudgetComparison,
  type EnergyBudgetInput,
  type PublicUser,
  type SavedEnergyBudget,
} from '@cellwarden/shared';
import { notFound } from '../errors/app-error';
import type { SystemsService } from '../systems/systems-service';
import type { ReadingsRepository } from '../telemetry/readings-repository';
import { isUuid } from '../database/sql-values';

const DAY_MS = 24 * 3600_000;
const SELECT_BUDGET = `SELECT id, name, budget, (extract(epoch FROM created_at) * 1000)::float8 AS "createdAt",
  (extract(epoch FROM updated_at) * 1000)::float8 AS "updatedAt" FROM energy_budgets`;

/** Saved energy budgets per system, and how one compares with what the system actually did. */
export function createEnergyBudgetsService(deps: {
  sequelize: Sequelize;
  systems: SystemsService;
  readings: ReadingsRepository;
  now: () => number;
}) {
  const select = (where: string, replacements: Record<string, unknown>) =>
    deps.sequelize.query<SavedEnergyBudget>(`${SELECT_BUDGET} ${where}`, {
      replacements,
      type: QueryTypes.SELECT,
    });
  const find = async (systemId: string, budgetId: string) => {
    const [budget] = isUuid(budgetId)
      ? await select('WHERE system_id = :systemId AND id = :budgetId', { systemId, budgetId })
      : [];
    if (!budget) throw notFound('Energy budget');
    return budget;
  };
  return {
    async list(user: PublicUser, systemId: string) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return select('WHERE system_id = :systemId ORDER BY updated_at DESC', { systemId: system.id });
    },

    async save(
      user: PublicUser,
      systemId: string,
      name: string,
      budget: EnergyBudgetInput,
      budgetId?: string,
    ) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      energyBudget(budget); // refuses an impossible budget, naming its field
      const replacements = {
        systemId: system.id,
        name,
        budget: JSON.stringify(budget),
        userId: user.id,
        budgetId,
      };
      if (budgetId) {
        await find(system.id, budgetId);
        await deps.sequelize.query(
          `UPDATE energy_budgets SET name = :name, budget = :budget::jsonb, updated_at = now() WHERE id = :budgetId`,
          { replacements },
        );
        return find(system.id, budgetId);
      }
      const [row] = await deps.sequelize.query<{ id: string }>(
        `INSERT INTO energy_budgets (system_id, name, budget, created_by) VALUES (:systemId, :name, :budget::jsonb, :userId)
         RETURNING id`,
        { replacements, type: QueryTypes.SELECT },
      );
      return find(system.id, row.id);
    },

    async remove(user: PublicUser, systemId: string, budgetId: string) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      await find(system.id, budgetId);
      await deps.sequelize.query('DELETE FROM energy_budgets WHERE id = :budgetId', {
        replacements: { budgetId },
      });
    },

    /** The budget against the measured energy of the last `days` whole days, from the hour rollups. */
    async compare(
      user: PublicUser,
      systemId: string,
      budgetId: string,
      days: number,
    ): Promise<EnergyBudgetComparison> {
      const system = await deps.systems.getFor(user, systemId, 'view');
      const saved = await find(system.id, budgetId);
      const to = new Date(Math.floor(deps.now() / DAY_MS) * DAY_MS);
      const from = new Date(to.getTime() - days * DAY_MS);
      const perDay = (await deps.readings.dailyEnergy(system.id, from, to)).map((d) => ({
        day: d.day,
        whIn: Number(d.whIn),
        whOut: Number(d.whOut),
      }));
      const whIn = perDay.reduce((sum, d) => sum + d.whIn, 0);
      const whOut = perDay.reduce((sum, d) => sum + d.whOut, 0);
      const budget = energyBudget(saved.budget);
      return {
        budget,
        days,
        measured: { whIn, whOut, perDay },
        comparison: compareBudgetWithActual(budget, { whIn, whOut, days }),
      };
    },
  };
}

export type EnergyBudgetsService = ReturnType<typeof createEnergyBudgetsService>;
