import { CHEMISTRY_PROFILES, openCircuitVoltage } from '@cellwarden/shared';
import { packOpenCircuitVoltage, PackState, terminalVoltage } from './pack-model';

/** What the pack's BMS (or a lead-acid bank's low-voltage disconnect) protects against. */
export interface BmsConfig {
  /** False for a BMS without a low-temperature charge cut-off: chargers can push current into a cold pack. */
  blocksColdCharge: boolean;
  /** Highest discharge current the BMS carries continuously, A; above it, discharge is cut. */
  continuousDischargeCurrent: number;
  /** How long discharge stays cut after an over-current, s. */
  overCurrentResetSeconds: number;
}

/** The BMS's latches. */
export interface BmsState {
  lowVoltageCut: boolean;
  overCurrentSecondsLeft: number;
}

/** What the BMS lets through this step, and why not. */
export interface BmsDecision {
  state: BmsState;
  allowCharge: boolean;
  allowDischarge: boolean;
  coldChargeBlocked: boolean;
}

/** Nothing tripped. */
export const BMS_CLEAR: BmsState = { lowVoltageCut: false, overCurrentSecondsLeft: 0 };

/** Resting voltage at which a low-voltage cut releases: about 10 % charge, so it needs a charger. */
export function lowVoltageRelease(pack: PackState): number {
  return openCircuitVoltage(pack.chemistry, pack.nominalVoltage, 10);
}

function lowVoltageCut(state: BmsState, pack: PackState, demandCurrent: number): boolean {
  if (state.lowVoltageCut) return packOpenCircuitVoltage(pack) < lowVoltageRelease(pack);
  if (demandCurrent >= 0) return false;
  const cutoff = CHEMISTRY_PROFILES[pack.chemistry].lowVoltageCutoff * (pack.nominalVoltage / 12);
  return terminalVoltage(pack, demandCurrent) < cutoff || pack.stateOfCharge <= 0;
}

/** Decides, before current flows, whether the pack may charge and discharge at the demanded net current. */
export function decideBms(
  state: BmsState,
  config: BmsConfig,
  pack: PackState,
  demandCurrent: number,
  dtSeconds: number,
): BmsDecision {
  const overCurrent = -demandCurrent > config.continuousDischargeCurrent;
  const overCurrentSecondsLeft = overCurrent
    ? config.overCurrentResetSeconds
    : Math.max(0, state.overCurrentSecondsLeft - dtSeconds);
  const cut = lowVoltageCut(state, pack, demandCurrent);
  const cold = pack.temperature < CHEMISTRY_PROFILES[pack.chemistry].minimumChargeTemperature;
  const coldChargeBlocked = cold && config.blocksColdCharge;
  return {
    state: { lowVoltageCut: cut, overCurrentSecondsLeft },
    allowCharge: !coldChargeBlocked,
    allowDischarge: !cut && overCurrentSecondsLeft === 0,
    coldChargeBlocked,
  };
}
