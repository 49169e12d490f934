// How much current a battery bank can push into a short circuit, so the fuse nearest the bank can be chosen
// to interrupt it. A LiFePO4 bank's cells have a fraction of a milliohm each and can deliver thousands of
// amperes; a fuse whose interrupting rating is lower may arc on instead of clearing (common practice: a fuse
// class rated for the bank's fault current, placed close to the bank).
import { openCircuitVoltage } from '../battery/battery-math';
import { Chemistry } from '../battery/chemistry-profile';
import { formatAmount, InstallerFinding } from './installer-finding';

/** The bank behind a circuit, as far as its fault current is concerned. */
export interface FaultBank {
  chemistry: Chemistry;
  /** Rated capacity of the whole bank, Ah. */
  capacityAh: number;
}

// Resistance of a 100 Ah 12 V block into a bolted fault, ohms: cells, links and terminals, no BMS credited.
// From memory of cell datasheets (AC impedance of 100 Ah LiFePO4 prismatic cells ≈ 0.3 mΩ) and of lead-acid
// short-circuit figures (about 2,500–3,500 A for a 100 Ah AGM block); lower resistance is the safe side.
const FAULT_RESISTANCE_100AH_BLOCK_OHM: Record<Chemistry, number> = {
  lifepo4: 0.0015,
  agm: 0.004,
  flooded: 0.005,
};

/** Prospective short-circuit current at the bank's terminals, A: full open-circuit voltage over the bank's resistance. */
export function prospectiveFaultCurrentA(bank: FaultBank, nominalVoltage: number): number {
  const blocks = nominalVoltage / 12;
  const resistance = FAULT_RESISTANCE_100AH_BLOCK_OHM[bank.chemistry] * (100 / bank.capacityAh) * blocks;
  return openCircuitVoltage(bank.chemistry, nominalVoltage, 100) / resistance;
}

/** A finding on the fuse's interrupting rating against the bank's fault current (none without a bank). */
export function interruptingRatingFinding(
  faultCurrentA: number | undefined,
  interruptingRatingA: number | undefined,
  bank: FaultBank | undefined,
  nominalVoltage: number,
): InstallerFinding | undefined {
  if (faultCurrentA === undefined || bank === undefined) return undefined;
  const name =
    bank.chemistry === 'lifepo4' ? 'LiFePO4' : bank.chemistry === 'agm' ? 'AGM' : 'flooded lead-acid';
  const fault = `${formatAmount(faultCurrentA)} A`;
  if (interruptingRatingA === undefined) {
    return {
      severity: 'warning',
      code: 'interrupting-rating-not-given',
      message: `a ${bank.capacityAh} Ah ${name} bank can drive about ${fault} into a short at its terminals: the fuse nearest the bank needs a DC interrupting rating of at least that at ${nominalVoltage} V (common practice: a fuse class rated for it, e.g. class T, close to the bank)`,
    };
  }
  if (interruptingRatingA < faultCurrentA) {
    return {
      severity: 'error',
      code: 'interrupting-rating-below-fault',
      message: `the fuse interrupts ${formatAmount(interruptingRatingA)} A but the ${name} bank can drive about ${fault} into a short: it may arc on instead of clearing; choose a fuse class rated for the fault current`,
    };
  }
  return undefined;
}
