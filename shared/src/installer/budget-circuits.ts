// The DC circuits a budget implies, each with the current its cable and fuse must carry, so a wire and fuse
// check can start from them prefilled: the inverter feeder, each charger's output and each DC load.
import type { EnergyBudgetInput } from './energy-budget-input';

/** One circuit of the system and its continuous DC current. */
export interface BudgetCircuit {
  /** What it feeds, in the owner's words (`Inverter feeder`, `Heater`). */
  name: string;
  kind: 'inverter' | 'charger' | 'load';
  /** Continuous current at the battery, A. */
  currentA: number;
}

/** Battery current an inverter draws at an AC output power, A (P / (V × η)). */
export function inverterDcCurrent(acWatts: number, nominalVoltage: number, efficiency: number): number {
  return acWatts / (nominalVoltage * efficiency);
}

/**
 * Circuits with their DC current. Currents are taken at the class voltage (12/24/48 V), which is at or
 * below the bank's working voltage, so the cable is never sized for less than it carries.
 */
export function budgetCircuits(input: EnergyBudgetInput): BudgetCircuit[] {
  const { system } = input;
  const v = system.nominalVoltage;
  const circuits: BudgetCircuit[] = [];
  if (system.inverterRatedW > 0) {
    circuits.push({
      name: 'Inverter feeder',
      kind: 'inverter',
      currentA: inverterDcCurrent(system.inverterRatedW, v, system.inverterEfficiency),
    });
  }
  input.sources.forEach((source, i) => {
    if (source.kind === 'solar' || !(source.amps > 0)) return;
    const label = source.kind === 'dc-dc' ? 'DC-DC charger' : 'Shore charger';
    circuits.push({ name: `${label} ${i + 1} output`, kind: 'charger', currentA: source.amps });
  });
  for (const load of input.loads) {
    if (load.ac) continue;
    const currentA = load.amps ?? load.watts / v;
    if (currentA > 0) circuits.push({ name: load.name, kind: 'load', currentA });
  }
  return circuits;
}
