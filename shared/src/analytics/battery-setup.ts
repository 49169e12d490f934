// The per-system description of a battery bank that every analytic needs, and the defaults that fill the
// options an owner leaves empty. Defaults are per 12 V block and scaled to the bank's nominal voltage.
import { CHEMISTRY_PROFILES, Chemistry } from '../battery/chemistry-profile';
import { capacityFactor, peukertEffectiveCurrent } from '../battery/battery-math';
import { AnalyticsSettingError, notPositiveError } from './analytics-error';

/** Nominal bank voltages the product supports. */
export type NominalVoltage = 12 | 24 | 48;

/** One battery bank as its owner describes it, plus optional tuning of the estimator. */
export interface BatterySetup {
  chemistry: Chemistry;
  nominalVoltage: NominalVoltage;
  /** Capacity on the label, ampere-hours, at the rated discharge time. */
  ratedCapacityAh: number;
  /** Capacity the owner means to use (e.g. half the label for lead-acid), ampere-hours, at 25 °C. */
  usableCapacityAh: number;
  /** Discharge time the rating refers to, hours (20 h is the usual lead-acid rating). */
  ratedHours?: number;
  /** Minutes of near-zero current before the resting voltage is trusted as open-circuit voltage. */
  restMinutes?: number;
  /** Current at or below which the bank counts as resting, amperes. */
  restCurrentA?: number;
  /** Charge current below which a bank held at the charged voltage is full, amperes. */
  tailCurrentA?: number;
  /** Terminal voltage at or above which the bank is at the end of absorption, volts (whole bank, at 25 °C; lead-acid is temperature-compensated from it). */
  chargedVoltage?: number;
  /** Minutes the charged voltage and tail current must hold before re-syncing to 100 %. */
  chargedHoldMinutes?: number;
}

/** A battery setup with every option filled in. */
export type ResolvedBatterySetup = Required<BatterySetup>;

/** Fills a setup's options with chemistry defaults and refuses values no real bank has. */
export function resolveBatterySetup(setup: BatterySetup): ResolvedBatterySetup {
  checkPositive('ratedCapacityAh', setup.ratedCapacityAh, 'Ah');
  checkPositive('usableCapacityAh', setup.usableCapacityAh, 'Ah');
  if (![12, 24, 48].includes(setup.nominalVoltage)) {
    throw new AnalyticsSettingError(
      'bad_battery_setup',
      'nominalVoltage',
      `nominalVoltage must be 12, 24 or 48 V; got ${setup.nominalVoltage}`,
    );
  }
  checkOptions(setup);
  const profile = CHEMISTRY_PROFILES[setup.chemistry];
  const blocks = setup.nominalVoltage / 12;
  return {
    ratedHours: 20,
    restMinutes: 30,
    // C/200: below this the voltage is within a few mV of open circuit (common practice).
    restCurrentA: setup.ratedCapacityAh * 0.005,
    // 4 % of capacity is the usual end-of-charge tail current (common practice).
    tailCurrentA: setup.ratedCapacityAh * 0.04,
    chargedVoltage: (profile.absorptionVoltage - 0.2) * blocks,
    chargedHoldMinutes: 3,
    ...definedOnly(setup),
  } as ResolvedBatterySetup;
}

/** Usable capacity at a pack temperature, ampere-hours (cold makes less of the charge available). */
export function usableCapacityAt(battery: ResolvedBatterySetup, temperature: number): number {
  return battery.usableCapacityAh * capacityFactor(battery.chemistry, temperature);
}

/** Internal resistance of the whole bank, ohms: series blocks add, larger cells have less. */
export function packInternalResistance(battery: BatterySetup): number {
  const per100Ah = CHEMISTRY_PROFILES[battery.chemistry].internalResistance100Ah;
  return per100Ah * (100 / battery.ratedCapacityAh) * (battery.nominalVoltage / 12);
}

/** Whether the chemistry loses capacity at high discharge rates enough to correct for (lead-acid). */
export function usesPeukertCorrection(battery: BatterySetup): boolean {
  return battery.chemistry !== 'lifepo4';
}

/** Discharge current (A, positive) as the bank feels it: Peukert-corrected for lead-acid, as is for LiFePO4. */
export function dischargeDrainCurrent(battery: ResolvedBatterySetup, current: number): number {
  if (!usesPeukertCorrection(battery)) return current;
  const exponent = CHEMISTRY_PROFILES[battery.chemistry].peukertExponent;
  return peukertEffectiveCurrent(battery.ratedCapacityAh, battery.ratedHours, current, exponent);
}

const POSITIVE_OPTIONS = { ratedHours: 'h', tailCurrentA: 'A', chargedVoltage: 'V' } as const;
const NON_NEGATIVE_OPTIONS = ['restMinutes', 'restCurrentA', 'chargedHoldMinutes'] as const;

function checkOptions(setup: BatterySetup): void {
  for (const [field, unit] of Object.entries(POSITIVE_OPTIONS) as [keyof typeof POSITIVE_OPTIONS, string][]) {
    const value = setup[field];
    if (value !== undefined) checkPositive(field, value, unit);
  }
  for (const field of NON_NEGATIVE_OPTIONS) {
    const value = setup[field];
    if (value !== undefined && !(Number.isFinite(value) && value >= 0)) {
      throw new AnalyticsSettingError(
        'bad_battery_setup',
        field,
        `${field} must be zero or more; got ${value}`,
      );
    }
  }
}

function checkPositive(field: string, value: number, unit: string): void {
  if (!Number.isFinite(value) || value <= 0) throw notPositiveError(field, value, unit);
}

function definedOnly<T extends object>(value: T): Partial<T> {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as Partial<T>;
}
