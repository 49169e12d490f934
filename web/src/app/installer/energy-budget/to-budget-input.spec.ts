import { energyBudget } from '@cellwarden/shared';
import { budgetChartSummary, toBudgetChart } from './to-budget-chart';
import { BudgetEditorValue, toBudgetInput } from './to-budget-input';

const value: BudgetEditorValue = {
  loads: [
    { name: ' Fridge ', watts: 45, ac: false, hoursPerDay: 24, dutyPercent: 40 },
    { name: 'Laptop', watts: 60, ac: true, hoursPerDay: 3, dutyPercent: 100 },
  ],
  sources: [
    { kind: 'solar', rating: 200, hours: 4 },
    { kind: 'dc-dc', rating: 20, hours: 1 },
  ],
  system: {
    nominalVoltage: 12,
    inverterEfficiencyPercent: 90,
    inverterRatedW: 300,
    bmsContinuousA: 100,
    usablePercent: 90,
    daysOfAutonomy: 2,
    batteryCapacityAh: null,
    chemistry: 'agm',
    inverterStandbyW: 8,
    inverterStandbyHoursPerDay: 10,
    inverterSurgeW: null,
    bmsPeakA: 250,
  },
};

describe('toBudgetInput', () => {
  it('turns percentages into fractions and ratings into W or A by source kind', () => {
    const input = toBudgetInput(value);
    expect(input.loads[0]).toEqual({ name: 'Fridge', watts: 45, ac: false, hoursPerDay: 24, dutyCycle: 0.4 });
    expect(input.sources).toEqual([
      { kind: 'solar', watts: 200, peakSunHours: 4 },
      { kind: 'dc-dc', amps: 20, hoursPerDay: 1 },
    ]);
    expect(input.system).toMatchObject({
      inverterEfficiency: 0.9,
      usableFraction: 0.9,
      batteryCapacityAh: undefined,
      chemistry: 'agm',
      inverterStandbyW: 8,
      inverterSurgeW: undefined,
      bmsPeakA: 250,
    });
  });

  it('gives the shared budget numbers a person can check by hand', () => {
    const budget = energyBudget(toBudgetInput(value));
    // By hand: fridge 45 W × 24 h × 0.4 = 432 Wh; laptop 60 W × 3 h / 0.9 (inverter) = 200 Wh; standby
    // 8 W × 10 h = 80 Wh → 712 Wh out.
    expect(budget.whOutPerDay).toBeCloseTo(712, 6);
    // Solar 200 W × 4 h × (1 − 0.20 derate, common practice) = 640 Wh; DC-DC 20 A × 1 h × 12 V (AGM nominal,
    // 6 × 2.0 V) = 240 Wh; stored × 0.90 AGM charge efficiency (profile, from memory) = 792 Wh.
    expect(budget.whInPerDay).toBeCloseTo(880, 6);
    expect(budget.whStoredPerDay).toBeCloseTo(792, 6);
  });
});

describe('budget chart', () => {
  it('plots energy in against energy out, rounded to whole Wh', () => {
    expect(toBudgetChart(880.4, 632.6).datasets[0].data).toEqual([880, 633]);
  });

  it('summarises a deficit in words for screen readers', () => {
    expect(budgetChartSummary(640, 676.4)).toBe(
      'Energy stored 640 Wh a day, energy out 676 Wh a day: 36 Wh short.',
    );
  });
});
