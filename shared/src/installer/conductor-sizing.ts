// The two rules that size a DC conductor: the voltage it may lose, and the current it may carry.
import { conductorAmpacity, InsulationRatingC } from './conductor-ampacity';
import { ConductorConstruction, conductorResistancePerMetre } from './conductor-resistance';
import { carries, CONTINUOUS_LOAD_FACTOR } from './fuse-ratings';
import { AWG_SIZES, AwgSize } from './wire-gauge';

/** Voltage lost along a circuit, in volts and as a percentage of the nominal voltage. */
export interface VoltageDrop {
  /** Volts lost out and back. */
  volts: number;
  /** Percent of the nominal system voltage. */
  percent: number;
}

/**
 * Expected voltage drop of a gauge carrying a current over a one-way run (copper out and back), at a
 * conductor temperature (default 20 °C) and construction (default solid, the ASTM B258 / IEC 60028 figure).
 */
export function voltageDropFor(
  gauge: AwgSize,
  currentA: number,
  oneWayLengthM: number,
  systemVoltage: number,
  temperatureC = 20,
  construction: ConductorConstruction = 'solid',
): VoltageDrop {
  const volts = currentA * conductorResistancePerMetre(gauge, construction, temperatureC) * 2 * oneWayLengthM;
  return { volts, percent: (volts / systemVoltage) * 100 };
}

/** Thinnest gauge whose drop is within `allowedDropPercent`, or undefined when none is. */
export function minimumGaugeByDrop(
  currentA: number,
  oneWayLengthM: number,
  systemVoltage: number,
  allowedDropPercent: number,
  temperatureC = 20,
  construction: ConductorConstruction = 'solid',
): AwgSize | undefined {
  return AWG_SIZES.find(
    (g) =>
      voltageDropFor(g, currentA, oneWayLengthM, systemVoltage, temperatureC, construction).percent <=
      allowedDropPercent,
  );
}

/**
 * Thinnest gauge whose ampacity, times `derating` (default 1), is at least 125 % of the continuous current
 * (NEC 210.19(A)(1)), or undefined.
 */
export function minimumGaugeByAmpacity(
  currentA: number,
  insulationRatingC: InsulationRatingC,
  derating = 1,
): AwgSize | undefined {
  return AWG_SIZES.find((g) =>
    carries(conductorAmpacity(g, insulationRatingC) * derating, currentA * CONTINUOUS_LOAD_FACTOR),
  );
}
