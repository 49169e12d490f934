import { AnalyticsSettingError } from './analytics-error';
import {
  dischargeDrainCurrent,
  packInternalResistance,
  resolveBatterySetup,
  usableCapacityAt,
} from './battery-setup';

const van = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 200,
  usableCapacityAh: 180,
} as const;

describe('resolveBatterySetup', () => {
  it('fills the estimator options from the chemistry and capacity', () => {
    const battery = resolveBatterySetup(van);
    // End-of-charge tail current of 4 % of capacity (common practice)
    expect(battery.tailCurrentA).toBeCloseTo(8, 9);
    expect(battery.ratedHours).toBe(20);
    // Profile absorption 14.2 V less 0.2 V, per 12 V block
    expect(resolveBatterySetup({ ...van, nominalVoltage: 24 }).chargedVoltage).toBeCloseTo(28, 9);
  });

  it('keeps what the owner set', () => {
    expect(resolveBatterySetup({ ...van, restMinutes: 90, tailCurrentA: 3 })).toMatchObject({
      restMinutes: 90,
      tailCurrentA: 3,
    });
  });

  it('refuses a capacity no bank has, quoting it', () => {
    expect(() => resolveBatterySetup({ ...van, usableCapacityAh: 0 })).toThrow(AnalyticsSettingError);
    expect(() => resolveBatterySetup({ ...van, ratedCapacityAh: Number.NaN })).toThrow(
      /ratedCapacityAh.*NaN/,
    );
    expect(() => resolveBatterySetup({ ...van, nominalVoltage: 36 as 12 })).toThrow(/got 36/);
    expect(() => resolveBatterySetup({ ...van, restMinutes: -1 })).toThrow(/restMinutes.*-1/);
    expect(() => resolveBatterySetup({ ...van, tailCurrentA: 0 })).toThrow(/tailCurrentA/);
  });
});

describe('bank physics', () => {
  it('adds block resistances in series and halves them for double the capacity', () => {
    // Series resistances add, parallel halve (Ohm's law, general reference); profile: 8 mΩ per 100 Ah 12 V block
    expect(packInternalResistance({ ...van, nominalVoltage: 24, ratedCapacityAh: 200 })).toBeCloseTo(
      0.008,
      9,
    );
  });

  it('shrinks usable capacity in the cold', () => {
    expect(usableCapacityAt(resolveBatterySetup(van), 0)).toBeCloseTo(180 * 0.88, 9);
  });

  it('applies Peukert only to lead-acid', () => {
    const lithium = resolveBatterySetup(van);
    expect(dischargeDrainCurrent(lithium, 50)).toBe(50);
    const flooded = resolveBatterySetup({ ...van, chemistry: 'flooded', ratedCapacityAh: 100 });
    // Peukert's law (Wikipedia "Peukert's law"): I_eff = (C/H)·(I·H/C)^k = 5·(10/5)^1.25 ≈ 11.89 A
    expect(dischargeDrainCurrent(flooded, 10)).toBeCloseTo(5 * Math.pow(2, 1.25), 9);
  });
});
