import { BudgetLoad, BudgetSource, EnergyBudgetInput } from './energy-budget-input';
import { energyBudget, inverterDcCurrent } from './energy-budget';

const loads: BudgetLoad[] = [
  { name: 'fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.33, ac: false },
  { name: 'cabin lights', amps: 2, hoursPerDay: 5, dutyCycle: 1, ac: false },
  { name: 'laptop', watts: 60, hoursPerDay: 3, dutyCycle: 1, ac: true },
];
const sources: BudgetSource[] = [
  { kind: 'solar', watts: 200, peakSunHours: 5 },
  { kind: 'dc-dc', amps: 20, hoursPerDay: 1 },
];
const van: EnergyBudgetInput = {
  loads,
  sources,
  system: {
    nominalVoltage: 12,
    inverterEfficiency: 0.9,
    inverterRatedW: 2000,
    bmsContinuousA: 200,
    usableFraction: 0.9,
    daysOfAutonomy: 2,
    batteryCapacityAh: 100,
  },
};

describe('energy budget', () => {
  it('adds up the daily energy out and in', () => {
    const budget = energyBudget(van);
    // By hand: fridge 45 W × 24 h × 0.33 = 356.4 Wh; lights 2 A × 12 V × 5 h = 120 Wh;
    // laptop 60 W × 3 h / 0.9 = 200 Wh through the inverter → 676.4 Wh out
    expect(budget.loads.map((l) => l.whPerDay)).toEqual([
      expect.closeTo(356.4, 6),
      expect.closeTo(120, 6),
      expect.closeTo(200, 6),
    ]);
    expect(budget.whOutPerDay).toBeCloseTo(676.4, 6);
    // By hand: solar 200 W × 5 h × (1 − 20 %) = 800 Wh (20 % derate: common practice); DC-DC 20 A × 1 h × 12 V
    // = 240 Wh → 1,040 Wh in
    expect(budget.whInPerDay).toBeCloseTo(1040, 6);
    // By hand: 1,040 − 676.4 = 363.6 Wh = 30.3 Ah at 12 V; out 676.4 / 12 = 56.37 Ah
    expect(budget.balanceWhPerDay).toBeCloseTo(363.6, 6);
    expect(budget.balanceAhPerDay).toBeCloseTo(30.3, 6);
    expect(budget.ahOutPerDay).toBeCloseTo(56.367, 3);
  });

  it('sizes the battery for the requested autonomy and judges the installed one', () => {
    const budget = energyBudget(van);
    // By hand: 100 Ah × 12 V × 0.9 usable = 1,080 Wh; 1,080 / 676.4 = 1.597 days
    expect(budget.autonomyDays).toBeCloseTo(1.597, 3);
    expect(budget.daysUntilEmpty).toBeUndefined();
    // By hand: 676.4 Wh × 2 days / (12 V × 0.9) = 125.3 Ah
    expect(budget.suggestedBatteryAh).toBeCloseTo(125.26, 2);
  });

  it('counts the days until empty when the sources fall short', () => {
    const budget = energyBudget({ ...van, sources: [{ kind: 'shore', amps: 10, hoursPerDay: 2 }] });
    // By hand: in 10 A × 2 h × 12 V = 240 Wh; deficit 676.4 − 240 = 436.4 Wh; 1,080 / 436.4 = 2.475 days
    expect(budget.daysUntilEmpty).toBeCloseTo(2.475, 3);
    expect(budget.verdict.findings.map((f) => f.code)).toEqual(['daily-deficit', 'chemistry-not-given']);
  });

  it('compares the inverter draw at its rating with the BMS continuous current', () => {
    // By hand: I = P / (V × η) = 2,000 W / (12 V × 0.9) = 185.2 A
    expect(inverterDcCurrent(2000, 12, 0.9)).toBeCloseTo(185.19, 2);
    expect(energyBudget(van).verdict.findings.map((f) => f.code)).toEqual(['chemistry-not-given']);
    const small = energyBudget({ ...van, system: { ...van.system, bmsContinuousA: 150 } });
    expect(small.verdict.ok).toBe(false);
    expect(small.verdict.findings[0]).toEqual({
      severity: 'error',
      code: 'inverter-exceeds-bms',
      message: 'at its rated 2000 W the inverter draws about 185 A, above the BMS continuous rating of 150 A',
    });
  });

  it('notices AC loads the inverter cannot run', () => {
    const noInverter = energyBudget({ ...van, system: { ...van.system, inverterRatedW: 0 } });
    expect(noInverter.verdict.findings.map((f) => f.code)).toEqual([
      'ac-loads-without-inverter',
      'chemistry-not-given',
    ]);
    const heater = { name: 'kettle', watts: 2200, hoursPerDay: 0.1, dutyCycle: 1, ac: true };
    const tooBig = energyBudget({ ...van, loads: [...loads, heater] });
    // By hand: 60 W + 2,200 W = 2,260 W > 2,000 W inverter
    expect(tooBig.verdict.findings.map((f) => f.code)).toEqual([
      'ac-loads-exceed-inverter',
      'chemistry-not-given',
    ]);
  });

  it('names the field of each bad input', () => {
    const cases: [EnergyBudgetInput, string][] = [
      [{ ...van, loads: [{ ...loads[0], dutyCycle: 1.5 }] }, 'loads[0].dutyCycle'],
      [{ ...van, loads: [loads[0], { ...loads[1], hoursPerDay: Number.NaN }] }, 'loads[1].hoursPerDay'],
      [
        { ...van, loads: [{ name: 'drill', amps: 5, hoursPerDay: 1, dutyCycle: 1, ac: true }] },
        'loads[0].amps',
      ],
      [{ ...van, loads: [{ ...loads[0], name: ' ' }] }, 'loads[0].name'],
      [{ ...van, sources: [{ kind: 'solar', watts: -1, peakSunHours: 5 }] }, 'sources[0].watts'],
      [{ ...van, system: { ...van.system, usableFraction: 0 } }, 'system.usableFraction'],
      [{ ...van, system: { ...van.system, nominalVoltage: 36 as 12 } }, 'system.nominalVoltage'],
      [{ ...van, system: { ...van.system, inverterEfficiency: 1.2 } }, 'system.inverterEfficiency'],
      [{ ...van, system: { ...van.system, chemistry: 'nimh' as 'agm' } }, 'system.chemistry'],
      [{ ...van, system: { ...van.system, inverterStandbyW: -1 } }, 'system.inverterStandbyW'],
      [{ ...van, system: { ...van.system, inverterSurgeW: Number.NaN } }, 'system.inverterSurgeW'],
      [{ ...van, system: { ...van.system, bmsPeakA: 0 } }, 'system.bmsPeakA'],
    ];
    for (const [input, field] of cases) {
      expect(() => energyBudget(input)).toThrow(expect.objectContaining({ field }));
    }
  });

  it('counts amp-hours at the chemistry nominal voltage and stores what the chemistry keeps', () => {
    const budget = energyBudget({ ...van, system: { ...van.system, chemistry: 'lifepo4' } });
    // LiFePO4 nominal 3.2 V/cell × 4 = 12.8 V (cell datasheets): lights 2 A × 12.8 V × 5 h = 128 Wh → out 684.4 Wh
    expect(budget.ampHourVoltage).toBeCloseTo(12.8, 9);
    expect(budget.whOutPerDay).toBeCloseTo(684.4, 6);
    expect(budget.ahOutPerDay).toBeCloseTo(684.4 / 12.8, 6);
    // In: 800 Wh solar + 20 A × 1 h × 12.8 V = 1,056 Wh; stored × 0.99 charge efficiency (from memory) = 1,045.44 Wh
    expect(budget.whInPerDay).toBeCloseTo(1056, 6);
    expect(budget.whStoredPerDay).toBeCloseTo(1045.44, 6);
    expect(budget.balanceWhPerDay).toBeCloseTo(361.04, 6);
    // Days to refill 100 Ah × 12.8 V × 0.9 = 1,152 Wh from empty at +361.04 Wh a day = 3.19 days
    expect(budget.daysToRecharge).toBeCloseTo(1152 / 361.04, 6);
    // LiFePO4 capacity does not shrink with rate (Peukert not applied)
    expect(budget.peukertCapacityFraction).toBe(1);
  });

  it('shortens a lead-acid autonomy by Peukert at the mean discharge current', () => {
    const heavy = [{ name: 'compressor', amps: 20, hoursPerDay: 24, dutyCycle: 1, ac: false }];
    const system = {
      ...van.system,
      chemistry: 'flooded' as const,
      usableFraction: 0.5,
      batteryCapacityAh: 200,
    };
    const budget = energyBudget({ loads: heavy, sources: [], system });
    // Peukert (C_I = C (C/(I·H))^(k−1), 20 h rating): 200 Ah at 20 A, k = 1.25 (profile, from memory):
    // (200/400)^0.25 = 0.8409 of the rated capacity
    expect(budget.peukertCapacityFraction).toBeCloseTo(0.8409, 4);
    // 200 Ah × 12 V × 0.5 × 0.8409 = 1,009.1 Wh over 20 A × 12 V × 24 h = 5,760 Wh a day = 0.175 days
    expect(budget.autonomyDays).toBeCloseTo(1009.1 / 5760, 4);
    // The suggested bank carries its own Peukert loss: at that size 2 days really hold
    const sized = energyBudget({
      loads: heavy,
      sources: [],
      system: { ...system, batteryCapacityAh: budget.suggestedBatteryAh },
    });
    expect(sized.autonomyDays).toBeCloseTo(2, 6);
  });

  it('adds the inverter standby draw and checks its surge against the BMS peak rating', () => {
    const system = { ...van.system, chemistry: 'lifepo4' as const, inverterStandbyW: 10 };
    // Standby 10 W × 24 h = 240 Wh a day, listed as its own load
    const withStandby = energyBudget({ ...van, system });
    expect(withStandby.inverterStandbyWhPerDay).toBe(240);
    expect(withStandby.loads.at(-1)).toEqual({ name: 'Inverter standby', whPerDay: 240 });
    // By hand: surge 4,000 W / (12 V × 0.9) = 370.4 A against a 200 A BMS peak
    const surge = energyBudget({ ...van, system: { ...system, inverterSurgeW: 4000, bmsPeakA: 200 } });
    expect(surge.inverterSurgeDcCurrentA).toBeCloseTo(370.37, 2);
    expect(surge.verdict.findings.map((f) => f.code)).toEqual(['inverter-surge-exceeds-bms-peak']);
    expect(
      energyBudget({ ...van, system: { ...system, inverterSurgeW: 4000, bmsPeakA: 400 } }).verdict.ok,
    ).toBe(true);
    // Without a peak rating, a surge above the continuous rating asks for it
    expect(
      energyBudget({ ...van, system: { ...system, inverterSurgeW: 4000 } }).verdict.findings.map(
        (f) => f.code,
      ),
    ).toEqual(['bms-peak-not-given']);
  });

  it('lists each DC circuit with the current its cable and fuse must carry', () => {
    const heater = { name: 'Heater', watts: 30, hoursPerDay: 8, dutyCycle: 0.5, ac: false };
    const budget = energyBudget({ ...van, loads: [...loads, heater] });
    // By hand at 12 V: inverter 2,000 / (12 × 0.9) = 185.2 A; DC-DC 20 A; fridge 45/12 = 3.75 A; lights 2 A;
    // heater 30/12 = 2.5 A; the AC laptop rides on the inverter feeder
    expect(budget.circuits).toEqual([
      { name: 'Inverter feeder', kind: 'inverter', currentA: expect.closeTo(185.19, 2) },
      { name: 'DC-DC charger 2 output', kind: 'charger', currentA: 20 },
      { name: 'fridge', kind: 'load', currentA: 3.75 },
      { name: 'cabin lights', kind: 'load', currentA: 2 },
      { name: 'Heater', kind: 'load', currentA: 2.5 },
    ]);
  });
});
