// State of charge by coulomb counting, kept honest by two anchors: the open-circuit voltage after a long
// enough rest, and a re-sync to 100 % at the end of charge. One O(1) step per reading; the state is a
// handful of numbers so the server can keep one per system and persist it as JSON.
import { chargeVoltageCompensation } from '../battery/battery-math';
import { CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import { BatteryReading } from '../telemetry/reading';
import {
  dischargeDrainCurrent,
  packInternalResistance,
  ResolvedBatterySetup,
  usableCapacityAt,
} from './battery-setup';
import { openCircuitWeight, stateOfChargeFromOpenCircuit } from './open-circuit-soc';

/** Longest gap between readings that is still integrated, ms; a longer silence counts nothing. */
export const MAX_INTEGRATION_GAP_MS = 5 * 60 * 1000;

const MS_PER_HOUR = 3_600_000;

/** What the estimator remembers between readings. */
export interface SocEstimate {
  /** Estimated state of charge, percent of the usable capacity at the present temperature. */
  stateOfCharge: number;
  /** `measuredAt` of the last reading taken into account, ms. */
  measuredAt: number;
  /** Since when the current has stayed near zero, ms; undefined while current flows. */
  restingSince?: number;
  /** Whether the rest that began at `restingSince` has already corrected the estimate. */
  restCorrected?: boolean;
  /** Since when the bank has sat at the charged voltage with a tail current, ms. */
  chargedSince?: number;
  /** When the estimate was last set to 100 % at the end of charge, ms. */
  lastFullAt?: number;
  /** |reported − estimated| in percentage points, when the last reading carried a reported SoC. */
  disagreement?: number;
}

/** One estimator step: starts from the reading when there is no state, otherwise integrates and corrects. */
export function stepSocEstimate(
  state: SocEstimate | undefined,
  reading: BatteryReading,
  battery: ResolvedBatterySetup,
): SocEstimate {
  if (state === undefined) return initialEstimate(reading, battery);
  // A reading older than the last one (a replayed backlog) cannot be integrated backwards.
  if (!(reading.measuredAt > state.measuredAt)) return state;
  const gap = reading.measuredAt - state.measuredAt;
  const counted =
    gap <= MAX_INTEGRATION_GAP_MS
      ? state.stateOfCharge + chargeDelta(reading, gap, battery)
      : state.stateOfCharge;
  const rested = applyRest(state, reading, battery, clampPercent(counted));
  const synced = applyEndOfCharge(rested, reading, battery);
  return withDisagreement({ ...synced, measuredAt: reading.measuredAt }, reading);
}

/** The first estimate: the device's own SoC if it reports one, else the load-compensated voltage. */
function initialEstimate(reading: BatteryReading, battery: ResolvedBatterySetup): SocEstimate {
  const fromVoltage = stateOfChargeFromOpenCircuit(
    battery.chemistry,
    battery.nominalVoltage,
    compensatedVoltage(reading, battery),
  );
  const stateOfCharge = clampPercent(reading.stateOfCharge ?? fromVoltage);
  const first: SocEstimate = { stateOfCharge, measuredAt: reading.measuredAt };
  if (Math.abs(reading.current) <= battery.restCurrentA) first.restingSince = reading.measuredAt;
  return withDisagreement(first, reading);
}

/** Change in state of charge over `gapMs` at the reading's current, percentage points (ΔAh = I·Δt). */
function chargeDelta(reading: BatteryReading, gapMs: number, battery: ResolvedBatterySetup): number {
  const hours = gapMs / MS_PER_HOUR;
  const profile = CHEMISTRY_PROFILES[battery.chemistry];
  const current = reading.current;
  const stored =
    current >= 0 ? current * profile.chargeEfficiency : -dischargeDrainCurrent(battery, -current);
  const capacity = usableCapacityAt(battery, reading.temperature);
  return ((stored * hours) / capacity) * 100;
}

/** Tracks the rest period and, once it is long enough, pulls the estimate toward the OCV reading once. */
function applyRest(
  state: SocEstimate,
  reading: BatteryReading,
  battery: ResolvedBatterySetup,
  stateOfCharge: number,
): SocEstimate {
  const next: SocEstimate = { ...state, stateOfCharge };
  if (Math.abs(reading.current) > battery.restCurrentA) {
    delete next.restingSince;
    delete next.restCorrected;
    return next;
  }
  next.restingSince = state.restingSince ?? reading.measuredAt;
  const restedLongEnough = reading.measuredAt - next.restingSince >= battery.restMinutes * 60_000;
  if (!restedLongEnough || state.restCorrected) return next;
  const fromVoltage = stateOfChargeFromOpenCircuit(
    battery.chemistry,
    battery.nominalVoltage,
    reading.voltage,
  );
  const weight = openCircuitWeight(battery.chemistry, fromVoltage);
  next.stateOfCharge = clampPercent(stateOfCharge + weight * (fromVoltage - stateOfCharge));
  next.restCorrected = true;
  return next;
}

/** Sets the estimate to 100 % once the (temperature-compensated) charged voltage and tail current have held long enough. */
function applyEndOfCharge(
  state: SocEstimate,
  reading: BatteryReading,
  battery: ResolvedBatterySetup,
): SocEstimate {
  // The charged voltage refers to 25 °C; a compensating charger holds a hot lead-acid bank lower (and a cold
  // one higher), so the threshold follows the pack temperature or a hot bank would never count as full.
  const chargedVoltage =
    battery.chargedVoltage +
    chargeVoltageCompensation(battery.chemistry, battery.nominalVoltage, reading.temperature);
  const atTail =
    reading.voltage >= chargedVoltage &&
    reading.current >= -battery.restCurrentA &&
    reading.current <= battery.tailCurrentA;
  if (!atTail) {
    const next = { ...state };
    delete next.chargedSince;
    return next;
  }
  const chargedSince = state.chargedSince ?? reading.measuredAt;
  const held = reading.measuredAt - chargedSince >= battery.chargedHoldMinutes * 60_000;
  if (!held) return { ...state, chargedSince };
  return { ...state, chargedSince, stateOfCharge: 100, lastFullAt: reading.measuredAt };
}

/** Terminal voltage corrected to open circuit: V − I·R (charge current lifts it, load sags it). */
export function compensatedVoltage(reading: BatteryReading, battery: ResolvedBatterySetup): number {
  return reading.voltage - reading.current * packInternalResistance(battery);
}

function withDisagreement(state: SocEstimate, reading: BatteryReading): SocEstimate {
  const next = { ...state };
  if (reading.stateOfCharge === undefined) delete next.disagreement;
  else next.disagreement = Math.abs(reading.stateOfCharge - state.stateOfCharge);
  return next;
}

function clampPercent(value: number): number {
  if (Number.isNaN(value)) return 0;
  return Math.min(100, Math.max(0, value));
}
