// A daily energy budget at the battery terminals: what the loads take (the inverter's standby included),
// what the sources give and how much of it the chemistry stores, and whether the battery, inverter and BMS
// are matched to it. Amp-hours are at the chemistry's nominal voltage (12.8 V per LiFePO4 block, 12 V
// lead-acid); a lead-acid bank's autonomy allows for Peukert at the day's mean discharge current.
import { chemistryNominalVoltage } from '../battery/battery-math';
import { CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import { BudgetCircuit, budgetCircuits, inverterDcCurrent } from './budget-circuits';
import {
  BudgetLoad,
  BudgetSource,
  BudgetSystem,
  EnergyBudgetInput,
  validateEnergyBudgetInput,
} from './energy-budget-input';
import { budgetFindings } from './energy-budget-findings';
import { InstallerVerdict, verdictOf } from './installer-finding';

export { inverterDcCurrent } from './budget-circuits';

/** Solar derating when none is given: temperature, soiling, wiring and controller losses (common practice). */
export const DEFAULT_SOLAR_DERATE_PERCENT = 20;

/** Discharge time a lead-acid capacity is rated at, h (the usual 20 h rating). */
const RATED_HOURS = 20;

/** The budget's daily figures at the battery and its findings. */
export interface EnergyBudget {
  /** Each load's daily energy drawn from the battery (AC loads include inverter losses; standby last), Wh. */
  loads: { name: string; whPerDay: number }[];
  /** Each source's daily energy delivered to the battery, Wh, in input order. */
  sources: { kind: BudgetSource['kind']; whPerDay: number }[];
  /** Energy delivered to the battery per day, Wh. */
  whInPerDay: number;
  /** Of that, the energy stored after the chemistry's charge efficiency, Wh. */
  whStoredPerDay: number;
  /** Energy out per day, Wh. */
  whOutPerDay: number;
  /** Voltage the amp-hours are counted at: the chemistry's nominal, else the class voltage, V. */
  ampHourVoltage: number;
  /** Fraction of the charge delivered that is stored (1 without a chemistry). */
  chargeEfficiency: number;
  /** Charge in per day, Ah. */
  ahInPerDay: number;
  /** Charge out per day, Ah. */
  ahOutPerDay: number;
  /** Stored minus out per day, Wh (negative: the battery runs down). */
  balanceWhPerDay: number;
  /** Stored minus out per day, Ah. */
  balanceAhPerDay: number;
  /** Share of the rated capacity available at the day's mean discharge current (Peukert; 1 for LiFePO4). */
  peukertCapacityFraction: number;
  /** Days the given battery's usable energy carries the loads with no charging; undefined without a battery or loads. */
  autonomyDays: number | undefined;
  /** Days until the given battery's usable energy is spent at a negative balance; undefined otherwise. */
  daysUntilEmpty: number | undefined;
  /** Days for the daily surplus to refill the usable capacity from empty; undefined without a battery or a surplus. */
  daysToRecharge: number | undefined;
  /** Rated capacity that carries the loads for the requested days of autonomy, Ah. */
  suggestedBatteryAh: number;
  /** Battery current of the inverter at its rated output, A. */
  inverterDcCurrentA: number;
  /** Battery current of the inverter at its surge output, A, when a surge rating is given. */
  inverterSurgeDcCurrentA: number | undefined;
  /** Energy the inverter takes idling, Wh/day. */
  inverterStandbyWhPerDay: number;
  /** The DC circuits and their currents, to size each cable and fuse. */
  circuits: BudgetCircuit[];
  /** Matching of inverter, BMS and balance. */
  verdict: InstallerVerdict;
}

/** Daily energy a load draws from the battery, Wh (`voltage`: what a DC load's amps are drawn at). */
export function loadWhPerDay(load: BudgetLoad, voltage: number, inverterEfficiency: number): number {
  const watts = load.amps !== undefined ? load.amps * voltage : load.watts;
  const atLoad = watts * load.hoursPerDay * load.dutyCycle;
  return load.ac ? atLoad / inverterEfficiency : atLoad;
}

/** Daily energy a source delivers to the battery, Wh. */
export function sourceWhPerDay(source: BudgetSource, voltage: number): number {
  if (source.kind === 'solar') {
    const derate = source.deratePercent ?? DEFAULT_SOLAR_DERATE_PERCENT;
    return source.watts * source.peakSunHours * (1 - derate / 100);
  }
  return source.amps * source.hoursPerDay * voltage;
}

/** Inverter idle energy per day, Wh (none without an inverter). */
export function inverterStandbyWhPerDay(system: BudgetSystem): number {
  if (system.inverterRatedW === 0) return 0;
  return (system.inverterStandbyW ?? 0) * (system.inverterStandbyHoursPerDay ?? 24);
}

/**
 * Share of the rated (20 h) capacity a lead-acid bank gives at a steady current: Peukert's t = H (C/(I H))^k
 * means C_I = C (C/(I H))^(k − 1); never credited above the rating at currents below C/20.
 */
export function peukertCapacityFraction(
  system: BudgetSystem,
  capacityAh: number,
  meanCurrentA: number,
): number {
  if (system.chemistry === undefined || system.chemistry === 'lifepo4' || !(meanCurrentA > 0)) return 1;
  const k = CHEMISTRY_PROFILES[system.chemistry].peukertExponent;
  return Math.min(1, Math.pow(capacityAh / (meanCurrentA * RATED_HOURS), k - 1));
}

function suggestedCapacityAh(system: BudgetSystem, whOut: number, voltage: number): number {
  const plain = (whOut * system.daysOfAutonomy) / (voltage * system.usableFraction);
  const meanCurrent = whOut / 24 / voltage;
  let capacity = plain;
  // The Peukert share grows with capacity, so a few fixed-point steps settle it.
  for (let i = 0; i < 20; i++) capacity = plain / peukertCapacityFraction(system, capacity, meanCurrent);
  return capacity;
}

/** Works out a daily energy budget; throws InstallerInputError naming the first bad field. */
export function energyBudget(input: EnergyBudgetInput): EnergyBudget {
  validateEnergyBudgetInput(input);
  const { system } = input;
  const voltage =
    system.chemistry === undefined
      ? system.nominalVoltage
      : chemistryNominalVoltage(system.chemistry, system.nominalVoltage);
  const chargeEfficiency =
    system.chemistry === undefined ? 1 : CHEMISTRY_PROFILES[system.chemistry].chargeEfficiency;
  const standbyWh = inverterStandbyWhPerDay(system);
  const loads = input.loads.map((l) => ({
    name: l.name,
    whPerDay: loadWhPerDay(l, voltage, system.inverterEfficiency),
  }));
  if (standbyWh > 0) loads.push({ name: 'Inverter standby', whPerDay: standbyWh });
  const sources = input.sources.map((s) => ({ kind: s.kind, whPerDay: sourceWhPerDay(s, voltage) }));
  const whOutPerDay = sum(loads.map((l) => l.whPerDay));
  const whInPerDay = sum(sources.map((s) => s.whPerDay));
  const whStoredPerDay = whInPerDay * chargeEfficiency;
  const balanceWhPerDay = whStoredPerDay - whOutPerDay;
  const capacity = system.batteryCapacityAh;
  const peukert =
    capacity === undefined ? 1 : peukertCapacityFraction(system, capacity, whOutPerDay / 24 / voltage);
  const usableWh = capacity === undefined ? undefined : capacity * voltage * system.usableFraction * peukert;
  const inverterDcCurrentA = inverterDcCurrent(
    system.inverterRatedW,
    system.nominalVoltage,
    system.inverterEfficiency,
  );
  const inverterSurgeDcCurrentA =
    system.inverterSurgeW === undefined || system.inverterRatedW === 0
      ? undefined
      : inverterDcCurrent(system.inverterSurgeW, system.nominalVoltage, system.inverterEfficiency);
  return {
    loads,
    sources,
    whInPerDay,
    whStoredPerDay,
    whOutPerDay,
    ampHourVoltage: voltage,
    chargeEfficiency,
    ahInPerDay: whInPerDay / voltage,
    ahOutPerDay: whOutPerDay / voltage,
    balanceWhPerDay,
    balanceAhPerDay: balanceWhPerDay / voltage,
    peukertCapacityFraction: peukert,
    autonomyDays: usableWh !== undefined && whOutPerDay > 0 ? usableWh / whOutPerDay : undefined,
    daysUntilEmpty: usableWh !== undefined && balanceWhPerDay < 0 ? usableWh / -balanceWhPerDay : undefined,
    daysToRecharge: usableWh !== undefined && balanceWhPerDay > 0 ? usableWh / balanceWhPerDay : undefined,
    suggestedBatteryAh: suggestedCapacityAh(system, whOutPerDay, voltage),
    inverterDcCurrentA,
    inverterSurgeDcCurrentA,
    inverterStandbyWhPerDay: standbyWh,
    circuits: budgetCircuits(input),
    verdict: verdictOf(
      budgetFindings(input, { inverterDcCurrentA, inverterSurgeDcCurrentA, balanceWhPerDay }),
    ),
  };
}

function sum(values: readonly number[]): number {
  return values.reduce((total, value) => total + value, 0);
}
