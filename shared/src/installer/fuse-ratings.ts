// The fuse rating range for a conductor: at least 125 % of the continuous current, and at most what the
// published rules let it protect — the ampacity itself, or an allowance above it where a rule gives one.
/**
 * Common DC fuse ratings, A, across blade, bolt-down and high-current fuse families (common practice:
 * manufacturers' catalogues vary; check the rating exists in the family chosen).
 */
export const COMMON_DC_FUSE_RATINGS_A: readonly number[] = [
  1, 2, 3, 5, 7.5, 10, 15, 20, 25, 30, 35, 40, 50, 60, 70, 80, 90, 100, 125, 150, 175, 200, 225, 250, 300,
  350, 400, 500,
];

/** NEC 240.6(A) standard ampere ratings of fuses and inverse-time breakers, to 800 A (1, 3, 6, 10 and 601 for fuses). */
export const NEC_STANDARD_RATINGS_A: readonly number[] = [
  1, 3, 6, 10, 15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300,
  350, 400, 450, 500, 600, 601, 700, 800,
];

/** Margin of a fuse over the continuous current: 125 % (NEC 210.20(A) continuous-load rule; common practice). */
export const CONTINUOUS_LOAD_FACTOR = 1.25;

/** Whether an ampacity carries a needed current, forgiving the last bit of floating point (210 A × 0.6 = 126 A). */
export function carries(ampacityA: number, neededA: number): boolean {
  return ampacityA >= neededA * (1 - 1e-12);
}

/** Which published rules set the largest fuse a conductor may have. */
export const PROTECTION_RULES = ['marine', 'nec'] as const;

/** `marine`: 33 CFR 183.455(c) (boats; also applied to vehicles); `nec`: NEC 240.4 (buildings, cabins). */
export type ProtectionRules = (typeof PROTECTION_RULES)[number];

/** The range of fuse ratings that carries the load and still protects the conductor, with the rule behind it. */
export interface FuseRange {
  /** Lowest acceptable rating: continuous current × 125 %, A. */
  minimumA: number;
  /** Highest acceptable rating under the rules, A. */
  maximumA: number;
  /** The rule that sets `maximumA`. */
  maximumRule: string;
  /** Common ratings within [minimumA, maximumA]; empty when none is. */
  standardRatingsA: number[];
  /** The smallest of them: the closest protection that still carries the load; undefined when none. */
  recommendedA: number | undefined;
  /** Why the recommended rating may protect this conductor; undefined when none. */
  recommendedRule: string | undefined;
}

/** Options of `fuseRange`: the rule set (default `nec`) and the nominal system voltage (default 12 V). */
export interface FuseRangeOptions {
  rules?: ProtectionRules;
  systemVoltage?: number;
}

const WITHIN_AMPACITY =
  "not above the conductor's ampacity (NEC 240.4; 33 CFR 183.455(c) allows at least this much)";

/** Largest rating the rules allow on a conductor of `ampacityA`, and the rule that says so. */
export function maximumFuseRating(
  ampacityA: number,
  rules: ProtectionRules,
  systemVoltage: number,
): { maximumA: number; rule: string } {
  if (rules === 'marine') {
    // 48 V banks charge above 50 V (about 57 V for LiFePO4), so they count as circuits of 50 V or more.
    if (systemVoltage < 48) {
      return {
        maximumA: ampacityA * 1.5,
        rule: "33 CFR 183.455(c)(1): up to 150 % of the conductor's ampacity for circuits under 50 V",
      };
    }
    const next = COMMON_DC_FUSE_RATINGS_A.find((r) => r >= ampacityA);
    if (next !== undefined && next > ampacityA && next <= ampacityA * 1.5) {
      return {
        maximumA: next,
        rule: "33 CFR 183.455(c)(2): the next larger rating, within 150 % of the conductor's ampacity (50 V or more)",
      };
    }
    return {
      maximumA: ampacityA,
      rule: "33 CFR 183.455(c)(2): not above the conductor's ampacity (50 V or more)",
    };
  }
  if (NEC_STANDARD_RATINGS_A.includes(ampacityA)) {
    return { maximumA: ampacityA, rule: "NEC 240.4: not above the conductor's ampacity" };
  }
  const next = NEC_STANDARD_RATINGS_A.find((r) => r > ampacityA && r !== 601);
  if (next !== undefined && next <= 800) {
    return {
      maximumA: next,
      rule: 'NEC 240.4(B): the next standard rating (NEC 240.6(A)) above an ampacity that is not one, up to 800 A',
    };
  }
  return { maximumA: ampacityA, rule: "NEC 240.4: not above the conductor's ampacity" };
}

/** Fuse ratings for a continuous current on a conductor of a given (derated) ampacity. */
export function fuseRange(
  continuousCurrentA: number,
  conductorAmpacityA: number,
  options: FuseRangeOptions = {},
): FuseRange {
  const minimumA = continuousCurrentA * CONTINUOUS_LOAD_FACTOR;
  // A conductor thinner than the load's margin is protected by nothing that carries the load.
  const { maximumA, rule } = !carries(conductorAmpacityA, minimumA)
    ? { maximumA: conductorAmpacityA, rule: "not above the conductor's ampacity" }
    : maximumFuseRating(conductorAmpacityA, options.rules ?? 'nec', options.systemVoltage ?? 12);
  const standardRatingsA = COMMON_DC_FUSE_RATINGS_A.filter((r) => r >= minimumA && r <= maximumA);
  const recommendedA = standardRatingsA[0];
  return {
    minimumA,
    maximumA,
    maximumRule: rule,
    standardRatingsA,
    recommendedA,
    recommendedRule:
      recommendedA === undefined ? undefined : recommendedA <= conductorAmpacityA ? WITHIN_AMPACITY : rule,
  };
}
