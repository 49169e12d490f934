// The findings of a wire and fuse check, each quoting the numbers so the installer sees why.
import { CONTINUOUS_LOAD_FACTOR, COMMON_DC_FUSE_RATINGS_A, FuseRange } from './fuse-ratings';
import { InstallerFinding } from './installer-finding';
import { VoltageDrop, voltageDropFor } from './conductor-sizing';
import type { WireFuseCheckInput } from './wire-fuse-check';
import { AwgSize } from './wire-gauge';

/** Errors when no offered gauge meets the allowed drop or carries 125 % of the current. */
export function sizingFindings(
  v: WireFuseCheckInput,
  byDrop?: AwgSize,
  byAmpacity?: AwgSize,
): InstallerFinding[] {
  const findings: InstallerFinding[] = [];
  if (byDrop === undefined) {
    const worst = voltageDropFor(
      '4/0',
      v.currentA,
      v.oneWayLengthM,
      v.systemVoltage,
      v.conductorTemperatureC,
    );
    findings.push({
      severity: 'error',
      code: 'no-gauge-meets-drop',
      message: `even 4/0 AWG loses ${pct(worst.percent)} over ${v.oneWayLengthM} m one way (allowed ${v.allowedDropPercent} %): shorten the run or raise the system voltage`,
    });
  }
  if (byAmpacity === undefined) {
    findings.push({
      severity: 'error',
      code: 'no-gauge-carries-current',
      message: `no offered gauge at ${v.insulationRatingC} °C carries ${amps(v.currentA * CONTINUOUS_LOAD_FACTOR)} (125 % of ${amps(v.currentA)})`,
    });
  }
  return findings;
}

/** Errors when the checked gauge loses too much voltage or is rated below 125 % of the current. */
export function gaugeFindings(
  v: WireFuseCheckInput,
  gauge: AwgSize,
  drop: VoltageDrop,
  ampacityA: number,
): InstallerFinding[] {
  const findings: InstallerFinding[] = [];
  if (drop.percent > v.allowedDropPercent) {
    findings.push({
      severity: 'error',
      code: 'drop-above-allowed',
      message: `${gauge} AWG loses ${drop.volts.toFixed(2)} V (${pct(drop.percent)}) over ${v.oneWayLengthM} m one way; allowed ${v.allowedDropPercent} %`,
    });
  }
  const needed = v.currentA * CONTINUOUS_LOAD_FACTOR;
  if (ampacityA < needed) {
    findings.push({
      severity: 'error',
      code: 'gauge-below-current',
      message: `${gauge} AWG carries ${amps(ampacityA)} at ${v.insulationRatingC} °C; a ${amps(v.currentA)} continuous load needs ${amps(needed)} (125 %)`,
    });
  }
  return findings;
}

/** Findings on the fuse: none fits, the proposed one is too small, too large or an uncommon rating. */
export function fuseFindings(
  proposedFuseA: number | undefined,
  range: FuseRange,
  gauge: AwgSize,
): InstallerFinding[] {
  const findings: InstallerFinding[] = [];
  // An empty range (wire thinner than 125 % of the load) is already a gauge-below-current finding.
  if (range.standardRatingsA.length === 0 && range.minimumA <= range.maximumA) {
    findings.push({
      severity: 'error',
      code: 'no-fuse-fits',
      message: `no common fuse rating lies between ${amps(range.minimumA)} and ${gauge} AWG's ${amps(range.maximumA)}: use a thicker conductor`,
    });
  }
  if (proposedFuseA === undefined) return findings;
  if (proposedFuseA < range.minimumA) {
    findings.push({
      severity: 'error',
      code: 'fuse-below-continuous-margin',
      message: `a ${amps(proposedFuseA)} fuse is below ${amps(range.minimumA)} (125 % of the continuous current) and may open in normal use`,
    });
  }
  if (proposedFuseA > range.maximumA) {
    findings.push({
      severity: 'error',
      code: 'fuse-above-ampacity',
      message: `a ${amps(proposedFuseA)} fuse exceeds ${gauge} AWG's ampacity of ${amps(range.maximumA)}: the wire could overheat before it opens`,
    });
  }
  if (!COMMON_DC_FUSE_RATINGS_A.includes(proposedFuseA)) {
    findings.push({
      severity: 'info',
      code: 'fuse-rating-uncommon',
      message: `${amps(proposedFuseA)} is not a common DC fuse rating; check that the fuse family offers it`,
    });
  }
  return findings;
}

function amps(value: number): string {
  return `${Math.round(value * 10) / 10} A`;
}

function pct(value: number): string {
  return `${value.toFixed(1)} %`;
}
