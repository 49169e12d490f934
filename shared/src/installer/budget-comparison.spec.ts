import { compareBudgetWithActual } from './budget-comparison';

const budget = { whInPerDay: 1040, whOutPerDay: 676.4, balanceWhPerDay: 363.6 };

describe('budget comparison', () => {
  it('gives measured per-day figures and their differences from the budget', () => {
    const comparison = compareBudgetWithActual(budget, { whIn: 2800, whOut: 2400, days: 3 });
    // By hand: in 2,800 / 3 = 933.3 Wh/day (−106.7 Wh, −10.26 % of 1,040); out 2,400 / 3 = 800 Wh/day
    // (+123.6 Wh, +18.27 % of 676.4); balance 133.3 vs 363.6 → −230.3 Wh/day
    expect(comparison.actualWhInPerDay).toBeCloseTo(933.33, 2);
    expect(comparison.whInDifferencePerDay).toBeCloseTo(-106.67, 2);
    expect(comparison.whInDifferencePercent).toBeCloseTo(-10.26, 2);
    expect(comparison.whOutDifferencePerDay).toBeCloseTo(123.6, 6);
    expect(comparison.whOutDifferencePercent).toBeCloseTo(18.27, 2);
    expect(comparison.actualBalanceWhPerDay).toBeCloseTo(133.33, 2);
    expect(comparison.balanceDifferencePerDay).toBeCloseTo(-230.27, 2);
  });

  it('leaves the percentage out when the budget expects nothing on that side', () => {
    const comparison = compareBudgetWithActual(
      { ...budget, whInPerDay: 0 },
      { whIn: 100, whOut: 0, days: 1 },
    );
    expect(comparison.whInDifferencePercent).toBeUndefined();
    expect(comparison.whInDifferencePerDay).toBe(100);
  });

  it('names the field of a bad measurement', () => {
    expect(() => compareBudgetWithActual(budget, { whIn: 1, whOut: 1, days: 0 })).toThrow(
      expect.objectContaining({ field: 'actual.days', code: 'installer-input-not-positive' }),
    );
    expect(() => compareBudgetWithActual(budget, { whIn: -5, whOut: 1, days: 1 })).toThrow(
      expect.objectContaining({ field: 'actual.whIn' }),
    );
  });
});
