import type { EnergyBudgetComparison } from '@cellwarden/shared';
import { compareBudgetWithActual } from '@cellwarden/shared';
import { comparedDays, describeBudgetGap } from './budget-gap';

function comparisonOf(
  perDay: { day: string; whIn: number; whOut: number }[],
  days = 3,
): EnergyBudgetComparison {
  const budget = { whInPerDay: 900, whOutPerDay: 680, balanceWhPerDay: 220 };
  const whIn = perDay.reduce((sum, d) => sum + d.whIn, 0);
  const whOut = perDay.reduce((sum, d) => sum + d.whOut, 0);
  return {
    budget: budget as EnergyBudgetComparison['budget'],
    days,
    measured: { whIn, whOut, perDay },
    comparison: compareBudgetWithActual(budget, { whIn, whOut, days }),
  };
}

describe('describeBudgetGap', () => {
  it('says how much more was used than planned and on which day the gap was largest', () => {
    // Hand-worked: out (900 + 1,300 + 980) / 3 = 1,060 Wh/day, 380 more than 680; in 2,700 / 3 = 900, as planned.
    const text = describeBudgetGap(
      comparisonOf([
        { day: '2026-11-30', whIn: 900, whOut: 900 },
        { day: '2026-12-01', whIn: 900, whOut: 1300 },
        { day: '2026-12-02', whIn: 900, whOut: 980 },
      ]),
      'en-GB',
    );
    expect(text).toBe(
      'Used 380 Wh/day more than planned (1,060 against 680 Wh/day); the largest gap is on Tue 1 Dec (+620 Wh used). ' +
        'Charged about what was planned (900 against 900 Wh/day).',
    );
  });

  it('says less was charged than planned, and which days had no readings', () => {
    const text = describeBudgetGap(comparisonOf([{ day: '2026-12-02', whIn: 1200, whOut: 680 }], 3), 'en-US');
    // 1,200 / 3 = 400 Wh/day in against 900; 680 / 3 ≈ 227 out against 680.
    expect(text).toContain('Used 453 Wh/day less than planned (227 against 680 Wh/day)');
    expect(text).toContain('Charged 500 Wh/day less than planned (400 against 900 Wh/day)');
    expect(text).toContain('2 of the 3 days had no readings and count as zero.');
  });

  it('says so when nothing was measured', () =>
    expect(describeBudgetGap(comparisonOf([], 7), 'en-US')).toBe(
      'No readings in the last 7 days to compare the budget with.',
    ));

  it('sets the plan beside each measured day', () =>
    expect(comparedDays(comparisonOf([{ day: '2026-12-01', whIn: 850, whOut: 700 }]))).toEqual([
      { day: '2026-12-01', plannedIn: 900, measuredIn: 850, plannedOut: 680, measuredOut: 700, outGap: 20 },
    ]));
});
