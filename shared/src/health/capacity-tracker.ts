// Usable capacity measured from the data: amp-hours counted from a full-charge sync to a later point whose
// state of charge is known (a rested open-circuit voltage low on the curve, or a BMS low-voltage cut-off).
// One O(1) step per minute; the state is a handful of numbers the server persists as JSON.
import { capacityFactor, chargeVoltageCompensation, peukertEffectiveCurrent } from '../battery/battery-math';
import { CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import { BatterySetup, ResolvedBatterySetup, resolveBatterySetup } from '../analytics/battery-setup';
import { MAX_INTEGRATION_GAP_MS } from '../analytics/soc-estimator';
import {
  CAPACITY_REST_MINUTES,
  capacityFromCount,
  CUTOFF_STATE_OF_CHARGE,
  CUTOFF_STATE_OF_CHARGE_SIGMA,
  lowVoltageCutoff,
  MAX_SAMPLE_RELATIVE_SIGMA,
  MIN_SAMPLE_DEPTH,
  restedStateOfCharge,
} from './capacity-measurement';
import { CapacitySample, CapacitySampleMethod, CapacityTrackerState, MinuteSummary } from './health-types';

/** A capacity tracker for one battery: feed it minutes in order, keep its state() between runs. */
export interface CapacityTracker {
  /** Takes one minute; returns a capacity sample when this minute completes one. */
  push(minute: MinuteSummary): CapacitySample | undefined;
  /** The JSON state to persist and resume from. */
  state(): CapacityTrackerState;
}

const MINUTE_MS = 60_000;
const HOUR_MS = 3_600_000;

/** Creates a tracker for `setup` (refused like any battery setup), resuming from `state` when given. */
export function createCapacityTracker(setup: BatterySetup, state?: CapacityTrackerState): CapacityTracker {
  const battery = resolveBatterySetup(setup);
  let current: CapacityTrackerState = state?.version === 1 ? { ...state } : emptyState();
  return {
    push(minute) {
      const { next, sample } = stepCapacityTracker(current, minute, battery);
      current = next;
      return sample;
    },
    state: () => ({ ...current }),
  };
}

function emptyState(): CapacityTrackerState {
  return { version: 1, countedAh: 0, chargeAhSinceFull: 0, sampledThisRest: false, cutoffSeen: false };
}

function stepCapacityTracker(
  state: CapacityTrackerState,
  minute: MinuteSummary,
  battery: ResolvedBatterySetup,
): { next: CapacityTrackerState; sample?: CapacitySample } {
  // A malformed or replayed minute changes nothing; a gap breaks the count, since what flowed is unknown.
  if (!isWellFormed(minute)) return { next: state };
  if (state.lastMinuteStart !== undefined && minute.start <= state.lastMinuteStart) return { next: state };
  let next: CapacityTrackerState = { ...state, lastMinuteStart: minute.start };
  if (state.lastMinuteStart !== undefined && minute.start - state.lastMinuteStart > MAX_INTEGRATION_GAP_MS) {
    next = { ...emptyState(), lastMinuteStart: minute.start };
  }
  next = countMinute(next, minute, battery);
  next = trackFullCharge(next, minute, battery);
  return trackRest(next, minute, battery);
}

function isWellFormed(m: MinuteSummary): boolean {
  const values = [m.start, m.voltageMin, m.voltageLast, m.currentMin, m.currentMax, m.currentMean];
  const counts = [m.ahIn, m.ahOut];
  return (
    values.every(Number.isFinite) &&
    counts.every((v) => Number.isFinite(v) && v >= 0) &&
    Number.isFinite(m.temperatureMean)
  );
}

/**
 * Adds the minute's net draw: charge times its efficiency, and discharge normalised by Peukert's law to the
 * rated discharge time the capacity refers to. Unlike the SoC estimator this applies LiFePO4's small exponent
 * too (1.03 in the chemistry profile, as the simulator's pack does): at house-bank currents of C/50 it moves a
 * count by 2–3 %, which matters here and is within the noise there.
 */
function countMinute(
  state: CapacityTrackerState,
  m: MinuteSummary,
  battery: ResolvedBatterySetup,
): CapacityTrackerState {
  if (state.fullAt === undefined) return state;
  const profile = CHEMISTRY_PROFILES[battery.chemistry];
  const meanDischargeA = m.ahOut * 60;
  const rated = (a: number) =>
    peukertEffectiveCurrent(battery.ratedCapacityAh, battery.ratedHours, a, profile.peukertExponent);
  const drainAh = meanDischargeA > 0 ? (rated(meanDischargeA) / meanDischargeA) * m.ahOut : 0;
  const storedAh = m.ahIn * profile.chargeEfficiency;
  // A full battery stores nothing more: float and tail current into it is lost to heat and gassing, as the
  // SoC estimator's clamp at 100 % also has it. So the count never goes below zero.
  const countedAh = Math.max(0, state.countedAh + drainAh - storedAh);
  return {
    ...state,
    countedAh,
    chargeAhSinceFull: state.chargeAhSinceFull + m.ahIn,
  };
}

/**
 * Re-syncs to full while the bank sits at the (temperature-compensated) charged voltage with a tapered
 * current, as the SoC estimator does; every such minute moves the sync, so counting starts at the end of
 * absorption.
 */
function trackFullCharge(
  state: CapacityTrackerState,
  m: MinuteSummary,
  battery: ResolvedBatterySetup,
): CapacityTrackerState {
  const chargedVoltage =
    battery.chargedVoltage +
    chargeVoltageCompensation(battery.chemistry, battery.nominalVoltage, m.temperatureMean);
  const atTail =
    m.voltageLast >= chargedVoltage &&
    m.currentMean >= -battery.restCurrentA &&
    m.currentMean <= battery.tailCurrentA;
  if (!atTail) {
    const next = { ...state };
    delete next.chargedSince;
    return next;
  }
  const chargedSince = state.chargedSince ?? m.start;
  const end = m.start + MINUTE_MS;
  if (end - chargedSince < battery.chargedHoldMinutes * MINUTE_MS) return { ...state, chargedSince };
  const next: CapacityTrackerState = {
    ...state,
    chargedSince,
    fullAt: end,
    countedAh: 0,
    chargeAhSinceFull: 0,
    cutoffSeen: false,
  };
  delete next.bestRelativeSigma;
  return next;
}

/** Follows rests and cut-offs; a long enough rest or the quiet after a cut-off may complete a sample. */
function trackRest(
  state: CapacityTrackerState,
  m: MinuteSummary,
  battery: ResolvedBatterySetup,
): { next: CapacityTrackerState; sample?: CapacitySample } {
  const limit = battery.restCurrentA;
  const quiet = Math.abs(m.currentMin) <= limit && Math.abs(m.currentMax) <= limit;
  if (!quiet) {
    const next = { ...state, sampledThisRest: false, cutoffSeen: state.cutoffSeen || isCutoff(m, battery) };
    if (m.currentMean > limit) next.cutoffSeen = false;
    delete next.restingSince;
    return { next };
  }
  const restingSince = state.restingSince ?? m.start;
  const next = { ...state, restingSince };
  if (next.sampledThisRest) return { next };
  if (state.cutoffSeen) {
    return offerSample(next, m, battery, 'low-voltage-cutoff', {
      stateOfCharge: CUTOFF_STATE_OF_CHARGE,
      sigma: CUTOFF_STATE_OF_CHARGE_SIGMA,
    });
  }
  const restMinutes = Math.max(battery.restMinutes, CAPACITY_REST_MINUTES[battery.chemistry]);
  if (m.start + MINUTE_MS - restingSince < restMinutes * MINUTE_MS) return { next };
  const soc = restedStateOfCharge(battery.chemistry, battery.nominalVoltage, m.voltageLast);
  return offerSample(next, m, battery, 'rested-ocv', soc);
}

function isCutoff(m: MinuteSummary, battery: ResolvedBatterySetup): boolean {
  return (
    m.voltageMin <= lowVoltageCutoff(battery.chemistry, battery.nominalVoltage) &&
    m.currentMin < -battery.restCurrentA
  );
}

/** Turns the count into a sample when it is deep and certain enough and beats any earlier one since the sync. */
function offerSample(
  state: CapacityTrackerState,
  m: MinuteSummary,
  battery: ResolvedBatterySetup,
  method: CapacitySampleMethod,
  end: { stateOfCharge: number; sigma: number },
): { next: CapacityTrackerState; sample?: CapacitySample } {
  const next: CapacityTrackerState = { ...state, sampledThisRest: true, cutoffSeen: false };
  const depth = 1 - end.stateOfCharge;
  if (state.fullAt === undefined || depth < MIN_SAMPLE_DEPTH || state.countedAh <= 0) return { next };
  const at = m.start + MINUTE_MS;
  const whole = capacityFromCount({
    chemistry: battery.chemistry,
    countedAh: state.countedAh,
    chargeAh: state.chargeAhSinceFull,
    hours: (at - state.fullAt) / HOUR_MS,
    socAtEnd: end.stateOfCharge,
    socSigma: end.sigma,
    capacityFactor: capacityFactor(battery.chemistry, m.temperatureMean),
  });
  const relative = whole.sigmaAh / whole.capacityAh;
  if (relative > MAX_SAMPLE_RELATIVE_SIGMA) return { next };
  if (state.bestRelativeSigma !== undefined && relative >= state.bestRelativeSigma) return { next };
  // The open-circuit scale is the whole capacity; the owner's usable capacity is its share of the rating
  // (e.g. half for lead-acid), so the sample is reported on the owner's scale.
  const ownerShare = battery.usableCapacityAh / battery.ratedCapacityAh;
  const sample: CapacitySample = {
    at,
    fullAt: state.fullAt,
    usableAh: whole.capacityAh * ownerShare,
    sigmaAh: whole.sigmaAh * ownerShare,
    countedAh: state.countedAh,
    socAtEnd: end.stateOfCharge,
    method,
    temperature: m.temperatureMean,
  };
  return { next: { ...next, bestRelativeSigma: relative }, sample };
}
