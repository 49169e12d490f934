// Copper conductor geometry and resistance from first principles, so every figure traces to a definition
// rather than to a copied table: AWG diameters from ASTM B258, resistivity from IEC 60028.

/** AWG trade sizes the installer tools offer, thinnest to thickest (18 AWG to 4/0). */
export const AWG_SIZES = [
  '18',
  '16',
  '14',
  '12',
  '10',
  '8',
  '6',
  '4',
  '3',
  '2',
  '1',
  '1/0',
  '2/0',
  '3/0',
  '4/0',
] as const;

/** One AWG trade size, written as on the cable jacket (`'4'`, `'2/0'`). */
export type AwgSize = (typeof AWG_SIZES)[number];

/** IEC 60228 nominal cross-sections, mm², from 0.75 to 120. */
export const IEC_60228_SIZES_MM2 = [0.75, 1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120] as const;

/** Annealed copper resistivity at 20 °C, Ω·mm²/m (IEC 60028: 1/58). */
export const COPPER_RESISTIVITY_20C = 1 / 58;

/** Copper's temperature coefficient of resistance at 20 °C, per kelvin (IEC 60028). */
export const COPPER_TEMPERATURE_COEFFICIENT = 0.00393;

/** Geometry of one AWG size and the metric sizes an installer would put beside it. */
export interface ConductorSize {
  /** The AWG size. */
  gauge: AwgSize;
  /** Label for display, e.g. `4 AWG`, `2/0 AWG`. */
  label: string;
  /** Diameter of the equivalent solid conductor, mm. */
  diameterMm: number;
  /** Cross-section, mm². */
  areaMm2: number;
  /** The IEC 60228 size closest by ratio (sizes form a roughly geometric series). */
  nearestMetricMm2: number;
  /** The smallest IEC 60228 size at least as large (a safe substitute), or undefined above 120 mm². */
  metricAtLeastMm2: number | undefined;
}

/** The AWG gauge number: 1/0 is 0, 2/0 is −1, 3/0 is −2, 4/0 is −3. */
export function awgNumber(gauge: AwgSize): number {
  return gauge.endsWith('/0') ? 1 - Number(gauge[0]) : Number(gauge);
}

/** Solid-conductor diameter, mm (ASTM B258: d = 0.127 mm × 92^((36 − n)/39)). */
export function awgDiameterMm(gauge: AwgSize): number {
  return 0.127 * Math.pow(92, (36 - awgNumber(gauge)) / 39);
}

/** Cross-section, mm², of the AWG diameter. */
export function awgAreaMm2(gauge: AwgSize): number {
  const d = awgDiameterMm(gauge);
  return (Math.PI / 4) * d * d;
}

/** Copper resistance per metre, Ω/m, at a conductor temperature (default 20 °C). */
export function copperResistancePerMetre(gauge: AwgSize, temperatureC = 20): number {
  const at20 = COPPER_RESISTIVITY_20C / awgAreaMm2(gauge);
  return at20 * (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperatureC - 20));
}

/** Voltage lost in a DC circuit: current out and back, so the copper is 2 × the one-way length. */
export function circuitVoltageDrop(
  gauge: AwgSize,
  currentA: number,
  oneWayLengthM: number,
  temperatureC = 20,
): number {
  return currentA * copperResistancePerMetre(gauge, temperatureC) * 2 * oneWayLengthM;
}

function nearestMetric(areaMm2: number): number {
  let best: number = IEC_60228_SIZES_MM2[0];
  for (const size of IEC_60228_SIZES_MM2) {
    if (Math.abs(Math.log(size / areaMm2)) < Math.abs(Math.log(best / areaMm2))) best = size;
  }
  return best;
}

/** Geometry and metric neighbours of one AWG size. */
export function conductorSize(gauge: AwgSize): ConductorSize {
  const areaMm2 = awgAreaMm2(gauge);
  return {
    gauge,
    label: `${gauge} AWG`,
    diameterMm: awgDiameterMm(gauge),
    areaMm2,
    nearestMetricMm2: nearestMetric(areaMm2),
    metricAtLeastMm2: IEC_60228_SIZES_MM2.find((size) => size >= areaMm2),
  };
}

/** Every offered AWG size with its geometry, thinnest first. */
export const CONDUCTOR_SIZES: readonly ConductorSize[] = AWG_SIZES.map(conductorSize);
