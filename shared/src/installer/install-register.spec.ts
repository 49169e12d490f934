import type { CircuitWiring, RegisterComponent } from '../api/install-register-contract';
import { energyBudget } from './energy-budget';
import { FUSE_PLACEMENT_RULE } from './fuse-placement';
import {
  checkedAwgOf,
  componentCurrentA,
  judgeCircuit,
  registerBudgetInput,
  registeredSourceRatingA,
  ruleOfFinding,
} from './install-register';

const van = { kind: 'van', nominalVoltage: 12 } as const;
const battery: RegisterComponent = {
  id: 'b',
  name: 'LiFePO4 200 Ah',
  ratings: { kind: 'battery', chemistry: 'lifepo4', capacityAh: 200, bmsContinuousA: 200, bmsPeakA: 300 },
};
const dcdc: RegisterComponent = {
  id: 'c',
  name: 'DC-DC charger 60 A',
  ratings: {
    kind: 'charge-source',
    sourceKind: 'dc-dc',
    ratedCurrentA: 60,
    monitorSourceId: 'dcdc',
    hoursPerDay: 1,
  },
};
const inverter: RegisterComponent = {
  id: 'i',
  name: 'Inverter 2000 W',
  ratings: { kind: 'inverter', continuousW: 2000, surgeW: 4000, standbyW: 10, efficiency: 0.9 },
};
const heater: RegisterComponent = {
  id: 'h',
  name: 'Diesel air heater',
  ratings: { kind: 'heater', amps: 10, hoursPerDay: 8, dutyCycle: 0.25, ac: false },
};
const wiring = (over: Partial<CircuitWiring>): CircuitWiring => ({
  name: 'circuit',
  componentId: 'c',
  conductor: { awg: '4' },
  construction: 'stranded',
  oneWayLengthM: 2.5,
  insulationRatingC: 105,
  location: 'general',
  ambientC: 30,
  bundledConductors: 2,
  protection: { device: 'fuse', ratingA: 80, type: 'MIDI' },
  fuseDistanceM: 0.15,
  sheathed: false,
  designCurrentA: null,
  allowedDropPercent: 3,
  monitoring: 'none',
  ...over,
});

describe('install register', () => {
  it('checks a metric conductor as the largest AWG size no larger than it', () => {
    // ASTM B258 areas: 4 AWG 21.15 mm², 3 AWG 26.67 mm², 2 AWG 33.62 mm², 18 AWG 0.823 mm²
    expect(checkedAwgOf({ mm2: 25 })).toBe('4');
    expect(checkedAwgOf({ mm2: 35 })).toBe('2');
    expect(checkedAwgOf({ mm2: 0.75 })).toBeUndefined();
    expect(checkedAwgOf({ awg: '2/0' })).toBe('2/0');
    expect(checkedAwgOf({ awg: '5' })).toBeUndefined();
  });

  it("takes a circuit's current from the component it feeds", () => {
    // P / (V × η): 2000 W / (12 V × 0.9) = 185.2 A (arithmetic, the budget's class-voltage convention)
    expect(componentCurrentA(inverter.ratings, 12)).toBeCloseTo(185.19, 2);
    expect(componentCurrentA(dcdc.ratings, 12)).toBe(60);
    expect(componentCurrentA(heater.ratings, 12)).toBe(10);
  });

  it('passes a 60 A DC-DC charger on 4 AWG with an 80 A fuse 150 mm from the battery', () => {
    const verdict = judgeCircuit(wiring({}), dcdc, van);
    // 33 CFR 183.425 Table 5, 105 °C: 4 AWG 160 A; NEC 210.19(A)(1) 125 % of 60 A = 75 A;
    // 33 CFR 183.455(c)(1): up to 150 % of 160 A = 240 A
    expect(verdict).toMatchObject({
      ok: true,
      checkedAwg: '4',
      currentA: 60,
      ampacityA: 160,
      maximumFuseA: 240,
    });
    expect(verdict.rule).toContain('33 CFR 183.455(b)');
  });

  it('fails a heater circuit whose fuse is 1.5 m from the battery, citing 33 CFR 183.455(b), and passes it moved close', () => {
    const far = wiring({
      componentId: 'h',
      conductor: { awg: '12' },
      protection: { device: 'fuse', ratingA: 15, type: 'blade' },
      fuseDistanceM: 1.5,
      oneWayLengthM: 3,
    });
    const verdict = judgeCircuit(far, heater, van);
    expect(verdict.ok).toBe(false);
    // 33 CFR 183.455(b): within 7 in (178 mm), or 40 in (1.02 m) sheathed
    expect(verdict.rule).toBe(FUSE_PLACEMENT_RULE);
    expect(verdict.summary).toMatch(/1\.5 m from the battery/);
    const close = judgeCircuit({ ...far, fuseDistanceM: 0.15 }, heater, van);
    expect(close.ok).toBe(true);
  });

  it('fails a fuse too large for the conductor, citing the rule that sets the largest fuse', () => {
    const verdict = judgeCircuit(
      wiring({ protection: { device: 'fuse', ratingA: 300, type: 'ANL' } }),
      dcdc,
      van,
    );
    expect(verdict.ok).toBe(false);
    // 33 CFR 183.455(c)(1): 150 % of 160 A = 240 A < 300 A
    expect(verdict.rule).toMatch(/33 CFR 183\.455\(c\)\(1\)/);
  });

  it('names every finding’s rule and refuses a circuit with no current or a conductor under 18 AWG', () => {
    expect(ruleOfFinding('drop-above-allowed', undefined)).toMatch(/ABYC E-11/);
    expect(judgeCircuit(wiring({ componentId: 'x' }), undefined, van)).toMatchObject({ ok: false });
    expect(judgeCircuit(wiring({ conductor: { mm2: 0.5 } }), dcdc, van).rule).toMatch(/183\.425\(d\)/);
  });

  it('answers a circuit past the tables with a failing verdict saying why, never an exception', () => {
    const huge: RegisterComponent = {
      id: 'i',
      name: 'Inverter 20 kW',
      ratings: { kind: 'inverter', continuousW: 20000, surgeW: 40000, standbyW: 50, efficiency: 0.9 },
    };
    // 20000 W / (12 V × 0.9) = 1852 A, past the 1000 A the wire & fuse check accepts
    const verdict = judgeCircuit(wiring({ componentId: 'i' }), huge, van);
    expect(verdict).toMatchObject({ ok: false });
    expect(verdict.summary).toMatch(/currentA/);
  });

  it('builds the energy budget from the components and gives a charge source its registered rating', () => {
    const input = registerBudgetInput([battery, dcdc, inverter, heater], 12)!;
    const budget = energyBudget(input);
    // Amps count at the chemistry's nominal voltage (12.8 V per LiFePO4 block, the budget's convention):
    // heater 10 A × 12.8 V × 8 h × 0.25 = 256 Wh; inverter standby 10 W × 24 h = 240 Wh (arithmetic)
    expect(budget.whOutPerDay).toBeCloseTo(496, 6);
    // DC-DC 60 A × 12.8 V × 1 h = 768 Wh in (arithmetic)
    expect(budget.whInPerDay).toBeCloseTo(768, 6);
    expect(registerBudgetInput([dcdc], 12)).toBeUndefined();
    expect(registeredSourceRatingA([battery, dcdc], 'dcdc')).toBe(60);
    expect(registeredSourceRatingA([battery, dcdc], 'solar')).toBeUndefined();
  });
});
