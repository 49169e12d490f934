/**
 * Common DC fuse ratings, A, across blade, bolt-down and high-current fuse families (common practice:
 * manufacturers' catalogues vary; check the rating exists in the family chosen).
 */
export const COMMON_DC_FUSE_RATINGS_A: readonly number[] = [
  1, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 35, 40, 50, 60, 70, 80, 90, 100, 125, 150, 175, 200, 225, 250, 300,
  350, 400, 500,
];

/** Margin of a fuse over the continuous current: 125 % (NEC 210.20(A) continuous-load rule; common practice). */
export const CONTINUOUS_LOAD_FACTOR = 1.25;

/** The range of fuse ratings that carries the load and still protects the conductor. */
export interface FuseRange {
  /** Lowest acceptable rating: continuous current × 125 %, A. */
  minimumA: number;
  /** Highest acceptable rating: the conductor's ampacity, A. */
  maximumA: number;
  /** Common ratings within [minimumA, maximumA]; empty when the range is empty. */
  standardRatingsA: number[];
}

/** Fuse ratings for a continuous current on a conductor of a given ampacity. */
export function fuseRange(continuousCurrentA: number, conductorAmpacityA: number): FuseRange {
  const minimumA = continuousCurrentA * CONTINUOUS_LOAD_FACTOR;
  return {
    minimumA,
    maximumA: conductorAmpacityA,
    standardRatingsA: COMMON_DC_FUSE_RATINGS_A.filter((r) => r >= minimumA && r <= conductorAmpacityA),
  };
}
