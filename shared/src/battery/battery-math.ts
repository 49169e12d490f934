import { CHARGE_VOLTAGE_REFERENCE_C, CHEMISTRY_PROFILES, Chemistry } from './chemistry-profile';
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

/**
 * The current that, drawn at the rated rate, would drain the battery as fast as `current` does. Peukert's law
 * describes the capacity lost at rates above the rated one; below it the law would promise more than the rated
 * capacity, which cells do not give back (common practice: the effective current is never less than the current
 * drawn). Without that floor a light load would count more amp-hours out than were put in.
 */
export function peukertEffectiveCurrent(
  capacityAh: number,
  ratedHours: number,
  current: number,
  exponent: number,
): number {
  const ratedCurrent = capacityAh / ratedHours;
  const drawn = Math.abs(current);
  if (drawn <= ratedCurrent) return drawn;
  return ratedCurrent * Math.pow(drawn / ratedCurrent, exponent);
}

/** Charge or discharge rate as a multiple of capacity (C-rate). */
export function cRate(current: number, capacityAh: number): number {
  return Math.abs(current) / capacityAh;
}

/** Energy in watt-hours of a capacity at a voltage (Wh = V × Ah). */
export function wattHours(voltage: number, capacityAh: number): number {
  return voltage * capacityAh;
}

// Compensating chargers (and their remote temperature sensors) commonly stop adjusting outside about 0–50 °C
// (common practice, from memory), so the correction is held there too.
const COMPENSATION_RANGE_C = [0, 50] as const;

/**
 * Volts to add to a bank's 25 °C charge voltage at a pack temperature: lead-acid charge voltages fall as the
 * battery warms (a compensating charger absorbs a hot AGM bank well below 14.4 V), LiFePO4's do not.
 */
export function chargeVoltageCompensation(
  chemistry: Chemistry,
  nominalVoltage: number,
  temperatureC: number,
): number {
  const profile = CHEMISTRY_PROFILES[chemistry];
  const t = Math.min(COMPENSATION_RANGE_C[1], Math.max(COMPENSATION_RANGE_C[0], temperatureC));
  const cells = profile.cellsPerBlock * (nominalVoltage / 12);
  return profile.chargeVoltageCoefficientPerCell * cells * (t - CHARGE_VOLTAGE_REFERENCE_C);
}

/** Nominal voltage of a bank of this chemistry, volts (12.8 V per LiFePO4 block, 12 V per lead-acid block). */
export function chemistryNominalVoltage(chemistry: Chemistry, nominalVoltage: number): number {
  return CHEMISTRY_PROFILES[chemistry].nominalBlockVoltage * (nominalVoltage / 12);
}
