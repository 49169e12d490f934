// The shape of an energy budget and its validation: one place that says what a sensible entry is, so
// the arithmetic in energy-budget.ts can trust its input.
import { Chemistry } from '../battery/chemistry-profile';
import { InstallerInputError, requireNumberInRange, requireOneOf } from './installer-input-error';
import { SYSTEM_VOLTAGES, SystemVoltage } from './system-voltage';

/** One consumer: DC loads in watts or DC amps, AC loads in nameplate watts (drawn through the inverter). */
export type BudgetLoad = {
  /** What it is, as the owner calls it (`fridge`, `cabin lights`). */
  name: string;
  /** Hours a day it is switched on. */
  hoursPerDay: number;
  /** Fraction of the on-time it actually draws (a fridge compressor cycles), 0–1. */
  dutyCycle: number;
  /** True when it runs from the inverter. */
  ac: boolean;
} & ({ watts: number; amps?: undefined } | { amps: number; watts?: undefined });

/** One charge source: solar by panel watts and peak sun hours, DC-DC or shore charger by output amps. */
export type BudgetSource =
  | { kind: 'solar'; watts: number; peakSunHours: number; deratePercent?: number }
  | { kind: 'dc-dc' | 'shore'; amps: number; hoursPerDay: number };

/** The battery system the budget runs on. */
export interface BudgetSystem {
  /** Nominal battery voltage, V. */
  nominalVoltage: SystemVoltage;
  /** Inverter efficiency, 0–1 (often about 0.85–0.93 — common practice). */
  inverterEfficiency: number;
  /** Inverter continuous rating, W (0 when there is none). */
  inverterRatedW: number;
  /** The BMS's continuous discharge rating, A. */
  bmsContinuousA: number;
  /** Fraction of rated capacity the owner may use (LiFePO4 ~0.9, lead-acid 0.5 — common practice). */
  usableFraction: number;
  /** Days the battery alone should carry the loads. */
  daysOfAutonomy: number;
  /** Rated capacity of the installed battery, Ah, when there is one to judge. */
  batteryCapacityAh?: number;
  /** Battery chemistry: sets the nominal voltage for Ah, the charge efficiency and Peukert; without it, the class voltage and no losses. */
  chemistry?: Chemistry;
  /** Inverter's own draw while switched on with no load, W (from its datasheet; 0 when none). */
  inverterStandbyW?: number;
  /** Hours a day the inverter is left on, h (default 24). */
  inverterStandbyHoursPerDay?: number;
  /** Inverter's surge (peak) output for a few seconds, W. */
  inverterSurgeW?: number;
  /** The BMS's peak (short-time) discharge rating, A. */
  bmsPeakA?: number;
}

/** Everything an energy budget needs. */
export interface EnergyBudgetInput {
  /** Consumers. */
  loads: readonly BudgetLoad[];
  /** Charge sources. */
  sources: readonly BudgetSource[];
  /** The battery system. */
  system: BudgetSystem;
}

const positive = (max: number, unit: string) => ({ min: 0, max, exclusiveMin: true, unit });
const nonNegative = (max: number, unit: string) => ({ min: 0, max, unit });

// A JSON body can hold null (or a number) where an entry belongs; refuse it by name before reading fields.
function requireEntry(value: unknown, at: string): void {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new InstallerInputError('installer-input-not-allowed', at, `${at} must be an object`);
  }
}

function validateLoad(load: BudgetLoad, at: string): void {
  requireEntry(load, at);
  if (typeof load.name !== 'string' || load.name.trim() === '') {
    throw new InstallerInputError(
      'installer-input-not-allowed',
      `${at}.name`,
      `${at}.name must be a non-empty name`,
    );
  }
  requireNumberInRange(`${at}.hoursPerDay`, load.hoursPerDay, nonNegative(24, 'h'));
  requireNumberInRange(`${at}.dutyCycle`, load.dutyCycle, nonNegative(1, ''));
  if (load.amps !== undefined) {
    if (load.ac) {
      throw new InstallerInputError(
        'installer-input-not-allowed',
        `${at}.amps`,
        `${at}.amps: give AC loads in nameplate watts; amps are for DC loads at the battery voltage`,
      );
    }
    requireNumberInRange(`${at}.amps`, load.amps, nonNegative(1000, 'A'));
  } else {
    requireNumberInRange(`${at}.watts`, load.watts, nonNegative(20000, 'W'));
  }
}

function validateSource(source: BudgetSource, at: string): void {
  requireEntry(source, at);
  requireOneOf(`${at}.kind`, source.kind, ['solar', 'dc-dc', 'shore']);
  if (source.kind === 'solar') {
    requireNumberInRange(`${at}.watts`, source.watts, nonNegative(20000, 'W'));
    requireNumberInRange(`${at}.peakSunHours`, source.peakSunHours, nonNegative(12, 'h'));
    if (source.deratePercent !== undefined) {
      requireNumberInRange(`${at}.deratePercent`, source.deratePercent, {
        min: 0,
        max: 100,
        exclusiveMin: false,
        unit: '%',
      });
    }
  } else {
    requireNumberInRange(`${at}.amps`, source.amps, nonNegative(1000, 'A'));
    requireNumberInRange(`${at}.hoursPerDay`, source.hoursPerDay, nonNegative(24, 'h'));
  }
}

function validateSystem(system: BudgetSystem): void {
  requireEntry(system, 'system');
  requireOneOf('system.nominalVoltage', system.nominalVoltage, SYSTEM_VOLTAGES);
  requireNumberInRange('system.inverterEfficiency', system.inverterEfficiency, { min: 0.5, max: 1 });
  requireNumberInRange('system.inverterRatedW', system.inverterRatedW, nonNegative(20000, 'W'));
  requireNumberInRange('system.bmsContinuousA', system.bmsContinuousA, positive(2000, 'A'));
  requireNumberInRange('system.usableFraction', system.usableFraction, positive(1, ''));
  requireNumberInRange('system.daysOfAutonomy', system.daysOfAutonomy, positive(30, 'days'));
  if (system.batteryCapacityAh !== undefined) {
    requireNumberInRange('system.batteryCapacityAh', system.batteryCapacityAh, positive(20000, 'Ah'));
  }
  if (system.chemistry !== undefined) {
    requireOneOf('system.chemistry', system.chemistry, ['lifepo4', 'agm', 'flooded']);
  }
  const optional: [keyof BudgetSystem, { min: number; max: number; exclusiveMin?: boolean; unit: string }][] =
    [
      ['inverterStandbyW', nonNegative(1000, 'W')],
      ['inverterStandbyHoursPerDay', nonNegative(24, 'h')],
      ['inverterSurgeW', nonNegative(60000, 'W')],
      ['bmsPeakA', positive(10000, 'A')],
    ];
  for (const [field, range] of optional) {
    if (system[field] !== undefined) requireNumberInRange(`system.${field}`, system[field], range);
  }
}

/** Throws InstallerInputError naming the first bad field (`loads[1].dutyCycle`, `system.usableFraction`). */
export function validateEnergyBudgetInput(input: EnergyBudgetInput): void {
  for (const field of ['loads', 'sources'] as const) {
    if (!Array.isArray(input[field])) {
      throw new InstallerInputError('installer-input-not-allowed', field, `${field} must be a list`);
    }
  }
  input.loads.forEach((load, i) => validateLoad(load, `loads[${i}]`));
  input.sources.forEach((source, i) => validateSource(source, `sources[${i}]`));
  validateSystem(input.system);
}
