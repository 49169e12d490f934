import {
  CHEMISTRY_PROFILES,
  Chemistry,
  capacityFactor,
  interpolateTable,
  openCircuitVoltage,
  peukertEffectiveCurrent,
} from '@cellwarden/shared';

/** The true, unobserved state of one battery pack. */
export interface PackState {
  chemistry: Chemistry;
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  /** Capacity at 25 °C that the pack really holds, Ah (an aged pack holds less than its rating). */
  usableCapacityAh?: number;
  /** True state of charge: charge held, percent of the usable capacity at 25 °C. */
  stateOfCharge: number;
  temperature: number;
  /** Current at the terminals this step, A (positive = charging). */
  current: number;
}

// Lead-acid capacity is rated at the 20-hour rate (common practice).
const RATED_HOURS = 20;

// Extra charge overpotential per C-rate of charge current for a 12 V block, volts per C, against state of
// charge: small in mid-range, steep near full, which is what makes a charger's absorption current taper.
// Illustrative model parameters tuned to taper at 2–3 % of C at full; not from a datasheet.
const CHARGE_POLARIZATION: Readonly<Record<Chemistry, readonly (readonly [number, number])[]>> = {
  lifepo4: [
    [0, 0.1],
    [85, 0.15],
    [95, 1],
    [99, 8],
    [100, 30],
  ],
  agm: [
    [0, 0.5],
    [60, 1],
    [75, 4],
    [85, 12],
    [95, 30],
    [100, 60],
  ],
  flooded: [
    [0, 0.6],
    [60, 1.2],
    [75, 5],
    [85, 14],
    [95, 35],
    [100, 70],
  ],
};

/** Usable capacity at 25 °C, Ah: the rating unless the pack says it holds less. */
export function usableCapacityAt25(pack: PackState): number {
  return pack.usableCapacityAh ?? pack.ratedCapacityAh;
}

/** Usable capacity at the pack's temperature, Ah: shrinks in the cold. */
export function usableCapacityAh(pack: PackState): number {
  return usableCapacityAt25(pack) * capacityFactor(pack.chemistry, pack.temperature);
}

// Cold does not destroy charge, it makes the bottom of it unreachable: of the charge held, the share below
// (1 − capacity factor) cannot be drawn until the pack warms up. Voltage follows the reachable part.
/** Reachable state of charge at the pack's temperature, percent of the cold-shrunk usable capacity. */
export function availableStateOfCharge(pack: PackState): number {
  const factor = capacityFactor(pack.chemistry, pack.temperature);
  if (factor >= 1) return pack.stateOfCharge;
  return Math.max(0, (pack.stateOfCharge - (1 - factor) * 100) / factor);
}

/** Internal resistance of the pack, scaled from a 100 Ah 12 V block; cold cells resist more. */
export function packResistance(pack: PackState): number {
  const profile = CHEMISTRY_PROFILES[pack.chemistry];
  // Roughly doubling from 25 °C to −10 °C: illustrative, in line with the trend datasheets show (from memory).
  const cold = 1 + 0.03 * Math.max(0, 25 - pack.temperature);
  return profile.internalResistance100Ah * (pack.nominalVoltage / 12) * (100 / pack.ratedCapacityAh) * cold;
}

/** Effective resistance seen by a charge current: internal resistance plus the state-of-charge overpotential. */
export function chargeResistance(pack: PackState): number {
  const voltsPerC = interpolateTable(CHARGE_POLARIZATION[pack.chemistry], pack.stateOfCharge);
  return packResistance(pack) + (voltsPerC * (pack.nominalVoltage / 12)) / pack.ratedCapacityAh;
}

/** Rested open-circuit voltage of the pack at its state of charge. */
export function packOpenCircuitVoltage(pack: PackState): number {
  return openCircuitVoltage(pack.chemistry, pack.nominalVoltage, availableStateOfCharge(pack));
}

/** Terminal voltage at a current (default: the pack's own): sags under load and rises under charge. */
export function terminalVoltage(pack: PackState, current = pack.current): number {
  const resistance = current > 0 ? chargeResistance(pack) : packResistance(pack);
  return packOpenCircuitVoltage(pack) + current * resistance;
}

/** The pack current that brings the terminals to `voltage` (negative when the voltage is below rest). */
export function currentAtVoltage(pack: PackState, voltage: number): number {
  const offset = voltage - packOpenCircuitVoltage(pack);
  return offset / (offset > 0 ? chargeResistance(pack) : packResistance(pack));
}

/** Advances the pack by `dtSeconds` at `current`, applying charge efficiency and Peukert (lead-acid). */
export function stepPack(pack: PackState, dtSeconds: number, current: number): PackState {
  const profile = CHEMISTRY_PROFILES[pack.chemistry];
  const storedAmps =
    current >= 0
      ? current * profile.chargeEfficiency
      : -peukertEffectiveCurrent(pack.ratedCapacityAh, RATED_HOURS, current, profile.peukertExponent);
  const deltaPercent = ((storedAmps * dtSeconds) / 3600 / usableCapacityAt25(pack)) * 100;
  const stateOfCharge = Math.min(100, Math.max(0, pack.stateOfCharge + deltaPercent));
  return { ...pack, stateOfCharge, current };
}
