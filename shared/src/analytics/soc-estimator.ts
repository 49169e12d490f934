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
  // One new object per reading, filled in by the steps below: this runs on every reading of every system, and
  // a copy per step (and a `delete` per absent field, which leaves a slow object) showed in the server's profile.
  const next: SocEstimate = { stateOfCharge: clampPercent(counted), measuredAt: reading.measuredAt };
  applyRest(next, state, reading, battery);
  if (state.lastFullAt !== undefined) next.lastFullAt = state.lastFullAt;
  applyEndOfCharge(next, state, reading, battery);
  if (reading.stateOfCharge !== undefined)
    next.disagreement = Math.abs(reading.stateOfCharge - next.stateOfCharge);
  return next;
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
  if (reading.stateOfCharge !== undefined)
    first.disagreement = Math.abs(reading.stateOfCharge - first.stateOfCharge);
  return first;
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

/**
 * Tracks the rest period (into `next`, from the previous `state`) and, once it is long enough, pulls the
 * estimate toward the OCV reading once.
 */
function applyRest(
  next: SocEstimate,
  state: SocEstimate,
  reading: BatteryReading,
  battery: ResolvedBatterySetup,
): void {
  if (Math.abs(reading.current) > battery.restCurrentA) return;
  const restingSince = state.restingSince ?? reading.measuredAt;
  next.restingSince = restingSince;
  if (state.restCorrected !== undefined) next.restCorrected = state.restCorrected;
  const restedLongEnough = reading.measuredAt - restingSince >= battery.restMinutes * 60_000;
  if (!restedLongEnough || state.restCorrected) return;
  const fromVoltage = stateOfChargeFromOpenCircuit(
    battery.chemistry,
    battery.nominalVoltage,
    reading.voltage,
  );
  const weight = openCircuitWeight(battery.chemistry, fromVoltage);
  next.stateOfCharge = clampPercent(next.stateOfCharge + weight * (fromVoltage - next.stateOfCharge));
  next.restCorrected = true;
}

/** Sets the estimate to 100 % once the (temperature-compensated) charged voltage and tail current have held long enough. */
function applyEndOfCharge(
  next: SocEstimate,
  state: SocEstimate,
  reading: BatteryReading,
  battery: ResolvedBatterySetup,
): void {
  // The charged voltage refers to 25 °C; a compensating charger holds a hot lead-acid bank lower (and a cold
  // one higher), so the threshold follows the pack temperature or a hot bank would never count as full.
  const chargedVoltage =
    battery.chargedVoltage +
    chargeVoltageCompensation(battery.chemistry, battery.nominalVoltage, reading.temperature);
  const atTail =
    reading.voltage >= chargedVoltage &&
    reading.current >= -battery.restCurrentA &&
    reading.current <= battery.tailCurrentA;
  if (!atTail) return;
  const chargedSince = state.chargedSince ?? reading.measuredAt;
  next.chargedSince = chargedSince;
  const held = reading.measuredAt - chargedSince >= battery.chargedHoldMinutes * 60_000;
  if (!held) return;
  next.stateOfCharge = 100;
  next.lastFullAt = reading.measuredAt;
}

/** Terminal voltage corrected to open circuit: V − I·R (charge current lifts it, load sags it). */
export function compensatedVoltage(reading: BatteryReading, battery: ResolvedBatterySetup): number {
  return reading.voltage - reading.current * packInternalResistance(battery);
}

function clampPercent(value: number): number {
  if (Number.isNaN(value)) return 0;
  return Math.min(100, Math.max(0, value));
}
