import type { Sequelize } from 'sequelize';
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
import { createEnergyBudgetsRepository } from './energy-budgets-repository';

const DAY_MS = 24 * 3600_000;

/** Saved energy budgets per system, and how one compares with what the system actually did. */
export function createEnergyBudgetsService(deps: {
  sequelize: Sequelize;
  systems: SystemsService;
  readings: ReadingsRepository;
  now: () => number;
}) {
  // The store is built here from the connection the composition root gives this service.
  const budgets = createEnergyBudgetsRepository(deps.sequelize);
  const find = async (systemId: string, budgetId: string): Promise<SavedEnergyBudget> => {
    const budget = isUuid(budgetId) ? await budgets.find(systemId, budgetId) : undefined;
    if (!budget) throw notFound('Energy budget');
    return budget;
  };
  return {
    async list(user: PublicUser, systemId: string) {
      const system = await deps.systems.getFor(user, systemId, 'view');
      return budgets.list(system.id);
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
      if (budgetId) {
        await find(system.id, budgetId);
        await budgets.update(budgetId, name, budget);
        return find(system.id, budgetId);
      }
      return find(system.id, await budgets.insert(system.id, name, budget, user.id));
    },

    async remove(user: PublicUser, systemId: string, budgetId: string) {
      const system = await deps.systems.getFor(user, systemId, 'configure');
      await find(system.id, budgetId);
      await budgets.remove(budgetId);
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
