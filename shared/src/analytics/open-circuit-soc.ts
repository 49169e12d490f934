// Reading state of charge back from a resting voltage, and how much to believe it. A flat curve (LiFePO4
// between about 20 and 90 %) turns a few millivolts of sensor error or surface charge into many percent,
// so the correction is weighted by the curve's local slope.
import { CHEMISTRY_PROFILES, Chemistry } from '../battery/chemistry-profile';
import { interpolateTable } from '../battery/interpolate-table';

/** Voltage uncertainty of a rested 12 V block (sensor error plus residual polarisation), volts. */
const VOLTAGE_UNCERTAINTY_PER_BLOCK_V = 0.03;
/** State-of-charge error at which an OCV reading still earns full weight, percent. */
const TRUSTED_ERROR_PERCENT = 2;

/** State of charge (%) whose open-circuit voltage is `voltage` for a bank of `nominalVoltage`. */
export function stateOfChargeFromOpenCircuit(
  chemistry: Chemistry,
  nominalVoltage: number,
  voltage: number,
): number {
  const perBlock = voltage / (nominalVoltage / 12);
  const inverse = CHEMISTRY_PROFILES[chemistry].openCircuitVoltageTable.map(
    ([soc, volts]) => [volts, soc] as const,
  );
  return interpolateTable(inverse, perBlock);
}

/** Weight (0–1) an OCV-derived state of charge deserves at `stateOfCharge`, from the curve's slope there. */
export function openCircuitWeight(chemistry: Chemistry, stateOfCharge: number): number {
  const table = CHEMISTRY_PROFILES[chemistry].openCircuitVoltageTable;
  const slope = slopeAt(table, stateOfCharge);
  if (slope <= 0) return 0;
  const errorPercent = VOLTAGE_UNCERTAINTY_PER_BLOCK_V / slope;
  return Math.min(1, TRUSTED_ERROR_PERCENT / errorPercent);
}

/** Slope of the OCV table (V per %) over the segment holding `stateOfCharge`. */
function slopeAt(table: readonly (readonly [number, number])[], stateOfCharge: number): number {
  for (let i = 1; i < table.length; i++) {
    if (stateOfCharge <= table[i][0] || i === table.length - 1) {
      const [x0, y0] = table[i - 1];
      const [x1, y1] = table[i];
      return (y1 - y0) / (x1 - x0);
    }
  }
  return 0;
}
