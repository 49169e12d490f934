import { CHEMISTRY_PROFILES } from './chemistry-profile';
import {
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
});
