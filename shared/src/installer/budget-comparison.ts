// Measured energy over some days against the budget, per day, so an owner sees which side is off.
import { EnergyBudget } from './energy-budget';
import { requireNumberInRange } from './installer-input-error';

/** Energy measured at the battery over a span of days. */
export interface MeasuredEnergy {
  /** Energy into the battery over the span, Wh. */
  whIn: number;
  /** Energy out of the battery over the span, Wh. */
  whOut: number;
  /** Length of the span, days (fractions allowed). */
  days: number;
}

/** Measured per-day figures and their differences from the budget (measured − budgeted). */
export interface BudgetComparison {
  /** Measured energy in per day, Wh. */
  actualWhInPerDay: number;
  /** Measured energy out per day, Wh. */
  actualWhOutPerDay: number;
  /** Measured balance per day, Wh. */
  actualBalanceWhPerDay: number;
  /** Measured − budgeted energy in per day, Wh. */
  whInDifferencePerDay: number;
  /** Measured − budgeted energy out per day, Wh. */
  whOutDifferencePerDay: number;
  /** Measured − budgeted balance per day, Wh. */
  balanceDifferencePerDay: number;
  /** Energy-in difference as a percentage of the budget; undefined when the budget has none. */
  whInDifferencePercent: number | undefined;
  /** Energy-out difference as a percentage of the budget; undefined when the budget has none. */
  whOutDifferencePercent: number | undefined;
}

/** Compares measured energy with a budget per day; throws InstallerInputError on a bad measurement. */
export function compareBudgetWithActual(
  budget: Pick<EnergyBudget, 'whInPerDay' | 'whOutPerDay' | 'balanceWhPerDay'>,
  actual: MeasuredEnergy,
): BudgetComparison {
  requireNumberInRange('actual.whIn', actual.whIn, { min: 0, max: 1e9, unit: 'Wh' });
  requireNumberInRange('actual.whOut', actual.whOut, { min: 0, max: 1e9, unit: 'Wh' });
  requireNumberInRange('actual.days', actual.days, { min: 0, max: 3660, exclusiveMin: true, unit: 'days' });
  const actualWhInPerDay = actual.whIn / actual.days;
  const actualWhOutPerDay = actual.whOut / actual.days;
  const whInDifferencePerDay = actualWhInPerDay - budget.whInPerDay;
  const whOutDifferencePerDay = actualWhOutPerDay - budget.whOutPerDay;
  return {
    actualWhInPerDay,
    actualWhOutPerDay,
    actualBalanceWhPerDay: actualWhInPerDay - actualWhOutPerDay,
    whInDifferencePerDay,
    whOutDifferencePerDay,
    balanceDifferencePerDay: actualWhInPerDay - actualWhOutPerDay - budget.balanceWhPerDay,
    whInDifferencePercent: percentOf(whInDifferencePerDay, budget.whInPerDay),
    whOutDifferencePercent: percentOf(whOutDifferencePerDay, budget.whOutPerDay),
  };
}

function percentOf(difference: number, base: number): number | undefined {
  return base === 0 ? undefined : (difference / base) * 100;
}
