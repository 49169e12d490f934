// Where the charge is heading: hours to empty at the mean load, hours to full at the present charge current,
// and the state of charge expected at a chosen time. Straight-line projections on purpose: they are what a
// van dweller can check in their head, and the absorption taper only makes "to full" an optimistic bound.
import { CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import { dischargeDrainCurrent, ResolvedBatterySetup, usableCapacityAt } from './battery-setup';

/** Currents smaller than this (A) count as no flow, so a projection is not "thousands of hours". */
export const NEGLIGIBLE_CURRENT_A = 0.05;

const MS_PER_HOUR = 3_600_000;

/** The bank's present condition a projection starts from. */
export interface ProjectionStart {
  battery: ResolvedBatterySetup;
  /** State of charge now, percent of usable capacity. */
  stateOfCharge: number;
  /** Pack temperature now, °C (sets the usable capacity). */
  temperature: number;
}

/** Expected state of charge at one instant and, if it falls through the low threshold first, when. */
export interface ChargeProjection {
  at: number;
  stateOfCharge: number;
  /** When the charge falls through the low threshold before `at`; null when it does not. */
  crossesLowAt: number | null;
}

/** Hours until the state of charge reaches `floorPercent` at a steady `meanCurrent`; undefined unless discharging. */
export function hoursToEmpty(
  start: ProjectionStart,
  meanCurrent: number,
  floorPercent = 0,
): number | undefined {
  if (meanCurrent > -NEGLIGIBLE_CURRENT_A) return undefined;
  const { battery } = start;
  const remainingAh =
    (Math.max(0, start.stateOfCharge - floorPercent) / 100) * usableCapacityAt(battery, start.temperature);
  return remainingAh / dischargeDrainCurrent(battery, -meanCurrent);
}

/** Hours until full at the present `chargeCurrent`, after charge efficiency; undefined unless charging. */
export function hoursToFull(start: ProjectionStart, chargeCurrent: number): number | undefined {
  if (chargeCurrent < NEGLIGIBLE_CURRENT_A) return undefined;
  const { battery } = start;
  const missingAh = ((100 - start.stateOfCharge) / 100) * usableCapacityAt(battery, start.temperature);
  return missingAh / (chargeCurrent * CHEMISTRY_PROFILES[battery.chemistry].chargeEfficiency);
}

/** State of charge expected at `atMs` if `meanCurrent` holds from `nowMs`, and when it crosses `lowPercent`. */
export function projectStateOfCharge(
  start: ProjectionStart,
  meanCurrent: number,
  nowMs: number,
  atMs: number,
  lowPercent: number,
): ChargeProjection {
  const ratePerHour = percentPerHour(start, meanCurrent);
  const hours = Math.max(0, atMs - nowMs) / MS_PER_HOUR;
  const stateOfCharge = Math.min(100, Math.max(0, start.stateOfCharge + ratePerHour * hours));
  const projection: ChargeProjection = { at: atMs, stateOfCharge, crossesLowAt: null };
  if (ratePerHour < 0 && start.stateOfCharge > lowPercent && stateOfCharge < lowPercent) {
    const hoursToLow = (start.stateOfCharge - lowPercent) / -ratePerHour;
    projection.crossesLowAt = nowMs + Math.round(hoursToLow * MS_PER_HOUR);
  }
  return projection;
}

/** Rate of change of state of charge at a steady current, percentage points per hour. */
function percentPerHour(start: ProjectionStart, current: number): number {
  if (Math.abs(current) < NEGLIGIBLE_CURRENT_A) return 0;
  const { battery } = start;
  const capacity = usableCapacityAt(battery, start.temperature);
  const stored =
    current > 0
      ? current * CHEMISTRY_PROFILES[battery.chemistry].chargeEfficiency
      : -dischargeDrainCurrent(battery, -current);
  return (stored / capacity) * 100;
}
