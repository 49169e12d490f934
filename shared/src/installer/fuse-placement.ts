// Where the fuse sits: the conductor between the battery and the fuse has no protection at all, so the
// published rule keeps that stretch short. 33 CFR 183.455(b): at the source of power; if impractical,
// within 7 in measured along the conductor; if that too is impractical, within 40 in when the conductor is
// contained throughout that distance in a sheath or enclosure. ABYC E-11 gives the same 7 in and 40 in and,
// from memory, up to 72 in for a sheathed conductor fixed directly to the battery terminal; Cellwarden
// applies the 33 CFR figures, on land too (common practice: no NEC rule fits a battery's own feeder better).
import { InstallerFinding } from './installer-finding';

/** 7 in, m (33 CFR 183.455(b)(1)). */
export const UNSHEATHED_FUSE_DISTANCE_M = 7 * 0.0254;

/** 40 in, m (33 CFR 183.455(b)(2)). */
export const SHEATHED_FUSE_DISTANCE_M = 40 * 0.0254;

/** The distance rule, for display beside the result. */
export const FUSE_PLACEMENT_RULE =
  '33 CFR 183.455(b): at the battery; within 7 in (178 mm) along the conductor if that is impractical; within 40 in (1.02 m) if the conductor is sheathed or enclosed all the way';

// Entered distances are decimals of a metre; 7 in is 0.1778 m exactly, which binary floating point misses by 1e-17.
const TOLERANCE_M = 1e-9;

/** One finding on the fuse's distance from the battery along the conductor. */
export function fusePlacementFinding(distanceM: number | undefined, sheathed: boolean): InstallerFinding {
  if (distanceM === undefined) {
    return {
      severity: 'warning',
      code: 'fuse-distance-not-given',
      message:
        "enter the fuse's distance from the battery along the conductor: 33 CFR 183.455(b) wants it at the battery, within 178 mm (7 in), or within 1.02 m (40 in) when the conductor is sheathed",
    };
  }
  const at = `${formatMetres(distanceM)} from the battery`;
  if (distanceM === 0) {
    return {
      severity: 'info',
      code: 'fuse-placement-ok',
      message: `fuse at the battery (33 CFR 183.455(b))`,
    };
  }
  if (distanceM <= UNSHEATHED_FUSE_DISTANCE_M + TOLERANCE_M) {
    return {
      severity: 'info',
      code: 'fuse-placement-ok',
      message: `fuse ${at}, within 178 mm (7 in) (33 CFR 183.455(b)(1))`,
    };
  }
  if (distanceM <= SHEATHED_FUSE_DISTANCE_M + TOLERANCE_M && sheathed) {
    return {
      severity: 'info',
      code: 'fuse-placement-ok',
      message: `fuse ${at}, within 1.02 m (40 in) on a conductor sheathed all the way (33 CFR 183.455(b)(2))`,
    };
  }
  const limit = sheathed
    ? '1.02 m (40 in) even when sheathed'
    : '178 mm (7 in), or 1.02 m (40 in) only if the conductor is sheathed or enclosed all the way';
  return {
    severity: 'error',
    code: 'fuse-too-far',
    message: `a fuse ${at} leaves that conductor unprotected; 33 CFR 183.455(b) allows at most ${limit}: move the fuse toward the battery`,
  };
}

function formatMetres(metres: number): string {
  return metres < 1 ? `${Math.round(metres * 1000)} mm` : `${Math.round(metres * 100) / 100} m`;
}
