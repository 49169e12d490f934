// The two rules that size a DC conductor: the voltage it may lose, and the current it may carry.
import { conductorAmpacity, InsulationRatingC } from './conductor-ampacity';
import { CONTINUOUS_LOAD_FACTOR } from './fuse-ratings';
import { AWG_SIZES, AwgSize, circuitVoltageDrop } from './wire-gauge';

/** Voltage lost along a circuit, in volts and as a percentage of the nominal voltage. */
export interface VoltageDrop {
  /** Volts lost out and back. */
  volts: number;
  /** Percent of the nominal system voltage. */
  percent: number;
}
/** Expected voltage drop of a gauge carrying a current over a one-way run. */
export function voltageDropFor(
  gauge: AwgSize,
  currentA: number,
  oneWayLengthM: number,
  systemVoltage: number,
  temperatureC = 20,
): VoltageDrop {
  const volts = circuitVoltageDrop(gauge, currentA, oneWayLengthM, temperatureC);
  return { volts, percent: (volts / systemVoltage) * 100 };
}

/** Thinnest gauge whose drop is within `allowedDropPercent`, or undefined when none is. */
export function minimumGaugeByDrop(
  currentA: number,
  oneWayLengthM: number,
  systemVoltage: number,
  allowedDropPercent: number,
  temperatureC = 20,
): AwgSize | undefined {
  return AWG_SIZES.find(
    (g) =>
      voltageDropFor(g, currentA, oneWayLengthM, systemVoltage, temperatureC).percent <= allowedDropPercent,
  );
}

/** Thinnest gauge rated for 125 % of the continuous current (NEC 210.19(A)(1)), or undefined. */
export function minimumGaugeByAmpacity(
  currentA: number,
  insulationRatingC: InsulationRatingC,
): AwgSize | undefined {
  return AWG_SIZES.find((g) => conductorAmpacity(g, insulationRatingC) >= currentA * CONTINUOUS_LOAD_FACTOR);
}
