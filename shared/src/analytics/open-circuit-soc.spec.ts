import { openCircuitVoltage } from '../battery/battery-math';
import { openCircuitWeight, stateOfChargeFromOpenCircuit } from './open-circuit-soc';

describe('stateOfChargeFromOpenCircuit', () => {
  it('inverts the chemistry OCV table, also for 24 and 48 V banks', () => {
    for (const stateOfCharge of [5, 35, 50, 95]) {
      expect(
        stateOfChargeFromOpenCircuit('agm', 24, openCircuitVoltage('agm', 24, stateOfCharge)),
      ).toBeCloseTo(stateOfCharge, 6);
    }
    // Lead-acid OCV tables, general reference (from memory): a rested flooded 12 V battery at 12.7 V is full
    expect(stateOfChargeFromOpenCircuit('flooded', 12, 12.73)).toBeCloseTo(100, 6);
    // Four 12 V blocks in series (arithmetic): 48.4 V is 12.1 V per block, ≈ 50 % for flooded
    expect(stateOfChargeFromOpenCircuit('flooded', 48, 48.4)).toBeCloseTo(50, 6);
  });

  it('clamps voltages beyond the table to 0 and 100 %', () => {
    expect(stateOfChargeFromOpenCircuit('lifepo4', 12, 2)).toBe(0);
    expect(stateOfChargeFromOpenCircuit('lifepo4', 12, 15)).toBe(100);
  });
});

describe('openCircuitWeight', () => {
  it('trusts a steep lead-acid curve more than the flat middle of LiFePO4', () => {
    // LiFePO4 OCV is nearly flat from ≈20 % to ≈90 % (cell datasheets, from memory); lead-acid falls ≈0.14 V per 10 %
    expect(openCircuitWeight('lifepo4', 50)).toBeLessThan(0.5);
    expect(openCircuitWeight('agm', 50)).toBeGreaterThan(0.9);
  });

  it('trusts LiFePO4 near empty, where its curve falls steeply', () => {
    // LiFePO4 knee below ≈10 % (cell datasheets, from memory)
    expect(openCircuitWeight('lifepo4', 5)).toBe(1);
  });
});
