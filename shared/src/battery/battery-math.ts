import { CHEMISTRY_PROFILES, Chemistry } from './chemistry-profile';
import { interpolateTable } from './interpolate-table';

/** Open-circuit voltage of a pack at a state of charge (%), scaled from 12 V to its nominal voltage. */
export function openCircuitVoltage(
  chemistry: Chemistry,
  nominalVoltage: number,
  stateOfCharge: number,
): number {
  return (
    interpolateTable(CHEMISTRY_PROFILES[chemistry].openCircuitVoltageTable, stateOfCharge) *
    (nominalVoltage / 12)
  );
}

/** Fraction of rated capacity usable at a pack temperature. */
export function capacityFactor(chemistry: Chemistry, temperature: number): number {
  return interpolateTable(CHEMISTRY_PROFILES[chemistry].capacityFactorTable, temperature);
}

/** Hours a battery rated `capacityAh` over `ratedHours` lasts at a steady `current` (Peukert's law). */
export function peukertRuntimeHours(
  capacityAh: number,
  ratedHours: number,
  current: number,
  exponent: number,
): number {
  return ratedHours * Math.pow(capacityAh / (current * ratedHours), exponent);
}

/** The current that, drawn at the rated rate, would drain the battery as fast as `current` does. */
export function peukertEffectiveCurrent(
  capacityAh: number,
  ratedHours: number,
  current: number,
  exponent: number,
): number {
  const ratedCurrent = capacityAh / ratedHours;
  return ratedCurrent * Math.pow(Math.abs(current) / ratedCurrent, exponent);
}

/** Charge or discharge rate as a multiple of capacity (C-rate). */
export function cRate(current: number, capacityAh: number): number {
  return Math.abs(current) / capacityAh;
}

/** Energy in watt-hours of a capacity at a voltage (Wh = V × Ah). */
export function wattHours(voltage: number, capacityAh: number): number {
  return voltage * capacityAh;
}
