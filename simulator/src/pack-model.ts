import {
  CHEMISTRY_PROFILES,
  Chemistry,
  capacityFactor,
  openCircuitVoltage,
  peukertEffectiveCurrent,
} from '@cellwarden/shared';

/** The true, unobserved state of one battery pack. */
export interface PackState {
  chemistry: Chemistry;
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  /** True state of charge, percent. */
  stateOfCharge: number;
  temperature: number;
  /** Current at the terminals this step, A (positive = charging). */
  current: number;
}

// Lead-acid capacity is rated at the 20-hour rate (common practice).
const RATED_HOURS = 20;

/** Internal resistance of the pack, scaled from a 100 Ah 12 V block. */
export function packResistance(pack: PackState): number {
  const profile = CHEMISTRY_PROFILES[pack.chemistry];
  return profile.internalResistance100Ah * (pack.nominalVoltage / 12) * (100 / pack.ratedCapacityAh);
}

/** Terminal voltage: OCV plus the I·R drop, so it sags under load and rises under charge. */
export function terminalVoltage(pack: PackState): number {
  return (
    openCircuitVoltage(pack.chemistry, pack.nominalVoltage, pack.stateOfCharge) +
    pack.current * packResistance(pack)
  );
}

/** Advances the pack by `dtSeconds` at `current`, applying charge efficiency, Peukert and cold capacity. */
export function stepPack(pack: PackState, dtSeconds: number, current: number): PackState {
  const profile = CHEMISTRY_PROFILES[pack.chemistry];
  const usableAh = pack.ratedCapacityAh * capacityFactor(pack.chemistry, pack.temperature);
  const storedAmps =
    current >= 0
      ? current * profile.chargeEfficiency
      : -peukertEffectiveCurrent(pack.ratedCapacityAh, RATED_HOURS, current, profile.peukertExponent);
  const deltaPercent = ((storedAmps * dtSeconds) / 3600 / usableAh) * 100;
  const stateOfCharge = Math.min(100, Math.max(0, pack.stateOfCharge + deltaPercent));
  return { ...pack, stateOfCharge, current };
}
