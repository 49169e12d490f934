// DC resistance of copper conductors as installers buy them. Solid conductors come from first principles
// (ASTM B258 area, IEC 60028 resistivity: the same figures as NEC Chapter 9 Table 8's solid rows); stranded
// conductors from NEC Chapter 9 Table 8's stranded (class B) rows, which carry a little more resistance for
// the lay of the strands; fine-stranded (flexible, class 5 / K) cable from the stranded figure scaled by the
// IEC 60228 class 5 to class 2 ratio at the nearest metric size.
import { AwgSize, conductorSize, copperResistancePerMetre } from './wire-gauge';

/** How the conductor is built: one solid wire, concentric strands (class B) or fine strands (class 5 / K). */
export const CONDUCTOR_CONSTRUCTIONS = ['solid', 'stranded', 'fine-stranded'] as const;

/** One conductor construction. */
export type ConductorConstruction = (typeof CONDUCTOR_CONSTRUCTIONS)[number];

/** Temperature coefficient of copper referred to 75 °C, per kelvin (NEC Chapter 9 Table 8, note 2). */
export const COPPER_TEMPERATURE_COEFFICIENT_75C = 0.00323;

const METRES_PER_KFT = 304.8;

/** NEC Chapter 9 Table 8, uncoated copper, stranded rows, Ω/kft at 75 °C. */
const NEC_TABLE_8_STRANDED_OHM_PER_KFT: Record<AwgSize, number> = {
  '18': 7.95,
  '16': 4.99,
  '14': 3.14,
  '12': 1.98,
  '10': 1.24,
  '8': 0.778,
  '6': 0.491,
  '4': 0.308,
  '3': 0.245,
  '2': 0.194,
  '1': 0.154,
  '1/0': 0.122,
  '2/0': 0.0967,
  '3/0': 0.0766,
  '4/0': 0.0608,
};

// IEC 60228 Tables 2 and 3, plain copper, maximum Ω/km at 20 °C: class 2 (stranded) and class 5 (flexible)
// (from memory; their ratio is what is used, 1.00 to 1.08).
const IEC_60228_CLASS_2_AND_5: Record<number, readonly [number, number]> = {
  0.75: [24.5, 26.0],
  1: [18.1, 19.5],
  1.5: [12.1, 13.3],
  2.5: [7.41, 7.98],
  4: [4.61, 4.95],
  6: [3.08, 3.3],
  10: [1.83, 1.91],
  16: [1.15, 1.21],
  25: [0.727, 0.78],
  35: [0.524, 0.554],
  50: [0.387, 0.386],
  70: [0.268, 0.272],
  95: [0.193, 0.206],
  120: [0.153, 0.161],
};

/** NEC Chapter 9 Table 8 stranded resistance of a gauge at 75 °C, Ω/m. */
export function necStrandedResistancePerMetreAt75C(gauge: AwgSize): number {
  return NEC_TABLE_8_STRANDED_OHM_PER_KFT[gauge] / METRES_PER_KFT;
}

/** Ratio of fine-stranded (IEC 60228 class 5) to stranded (class 2) resistance at the gauge's nearest metric size. */
export function fineStrandFactor(gauge: AwgSize): number {
  const [class2, class5] = IEC_60228_CLASS_2_AND_5[conductorSize(gauge).nearestMetricMm2];
  return Math.max(1, class5 / class2);
}

/** Copper resistance per metre, Ω/m, of a gauge by construction at a conductor temperature, °C. */
export function conductorResistancePerMetre(
  gauge: AwgSize,
  construction: ConductorConstruction,
  temperatureC: number,
): number {
  if (construction === 'solid') return copperResistancePerMetre(gauge, temperatureC);
  // NEC Chapter 9 Table 8 note 2: R2 = R1 [1 + α (T2 − 75)], α = 0.00323 for copper.
  const stranded =
    necStrandedResistancePerMetreAt75C(gauge) *
    (1 + COPPER_TEMPERATURE_COEFFICIENT_75C * (temperatureC - 75));
  return construction === 'stranded' ? stranded : stranded * fineStrandFactor(gauge);
}
