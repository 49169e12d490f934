import { CHEMISTRY_PROFILES } from './chemistry-profile';
import {
  chargeVoltageCompensation,
  chemistryNominalVoltage,
  cRate,
  openCircuitVoltage,
  peukertEffectiveCurrent,
  peukertRuntimeHours,
  wattHours,
} from './battery-math';

describe('battery math', () => {
  it('runs a lead-acid battery for less time at a high current', () => {
    // Peukert's law worked example: t = H·(C/(I·H))^k; 100 Ah @ 20 h, k = 1.2, 10 A → 20·0.5^1.2 ≈ 8.71 h
    expect(peukertRuntimeHours(100, 20, 10, 1.2)).toBeCloseTo(8.71, 2);
  });

  it('makes a current at the rated rate its own effective current', () => {
    expect(peukertEffectiveCurrent(100, 20, 5, 1.25)).toBeCloseTo(5, 9);
    expect(peukertEffectiveCurrent(100, 20, 10, 1.25)).toBeGreaterThan(10);
    // Below the rated 5 A the floor holds: 2 A drains as 2 A, not the 1.6 A the bare law would give.
    expect(peukertEffectiveCurrent(100, 20, 2, 1.25)).toBe(2);
    expect(peukertEffectiveCurrent(100, 20, -2, 1.25)).toBe(2);
  });

  it('blocks LiFePO4 charging below freezing', () => {
    // LiFePO4 cell datasheets and battery handbooks: no charging below 0 °C (common practice)
    expect(CHEMISTRY_PROFILES.lifepo4.minimumChargeTemperature).toBe(0);
  });

  it('reads a rested flooded battery at half charge near 12.1 V and scales to 24 V', () => {
    // Lead-acid OCV vs state of charge, general reference tables (from memory): 50 % ≈ 12.1 V, 100 % ≈ 12.7 V
    expect(openCircuitVoltage('flooded', 12, 50)).toBeCloseTo(12.1, 1);
    expect(openCircuitVoltage('flooded', 12, 100)).toBeCloseTo(12.7, 1);
    expect(openCircuitVoltage('flooded', 24, 50)).toBeCloseTo(24.2, 1);
  });

  it('computes C-rate and Wh = V × Ah', () => {
    expect(cRate(-50, 100)).toBe(0.5);
    expect(wattHours(12.8, 100)).toBeCloseTo(1280, 6);
  });

  it('compensates lead-acid charge voltages for temperature and leaves LiFePO4 alone', () => {
    // AGM datasheets (from memory): −4 mV/°C per cell from 25 °C; 12 V = 6 cells → −0.36 V at 40 °C, +0.6 V at 0 °C
    expect(chargeVoltageCompensation('agm', 12, 40)).toBeCloseTo(-0.36, 9);
    expect(chargeVoltageCompensation('agm', 24, 40)).toBeCloseTo(-0.72, 9);
    // flooded deep-cycle datasheets (from memory): −5 mV/°C per cell
    expect(chargeVoltageCompensation('flooded', 12, 35)).toBeCloseTo(-0.3, 9);
    // held at the 0–50 °C range chargers compensate over (common practice)
    expect(chargeVoltageCompensation('agm', 12, 70)).toBeCloseTo(chargeVoltageCompensation('agm', 12, 50), 9);
    expect(chargeVoltageCompensation('lifepo4', 12, 45)).toBe(0);
  });

  it('gives the chemistry nominal voltage of a bank', () => {
    // LiFePO4 3.2 V per cell × 4 = 12.8 V; lead-acid 2.0 V per cell × 6 = 12 V (cell datasheets)
    expect(chemistryNominalVoltage('lifepo4', 24)).toBeCloseTo(25.6, 9);
    expect(chemistryNominalVoltage('agm', 48)).toBe(48);
  });

  it('limits LiFePO4 charging when hot and cuts its current below about 10 °C', () => {
    // Cell datasheets (from memory): charge 0–45 °C, reduced current between 0 and 10 °C
    expect(CHEMISTRY_PROFILES.lifepo4.maximumChargeTemperature).toBe(45);
    expect(CHEMISTRY_PROFILES.lifepo4.reducedChargeCurrent).toEqual({
      belowTemperature: 10,
      maximumCRate: 0.1,
    });
    expect(CHEMISTRY_PROFILES.agm.maximumChargeTemperature).toBeUndefined();
  });
});
