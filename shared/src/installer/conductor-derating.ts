// What lowers a conductor's ampacity below the 30 °C table: a hot ambient, an engine space and bundling.
// The factors multiply, as NEC 310.15 and the notes of 33 CFR 183.425 Table 5 both apply them.
import { InsulationRatingC } from './conductor-ampacity';
import { InstallerInputError, requireNumberInRange, requireOneOf } from './installer-input-error';

/** Where the conductor runs and with what, as far as its ampacity is concerned. */
export interface InstallationConditions {
  /** Highest air temperature around the conductor, °C (the ampacity table assumes 30). */
  ambientC: number;
  /** Whether it runs through an engine space (33 CFR 183.425(c)). */
  engineSpace: boolean;
  /** Current-carrying conductors in the same bundle, sheath or conduit, this one included. */
  bundledConductors: number;
}

/** Defaults shown on the form: 30 °C outside an engine space, the conductor and its return together. */
export const DEFAULT_INSTALLATION: InstallationConditions = {
  ambientC: 30,
  engineSpace: false,
  bundledConductors: 2,
};

/** Ambient air an engine space is taken to reach, °C (33 CFR 183.425 Table 5 note 1 corrects to 50 °C — secondary: USCG compliance guideline as reprinted in a marine catalogue). */
export const ENGINE_SPACE_AMBIENT_C = 50;

/** One factor applied to the table ampacity, with where it comes from. */
export interface DeratingFactor {
  /** Stable name of the condition. */
  code: 'ambient' | 'engine-space' | 'bundle';
  /** Multiplier applied to the ampacity. */
  factor: number;
  /** The rule it comes from, for display. */
  source: string;
}

/**
 * NEC Table 310.15(B)(1) ambient correction (2014 numbering 310.15(B)(2)(a)), based on 30 °C: the table's rows
 * are computed from NEC Equation 310.15(B), √((Tc − Ta)/(Tc − 30)), at the upper end of each 5 °C row and
 * rounded to two places; the same equation serves the 105 °C rating the NEC table lacks. 0 when the ambient
 * reaches the insulation rating.
 */
export function ambientCorrectionFactor(insulationRatingC: InsulationRatingC, ambientC: number): number {
  // Rows: "10 or less", then 11–15, 16–20, …: a row is named by its upper end.
  const rowTop = Math.max(10, Math.ceil(ambientC / 5) * 5);
  if (rowTop >= insulationRatingC) return 0;
  return Math.round(Math.sqrt((insulationRatingC - rowTop) / (insulationRatingC - 30)) * 100) / 100;
}

/** 33 CFR 183.425 Table 5 note 2 (as ABYC E-11): bundles of 3 → 0.70, 4–6 → 0.60, 7–24 → 0.50, 25+ → 0.40. */
export function bundleFactor(bundledConductors: number): number {
  if (bundledConductors <= 2) return 1;
  if (bundledConductors === 3) return 0.7;
  if (bundledConductors <= 6) return 0.6;
  if (bundledConductors <= 24) return 0.5;
  return 0.4;
}

/** The factors that apply to a conductor, only those below 1 (the check never raises a table ampacity). */
export function deratingFactors(
  insulationRatingC: InsulationRatingC,
  conditions: InstallationConditions,
): DeratingFactor[] {
  const factors: DeratingFactor[] = [];
  const ambient = ambientCorrectionFactor(insulationRatingC, conditions.ambientC);
  const engine = conditions.engineSpace
    ? ambientCorrectionFactor(insulationRatingC, ENGINE_SPACE_AMBIENT_C)
    : 1;
  // An engine space already assumes 50 °C: a hotter ambient there replaces it rather than adding to it.
  if (conditions.engineSpace && engine <= ambient) {
    factors.push({
      code: 'engine-space',
      factor: engine,
      source: '33 CFR 183.425(c), Table 5 note 1 (engine spaces, 50 °C)',
    });
  } else if (ambient < 1) {
    factors.push({
      code: 'ambient',
      factor: ambient,
      source: `NEC 310.15(B) ambient correction at ${conditions.ambientC} °C`,
    });
  }
  const bundle = bundleFactor(conditions.bundledConductors);
  if (bundle < 1) {
    factors.push({
      code: 'bundle',
      factor: bundle,
      source: `33 CFR 183.425 Table 5 note 2 (as ABYC E-11): ${conditions.bundledConductors} conductors bundled`,
    });
  }
  return factors;
}

/** The product of the factors (1 when none applies). */
export function deratingMultiplier(factors: readonly DeratingFactor[]): number {
  return factors.reduce((product, f) => product * f.factor, 1);
}

/** Throws InstallerInputError naming the bad condition. */
export function validateConditions(conditions: InstallationConditions): void {
  requireNumberInRange('ambientC', conditions.ambientC, { min: -40, max: 100, unit: '°C' });
  requireOneOf('engineSpace', conditions.engineSpace, [true, false]);
  requireNumberInRange('bundledConductors', conditions.bundledConductors, { min: 1, max: 100 });
  if (!Number.isInteger(conditions.bundledConductors)) {
    throw new InstallerInputError(
      'installer-input-not-allowed',
      'bundledConductors',
      `bundledConductors must be a whole number of conductors; got ${conditions.bundledConductors}`,
    );
  }
}
