// Ampacity follows the marine DC table (33 CFR 183.425 Table 5, the same figures as ABYC E-11): copper
// conductors outside engine spaces, ambient 30 °C. It is chosen over NFPA 70 Table 310.16 because it
// covers 105 °C insulation, common in vehicle and boat cable, and is written for low-voltage DC.
import { AwgSize } from './wire-gauge';

/** Insulation temperature ratings the ampacity table covers, °C. */
export const INSULATION_RATINGS_C = [60, 75, 90, 105] as const;

/** One insulation temperature rating, °C. */
export type InsulationRatingC = (typeof INSULATION_RATINGS_C)[number];

/** Where the ampacity figures come from, for display beside them. */
export const AMPACITY_SOURCE =
  '33 CFR 183.425 Table 5 (as ABYC E-11): copper conductor outside engine spaces, 30 °C ambient';

// Columns: 60, 75, 90, 105 °C.
const AMPACITY_TABLE_A: Record<AwgSize, readonly [number, number, number, number]> = {
  '18': [10, 10, 20, 20],
  '16': [15, 15, 25, 25],
  '14': [20, 20, 30, 35],
  '12': [25, 25, 40, 45],
  '10': [40, 40, 55, 60],
  '8': [55, 65, 70, 80],
  '6': [80, 95, 100, 120],
  '4': [105, 125, 135, 160],
  '3': [120, 145, 155, 180],
  '2': [140, 170, 180, 210],
  '1': [165, 195, 210, 245],
  '1/0': [195, 230, 245, 285],
  '2/0': [225, 265, 285, 330],
  '3/0': [260, 310, 330, 385],
  '4/0': [300, 360, 385, 445],
};

/** Allowable continuous current, A, of a copper conductor by its insulation rating (see AMPACITY_SOURCE). */
export function conductorAmpacity(gauge: AwgSize, insulationRatingC: InsulationRatingC): number {
  return AMPACITY_TABLE_A[gauge][INSULATION_RATINGS_C.indexOf(insulationRatingC)];
}
