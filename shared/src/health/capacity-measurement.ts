// How much one capacity measurement is worth. Basis: coulomb counting between two points of known state of
// charge, recalibrated to 100 % at the end of charge and to the open-circuit voltage after a rest (Plett,
// "Battery Management Systems", Vol. I ch. 2 and Vol. II ch. 3 and 4, Artech House 2015 — from memory;
// Ng et al., "Enhanced coulomb counting method for estimating state-of-charge and state-of-health of
// lithium-ion batteries", Applied Energy 86 (2009) 1506–1511 — SoH as the charge counted between full and a
// known depth, from memory). Uncertainties add in quadrature (first-order propagation of independent errors,
// any statistics text, e.g. Taylor, "An Introduction to Error Analysis", 2nd ed., ch. 3).
import { Chemistry, CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import { stateOfChargeFromOpenCircuit } from '../analytics/open-circuit-soc';

/**
 * Minutes of near-zero current before a resting voltage is read as open-circuit voltage, for capacity.
 * LiFePO4 relaxes to within a few millivolts of its OCV in well under two hours; lead-acid carries surface
 * charge and acid-diffusion gradients for hours, and four hours is the usual minimum before a resting-voltage
 * reading (24 h for a true one) — common practice, from memory. Stricter than the SoC estimator's rest,
 * because a capacity sample is taken once and kept for months.
 */
export const CAPACITY_REST_MINUTES: Readonly<Record<Chemistry, number>> = {
  lifepo4: 120,
  agm: 240,
  flooded: 240,
};

/**
 * One standard deviation of a rested 12 V block's voltage as the estimator sees it: the monitor's resolution
 * and calibration (±5–10 mV on hobby-grade shunt monitors, common practice) plus residual relaxation. LiFePO4
 * also shows OCV hysteresis of tens of millivolts per cell on its plateau (Plett Vol. I ch. 2, from memory),
 * which this does not model: the plateau's slope already makes such rests worthless, and near empty, where
 * samples are taken, the curve's slope dwarfs it. OCV's temperature dependence (sub-mV/K per cell) is ignored.
 */
export const REST_VOLTAGE_SIGMA_PER_BLOCK_V = 0.02;

/** Zero offset of the current sensor, A (typical of shunt monitors after zeroing, common practice). */
export const CURRENT_OFFSET_SIGMA_A = 0.05;

/**
 * Uncertainty of the coulombic charge efficiency applied to charge put in between sync and sample: LiFePO4 is
 * near 99 % and steady; lead-acid acceptance varies with state of charge and rate (common practice, from memory).
 */
export const CHARGE_EFFICIENCY_SIGMA: Readonly<Record<Chemistry, number>> = {
  lifepo4: 0.005,
  agm: 0.03,
  flooded: 0.05,
};

/** A sample must have drawn at least this fraction of the open-circuit scale; shallower ones say too little. */
export const MIN_SAMPLE_DEPTH = 0.3;

/** Samples less certain than this are not kept: on LiFePO4 that leaves rests below about 22 %, off the plateau. */
export const MAX_SAMPLE_RELATIVE_SIGMA = 0.05;

/**
 * State of charge at a BMS low-voltage cut-off and its uncertainty, fraction. Datasheets rate capacity down to
 * the discharge cut-off voltage, so the cut is the bottom of the scale by definition; where exactly it falls
 * depends on the load's voltage sag and the weakest cell, within the bottom few percent (from memory).
 */
export const CUTOFF_STATE_OF_CHARGE = 0;
export const CUTOFF_STATE_OF_CHARGE_SIGMA = 0.02;

/** State of charge (fraction) read from a rested voltage, and its standard deviation from the curve's slope there. */
export function restedStateOfCharge(
  chemistry: Chemistry,
  nominalVoltage: number,
  voltage: number,
): { stateOfCharge: number; sigma: number } {
  const sigmaV = REST_VOLTAGE_SIGMA_PER_BLOCK_V * (nominalVoltage / 12);
  const soc = (v: number) => stateOfChargeFromOpenCircuit(chemistry, nominalVoltage, v) / 100;
  // Half the SoC span of ±1 σ in voltage: follows the local slope, and its change between table segments.
  const sigma = Math.max((soc(voltage + sigmaV) - soc(voltage - sigmaV)) / 2, 0.001);
  return { stateOfCharge: soc(voltage), sigma };
}

/** What a measurement needs to become a capacity on the open-circuit scale at 25 °C. */
export interface CountedDepth {
  chemistry: Chemistry;
  /** Net amp-hours drawn since the sync. */
  countedAh: number;
  /** Charge amp-hours put in since the sync. */
  chargeAh: number;
  /** Hours since the sync (the sensor offset accumulates over them). */
  hours: number;
  /** State of charge at the end, fraction, and its standard deviation. */
  socAtEnd: number;
  socSigma: number;
  /** Usable fraction of the whole capacity at the pack temperature (cold hides the bottom). */
  capacityFactor: number;
}

/**
 * Whole capacity at 25 °C (Ah) = counted ÷ ((1 − SoC_end) × capacity factor), and its standard deviation
 * from the sensor offset × hours, the efficiency of charge put in meanwhile, and the SoC at the end.
 */
export function capacityFromCount(depth: CountedDepth): { capacityAh: number; sigmaAh: number } {
  const scale = (1 - depth.socAtEnd) * depth.capacityFactor;
  const capacityAh = depth.countedAh / scale;
  const offsetAh = CURRENT_OFFSET_SIGMA_A * depth.hours;
  const efficiencyAh = CHARGE_EFFICIENCY_SIGMA[depth.chemistry] * depth.chargeAh;
  const countSigma = Math.hypot(offsetAh, efficiencyAh) / scale;
  // ∂C/∂s = C / (1 − s): an error in the end state weighs more the shallower the discharge.
  const socSigmaAh = (capacityAh * depth.socSigma) / (1 - depth.socAtEnd);
  return { capacityAh, sigmaAh: Math.hypot(countSigma, socSigmaAh) };
}

/** The low-voltage cut-off of a bank, volts (the chemistry's per-block value scaled). */
export function lowVoltageCutoff(chemistry: Chemistry, nominalVoltage: number): number {
  return CHEMISTRY_PROFILES[chemistry].lowVoltageCutoff * (nominalVoltage / 12);
}
