import type { Sequelize } from 'sequelize';
import type { EnergyBudgetInput, SavedEnergyBudget } from '@cellwarden/shared';
import { initModels } from '../database/models';
import type { SavedBudget } from './installer-models';

const ATTRIBUTES = ['id', 'name', 'budget', 'createdAt', 'updatedAt'] as const;

const toSaved = (row: Pick<SavedBudget, (typeof ATTRIBUTES)[number]>): SavedEnergyBudget => ({
  id: row.id,
  name: row.name,
  budget: row.budget,
  createdAt: row.createdAt.getTime(),
  updatedAt: row.updatedAt.getTime(),
});

/** Data access for the energy budgets saved per system. */
export function createEnergyBudgetsRepository(sequelize: Sequelize) {
  const { SavedBudget } = initModels(sequelize);
  return {
    async list(systemId: string): Promise<SavedEnergyBudget[]> {
      const rows = await SavedBudget.findAll({
        where: { systemId },
        attributes: [...ATTRIBUTES],
        order: [['updatedAt', 'DESC']],
        raw: true,
      });
      return rows.map(toSaved);
    },
    async find(systemId: string, budgetId: string): Promise<SavedEnergyBudget | undefined> {
      const row = await SavedBudget.findOne({
        where: { systemId, id: budgetId },
        attributes: [...ATTRIBUTES],
        raw: true,
      });
      return row ? toSaved(row) : undefined;
    },
    async insert(
      systemId: string,
      name: string,
      budget: EnergyBudgetInput,
      createdBy: string,
    ): Promise<string> {
      const row = await SavedBudget.create({ systemId, name, budget, createdBy }, { returning: ['id'] });
      return row.id;
    },
    /** Renames and replaces a budget; updated_at becomes the database's now() (the model's default). */
    async update(budgetId: string, name: string, budget: EnergyBudgetInput): Promise<void> {
      await SavedBudget.update({ name, budget }, { where: { id: budgetId } });
    },
    async remove(budgetId: string): Promise<void> {
      await SavedBudget.destroy({ where: { id: budgetId } });
    },
  };
}

export type EnergyBudgetsRepository = ReturnType<typeof createEnergyBudgetsRepository>;
