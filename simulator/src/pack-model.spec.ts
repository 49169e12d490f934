import { CHEMISTRY_PROFILES, peukertRuntimeHours } from '@cellwarden/shared';
import {
  availableStateOfCharge,
  currentAtVoltage,
  packOpenCircuitVoltage,
  packResistance,
  PackState,
  stepPack,
  terminalVoltage,
} from './pack-model';

const pack: PackState = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  stateOfCharge: 60,
  temperature: 20,
  current: 0,
};

function runUntilEmpty(start: PackState, current: number, dt: number): number {
  let state = start;
  let seconds = 0;
  while (state.stateOfCharge > 0) {
    state = stepPack(state, dt, current);
    seconds += dt;
  }
  return seconds / 3600;
}

describe('pack model', () => {
  it('sags under load and rises under charge', () => {
    const rest = terminalVoltage(pack);
    expect(terminalVoltage({ ...pack, current: -50 })).toBeLessThan(rest);
    expect(terminalVoltage({ ...pack, current: 30 })).toBeGreaterThan(rest);
  });

  it('drops by I·R under load, with R scaled down for a bigger pack and up for a higher voltage', () => {
    // Ohm's law across the internal resistance (general reference).
    expect(terminalVoltage(pack, -50)).toBeCloseTo(
      packOpenCircuitVoltage(pack) - 50 * packResistance(pack),
      9,
    );
    expect(packResistance({ ...pack, ratedCapacityAh: 200 })).toBeCloseTo(packResistance(pack) / 2, 9);
    expect(packResistance({ ...pack, nominalVoltage: 24 })).toBeCloseTo(packResistance(pack) * 2, 9);
  });

  it('reads the 12 V block table scaled by nominal/12 at rest', () => {
    // Lead-acid OCV vs state of charge, general reference tables (from memory): flooded 50 % ≈ 12.1 V.
    expect(
      packOpenCircuitVoltage({ ...pack, chemistry: 'flooded', stateOfCharge: 50, temperature: 25 }),
    ).toBeCloseTo(12.1, 1);
    // Same table ×4 for 48 V nominal: 48.4 V.
    expect(
      packOpenCircuitVoltage({
        ...pack,
        chemistry: 'flooded',
        nominalVoltage: 48,
        stateOfCharge: 50,
        temperature: 25,
      }),
    ).toBeCloseTo(48.4, 1);
  });

  it('finds the current that brings the terminals to a voltage', () => {
    const charge = currentAtVoltage(pack, 14.0);
    expect(terminalVoltage(pack, charge)).toBeCloseTo(14.0, 6);
    const load = currentAtVoltage(pack, 13.0);
    expect(load).toBeLessThan(0);
    expect(terminalVoltage(pack, load)).toBeCloseTo(13.0, 6);
  });

  it('stores charge × efficiency: integral of current equals change of charge', () => {
    // Energy balance (charge conservation, general reference): ΔAh = Σ I·dt·η on charge, Σ I·dt at the
    // 20-hour rate on discharge, where Peukert's correction is 1 by definition.
    const currents = [10, 25, -5, 40, -5, 3];
    let state = { ...pack, stateOfCharge: 20 };
    let expectedAh = 0;
    for (const current of currents) {
      state = stepPack(state, 1800, current);
      expectedAh += (current > 0 ? current * CHEMISTRY_PROFILES.lifepo4.chargeEfficiency : current) * 0.5;
    }
    expect(((state.stateOfCharge - 20) / 100) * 100).toBeCloseTo(expectedAh, 6);
  });

  it('runs a flooded battery for the time Peukert’s law gives at a high current', () => {
    const flooded: PackState = { ...pack, chemistry: 'flooded', stateOfCharge: 100, temperature: 25 };
    // Peukert's law, t = H·(C/(I·H))^k (Wikipedia "Peukert's law"): 100 Ah @ 20 h, k = 1.25, 20 A →
    // 20 · (100/400)^1.25 ≈ 3.54 h, against 5 h if capacity did not depend on rate.
    const hours = runUntilEmpty(flooded, -20, 10);
    expect(hours).toBeCloseTo(peukertRuntimeHours(100, 20, 20, 1.25), 2);
    expect(hours).toBeCloseTo(3.54, 1);
  });

  it('leaves part of the charge unreachable in the cold, at a lower voltage', () => {
    const cold = { ...pack, temperature: -20 };
    // LiFePO4 keeps ~70 % of its capacity at −20 °C (the chemistry's capacity-factor table, from memory).
    expect(availableStateOfCharge(cold)).toBeCloseTo((60 - 30) / 0.7, 6);
    expect(packOpenCircuitVoltage(cold)).toBeLessThan(packOpenCircuitVoltage({ ...pack, temperature: 25 }));
  });
});
