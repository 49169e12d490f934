// A daily energy budget at the battery terminals: what the loads take, what the sources give, and
// whether the battery, inverter and BMS are matched to it. Coulombic (charge) losses are not modelled.
import {
  BudgetLoad,
  BudgetSource,
  EnergyBudgetInput,
  validateEnergyBudgetInput,
} from './energy-budget-input';
import { formatAmount, InstallerFinding, InstallerVerdict, verdictOf } from './installer-finding';

/** Solar derating when none is given: temperature, soiling, wiring and controller losses (common practice). */
export const DEFAULT_SOLAR_DERATE_PERCENT = 20;

/** The budget's daily figures at the battery and its findings. */
export interface EnergyBudget {
  /** Each load's daily energy drawn from the battery (AC loads include inverter losses), Wh. */
  loads: { name: string; whPerDay: number }[];
  /** Each source's daily energy delivered to the battery, Wh, in input order. */
  sources: { kind: BudgetSource['kind']; whPerDay: number }[];
  /** Energy in per day, Wh. */
  whInPerDay: number;
  /** Energy out per day, Wh. */
  whOutPerDay: number;
  /** Charge in per day at the nominal voltage, Ah. */
  ahInPerDay: number;
  /** Charge out per day at the nominal voltage, Ah. */
  ahOutPerDay: number;
  /** In minus out per day, Wh (negative: the battery runs down). */
  balanceWhPerDay: number;
  /** In minus out per day at the nominal voltage, Ah. */
  balanceAhPerDay: number;
  /** Days the given battery's usable energy carries the loads with no charging; undefined without a battery or loads. */
  autonomyDays: number | undefined;
  /** Days until the given battery's usable energy is spent at a negative balance; undefined otherwise. */
  daysUntilEmpty: number | undefined;
  /** Rated capacity that carries the loads for the requested days of autonomy, Ah. */
  suggestedBatteryAh: number;
  /** Battery current of the inverter at its rated output, A. */
  inverterDcCurrentA: number;
  /** Matching of inverter, BMS and balance. */
  verdict: InstallerVerdict;
}

/** Daily energy a load draws from the battery, Wh. */
export function loadWhPerDay(load: BudgetLoad, nominalVoltage: number, inverterEfficiency: number): number {
  const watts = load.amps !== undefined ? load.amps * nominalVoltage : load.watts;
  const atLoad = watts * load.hoursPerDay * load.dutyCycle;
  return load.ac ? atLoad / inverterEfficiency : atLoad;
}

/** Daily energy a source delivers to the battery, Wh. */
export function sourceWhPerDay(source: BudgetSource, nominalVoltage: number): number {
  if (source.kind === 'solar') {
    const derate = source.deratePercent ?? DEFAULT_SOLAR_DERATE_PERCENT;
    return source.watts * source.peakSunHours * (1 - derate / 100);
  }
  return source.amps * source.hoursPerDay * nominalVoltage;
}

/** Battery current an inverter draws at an AC output power, A (P / (V × η)). */
export function inverterDcCurrent(acWatts: number, nominalVoltage: number, efficiency: number): number {
  return acWatts / (nominalVoltage * efficiency);
}

/** Works out a daily energy budget; throws InstallerInputError naming the first bad field. */
export function energyBudget(input: EnergyBudgetInput): EnergyBudget {
  validateEnergyBudgetInput(input);
  const { system } = input;
  const v = system.nominalVoltage;
  const loads = input.loads.map((l) => ({
    name: l.name,
    whPerDay: loadWhPerDay(l, v, system.inverterEfficiency),
  }));
  const sources = input.sources.map((s) => ({ kind: s.kind, whPerDay: sourceWhPerDay(s, v) }));
  const whOutPerDay = sum(loads.map((l) => l.whPerDay));
  const whInPerDay = sum(sources.map((s) => s.whPerDay));
  const balanceWhPerDay = whInPerDay - whOutPerDay;
  const usableWh =
    system.batteryCapacityAh === undefined ? undefined : system.batteryCapacityAh * v * system.usableFraction;
  const inverterDcCurrentA = inverterDcCurrent(system.inverterRatedW, v, system.inverterEfficiency);
  return {
    loads,
    sources,
    whInPerDay,
    whOutPerDay,
    ahInPerDay: whInPerDay / v,
    ahOutPerDay: whOutPerDay / v,
    balanceWhPerDay,
    balanceAhPerDay: balanceWhPerDay / v,
    autonomyDays: usableWh !== undefined && whOutPerDay > 0 ? usableWh / whOutPerDay : undefined,
    daysUntilEmpty: usableWh !== undefined && balanceWhPerDay < 0 ? usableWh / -balanceWhPerDay : undefined,
    suggestedBatteryAh: (whOutPerDay * system.daysOfAutonomy) / (v * system.usableFraction),
    inverterDcCurrentA,
    verdict: verdictOf(budgetFindings(input, inverterDcCurrentA, balanceWhPerDay)),
  };
}

function budgetFindings(input: EnergyBudgetInput, inverterA: number, balanceWh: number): InstallerFinding[] {
  const { system } = input;
  const findings: InstallerFinding[] = [];
  const acWatts = sum(input.loads.filter((l) => l.ac).map((l) => l.watts ?? 0));
  if (inverterA > system.bmsContinuousA) {
    findings.push({
      severity: 'error',
      code: 'inverter-exceeds-bms',
      message: `at its rated ${system.inverterRatedW} W the inverter draws about ${formatAmount(inverterA)} A, above the BMS continuous rating of ${system.bmsContinuousA} A`,
    });
  }
  if (acWatts > 0 && system.inverterRatedW === 0) {
    findings.push({
      severity: 'error',
      code: 'ac-loads-without-inverter',
      message: 'AC loads are listed but no inverter is rated',
    });
  } else if (acWatts > system.inverterRatedW) {
    findings.push({
      severity: 'warning',
      code: 'ac-loads-exceed-inverter',
      message: `the AC loads add up to ${acWatts} W, above the inverter's ${system.inverterRatedW} W if all run at once`,
    });
  }
  if (balanceWh < 0) {
    findings.push({
      severity: 'warning',
      code: 'daily-deficit',
      message: `the loads take ${formatAmount(-balanceWh)} Wh a day more than the sources give`,
    });
  }
  return findings;
}

function sum(values: readonly number[]): number {
  return values.reduce((total, value) => total + value, 0);
}
