import { capacityFactor, openCircuitVoltage } from './battery-math';
import { CHEMISTRY_PROFILES } from './chemistry-profile';
import { interpolateTable } from './interpolate-table';
import { stateOfChargeFromOpenCircuit } from '../analytics/open-circuit-soc';

describe('chemistry profiles', () => {
  it('rests an AGM block near the usual table points', () => {
    // AGM OCV vs state of charge, trade reference tables (from memory): 100 % ≈ 12.8–12.9 V, 50 % ≈ 12.2 V.
    expect(openCircuitVoltage('agm', 12, 100)).toBeCloseTo(12.85, 1);
    expect(openCircuitVoltage('agm', 12, 50)).toBeCloseTo(12.2, 1);
  });

  it('keeps a LiFePO4 block flat through mid-charge and steep at the ends', () => {
    // 4-cell LiFePO4 rest voltages (cell datasheets, from memory): 3.4 V/cell full → 13.6 V, ~3.29 V/cell at
    // half charge → ≈ 13.15 V, 2.5 V/cell empty → 10.0 V.
    expect(openCircuitVoltage('lifepo4', 12, 100)).toBeCloseTo(13.6, 1);
    expect(openCircuitVoltage('lifepo4', 12, 50)).toBeCloseTo(13.15, 1);
    expect(openCircuitVoltage('lifepo4', 12, 0)).toBeCloseTo(10.0, 1);
    const midRange = openCircuitVoltage('lifepo4', 12, 80) - openCircuitVoltage('lifepo4', 12, 20);
    expect(midRange).toBeLessThan(0.5);
  });

  it('reads a rested, nearly empty LiFePO4 pack as nearly empty', () => {
    // Published OCV-SoC curves of LiFePO4 cells (from memory): ≈3.2 V/cell at 10 %, falling steeply only in the
    // last few percent; 3.0 V/cell (12.0 V) is about 2 %. A straight line from 10.0 V to 12.8 V put 12.0 V at 7 %.
    expect(openCircuitVoltage('lifepo4', 12, 10)).toBeCloseTo(12.8, 2);
    expect(openCircuitVoltage('lifepo4', 12, 2)).toBeCloseTo(12.0, 2);
    expect(stateOfChargeFromOpenCircuit('lifepo4', 12, 12.0)).toBeLessThanOrEqual(2);
    expect(stateOfChargeFromOpenCircuit('lifepo4', 12, 12.4)).toBeLessThan(5);
    expect(stateOfChargeFromOpenCircuit('lifepo4', 24, 24.8)).toBeLessThan(5);
  });

  it('scales every table by nominal/12 for 24 and 48 V banks', () => {
    for (const chemistry of ['lifepo4', 'agm', 'flooded'] as const) {
      expect(openCircuitVoltage(chemistry, 48, 70)).toBeCloseTo(4 * openCircuitVoltage(chemistry, 12, 70), 9);
    }
  });

  it('loses usable capacity in the cold and keeps tables ascending', () => {
    for (const chemistry of ['lifepo4', 'agm', 'flooded'] as const) {
      expect(capacityFactor(chemistry, -20)).toBeLessThan(capacityFactor(chemistry, 0));
      expect(capacityFactor(chemistry, 0)).toBeLessThan(capacityFactor(chemistry, 25));
      const table = CHEMISTRY_PROFILES[chemistry].openCircuitVoltageTable;
      table.slice(1).forEach(([soc, volts], i) => {
        expect(soc).toBeGreaterThan(table[i][0]);
        expect(volts).toBeGreaterThan(table[i][1]);
      });
    }
  });

  it('clamps interpolation to the ends of a table', () => {
    const table = [
      [0, 1],
      [10, 3],
    ] as const;
    expect(interpolateTable(table, -5)).toBe(1);
    expect(interpolateTable(table, 5)).toBe(2);
    expect(interpolateTable(table, 50)).toBe(3);
  });
});
