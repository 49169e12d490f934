// The findings of an energy budget: inverter against BMS (continuous and surge), AC loads against the
// inverter, and the daily balance.
import type { EnergyBudgetInput } from './energy-budget-input';
import { formatAmount, InstallerFinding } from './installer-finding';

/** Figures of a budget the findings judge. */
export interface BudgetFigures {
  inverterDcCurrentA: number;
  inverterSurgeDcCurrentA: number | undefined;
  balanceWhPerDay: number;
}

/** Findings of a budget, unsorted. */
export function budgetFindings(input: EnergyBudgetInput, figures: BudgetFigures): InstallerFinding[] {
  const { system } = input;
  const findings: InstallerFinding[] = [...inverterFindings(input, figures)];
  const acWatts = input.loads.filter((l) => l.ac).reduce((total, l) => total + (l.watts ?? 0), 0);
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
  if (figures.balanceWhPerDay < 0) {
    findings.push({
      severity: 'warning',
      code: 'daily-deficit',
      message: `the loads take ${formatAmount(-figures.balanceWhPerDay)} Wh a day more than the sources store`,
    });
  }
  if (system.chemistry === undefined) {
    findings.push({
      severity: 'info',
      code: 'chemistry-not-given',
      message: `no battery chemistry given: amp-hours at ${system.nominalVoltage} V, no charge losses, no Peukert`,
    });
  }
  return findings;
}

function inverterFindings(input: EnergyBudgetInput, figures: BudgetFigures): InstallerFinding[] {
  const { system } = input;
  const findings: InstallerFinding[] = [];
  if (figures.inverterDcCurrentA > system.bmsContinuousA) {
    findings.push({
      severity: 'error',
      code: 'inverter-exceeds-bms',
      message: `at its rated ${system.inverterRatedW} W the inverter draws about ${formatAmount(figures.inverterDcCurrentA)} A, above the BMS continuous rating of ${system.bmsContinuousA} A`,
    });
  }
  const surge = figures.inverterSurgeDcCurrentA;
  if (surge === undefined) return findings;
  const surgeText = `at its ${system.inverterSurgeW} W surge the inverter draws about ${formatAmount(surge)} A`;
  if (system.bmsPeakA === undefined) {
    if (surge > system.bmsContinuousA) {
      findings.push({
        severity: 'warning',
        code: 'bms-peak-not-given',
        message: `${surgeText}, above the BMS continuous rating of ${system.bmsContinuousA} A: enter the BMS peak rating to check the surge`,
      });
    }
  } else if (surge > system.bmsPeakA) {
    findings.push({
      severity: 'error',
      code: 'inverter-surge-exceeds-bms-peak',
      message: `${surgeText}, above the BMS peak rating of ${system.bmsPeakA} A: a motor or compressor start can trip the BMS`,
    });
  }
  return findings;
}
