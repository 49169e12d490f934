import { CHEMISTRY_PROFILES, Chemistry } from '@cellwarden/shared';
import {
  chargeResistance,
  packOpenCircuitVoltage,
  packResistance,
  PackState,
  terminalVoltage,
} from './pack-model';

/** The three-stage charge profile common to lead-acid and LiFePO4 chargers. */
export type ChargeStage = 'bulk' | 'absorption' | 'float';

/** A charger's setpoints, at the pack's nominal voltage. */
export interface ChargerSettings {
  ratedCurrent: number;
  absorptionVoltage: number;
  floatVoltage: number;
  /** Absorption ends when the current the battery accepts falls to this, A. */
  tailCurrent: number;
  /** Absorption ends after this long at most, s. */
  maxAbsorptionSeconds: number;
  /** In float, a battery pulled below this while the charger is at its limit goes back to bulk, V. */
  rebulkVoltage: number;
  /** Resistance of the cable pair between charger and battery, Ω; the charger regulates at its own end. */
  cableResistance: number;
}

/** Where a charger is in its profile. */
export interface ChargerState {
  stage: ChargeStage;
  stageSeconds: number;
}

/** What a charger did this step. */
export interface ChargerOutput {
  state: ChargerState;
  current: number;
  /** Voltage at the charger's terminals, V (battery voltage plus the cable drop). */
  outputVoltage: number;
}

// Re-bulk thresholds for a 12 V block (common practice, from memory); setpoints come from the chemistry.
const REBULK_12V: Readonly<Record<Chemistry, number>> = { lifepo4: 13.2, agm: 12.6, flooded: 12.6 };

/** Setpoints for a charger of `ratedCurrent` on a pack, from its chemistry's 12 V block values. */
export function chargerSettingsFor(
  pack: PackState,
  ratedCurrent: number,
  cableResistance: number,
): ChargerSettings {
  const profile = CHEMISTRY_PROFILES[pack.chemistry];
  const scale = pack.nominalVoltage / 12;
  return {
    ratedCurrent,
    absorptionVoltage: profile.absorptionVoltage * scale,
    floatVoltage: profile.floatVoltage * scale,
    // Tail current 2 % of capacity and absorption capped at 1 h (LiFePO4) / 3 h (lead-acid): common practice.
    tailCurrent: 0.02 * pack.ratedCapacityAh,
    maxAbsorptionSeconds: (pack.chemistry === 'lifepo4' ? 1 : 3) * 3600,
    rebulkVoltage: REBULK_12V[pack.chemistry] * scale,
    cableResistance,
  };
}

// Charger current that brings its own terminals to `voltage` while `otherCurrent` (other sources minus loads)
// also flows into the pack: OCV + (I + other)·R_pack + I·R_cable = voltage, with R_pack for the sign of the sum.
function currentForVoltage(pack: PackState, voltage: number, otherCurrent: number, cable: number): number {
  const ocv = packOpenCircuitVoltage(pack);
  const charging = (voltage - ocv - otherCurrent * chargeResistance(pack)) / (chargeResistance(pack) + cable);
  if (charging + otherCurrent >= 0) return charging;
  return (voltage - ocv - otherCurrent * packResistance(pack)) / (packResistance(pack) + cable);
}

/** The stage the charger starts in when its input comes back. */
export const RESTART: ChargerState = { stage: 'bulk', stageSeconds: 0 };

/** One step of a charger offering up to `available` A (its rating, or less when its input is weak). */
export function stepCharger(
  state: ChargerState,
  settings: ChargerSettings,
  pack: PackState,
  available: number,
  otherCurrent: number,
  dtSeconds: number,
): ChargerOutput {
  const limit = Math.max(0, Math.min(settings.ratedCurrent, available));
  const target = state.stage === 'float' ? settings.floatVoltage : settings.absorptionVoltage;
  const regulated = currentForVoltage(pack, target, otherCurrent, settings.cableResistance);
  const current = Math.max(0, Math.min(limit, regulated));
  const next = nextStage(state, settings, pack, { limit, regulated, current, otherCurrent });
  const stageSeconds = next === state.stage ? state.stageSeconds + dtSeconds : 0;
  const batteryVoltage = terminalVoltage(pack, current + otherCurrent);
  return {
    state: { stage: next, stageSeconds },
    current,
    outputVoltage: batteryVoltage + current * settings.cableResistance,
  };
}

function nextStage(
  state: ChargerState,
  settings: ChargerSettings,
  pack: PackState,
  step: { limit: number; regulated: number; current: number; otherCurrent: number },
): ChargeStage {
  const voltageLimited = step.regulated < step.limit;
  if (state.stage === 'bulk') return voltageLimited ? 'absorption' : 'bulk';
  if (state.stage === 'absorption') {
    const accepted = step.regulated + step.otherCurrent;
    const done = accepted < settings.tailCurrent || state.stageSeconds >= settings.maxAbsorptionSeconds;
    return done ? 'float' : 'absorption';
  }
  const sagging =
    !voltageLimited && terminalVoltage(pack, step.current + step.otherCurrent) < settings.rebulkVoltage;
  return sagging ? 'bulk' : 'float';
}
