// The findings of a wire and fuse check, each quoting the numbers and the rule so the installer sees why.
import type { DeratingFactor } from './conductor-derating';
import { carries, CONTINUOUS_LOAD_FACTOR, COMMON_DC_FUSE_RATINGS_A, FuseRange } from './fuse-ratings';
import { formatAmount, InstallerFinding } from './installer-finding';
import { VoltageDrop, voltageDropFor } from './conductor-sizing';
import type { ResolvedWireFuseInput } from './wire-fuse-input';
import { AWG_SIZES, AwgSize } from './wire-gauge';

/**
 * Smallest conductor the rules allow: 16 AWG installed separately, 18 AWG within a multiconductor sheath
 * (33 CFR 183.425(e) and (d)); none under NEC rules, which leave low-voltage DC wiring to the equipment.
 */
export function minimumSizeFor(v: Pick<ResolvedWireFuseInput, 'rules' | 'sheathed'>): AwgSize | undefined {
  if (v.rules !== 'marine') return undefined;
  return v.sheathed ? '18' : '16';
}

/** Errors when no offered gauge meets the allowed drop or carries 125 % of the current after derating. */
export function sizingFindings(
  v: ResolvedWireFuseInput,
  byDrop: AwgSize | undefined,
  byAmpacity: AwgSize | undefined,
  derating: number,
): InstallerFinding[] {
  const findings: InstallerFinding[] = [];
  if (byDrop === undefined) {
    const worst = voltageDropFor(
      '4/0',
      v.currentA,
      v.oneWayLengthM,
      v.systemVoltage,
      v.conductorTemperatureC,
      v.construction,
    );
    findings.push({
      severity: 'error',
      code: 'no-gauge-meets-drop',
      message: `even 4/0 AWG loses ${pct(worst.percent)} over ${v.oneWayLengthM} m one way (allowed ${v.allowedDropPercent} %): shorten the run or raise the system voltage`,
    });
  }
  if (byAmpacity === undefined) {
    const derated = derating < 1 ? ` after derating to ${pct(derating * 100)}` : '';
    findings.push({
      severity: 'error',
      code: 'no-gauge-carries-current',
      message: `no offered gauge at ${v.insulationRatingC} °C carries ${amps(v.currentA * CONTINUOUS_LOAD_FACTOR)} (125 % of ${amps(v.currentA)})${derated}`,
    });
  }
  return findings;
}

/** Notes how the ampacity was derated, and an error when the minimums hold but no gauge finds a fuse. */
export function recommendationFindings(
  byDrop: AwgSize | undefined,
  byAmpacity: AwgSize | undefined,
  recommended: boolean,
  deratings: readonly DeratingFactor[],
): InstallerFinding[] {
  const findings: InstallerFinding[] = [];
  if (deratings.length > 0) {
    findings.push({
      severity: 'info',
      code: 'ampacity-derated',
      message: `ampacity derated: ${deratings.map((d) => `× ${d.factor.toFixed(2)} (${d.source})`).join('; ')}`,
    });
  }
  if (byDrop !== undefined && byAmpacity !== undefined && !recommended) {
    findings.push({
      severity: 'error',
      code: 'no-gauge-with-fuse',
      message:
        'no offered gauge up to 4/0 AWG has a common fuse rating that both carries the load and protects it',
    });
  }
  return findings;
}

/** Errors when the checked gauge loses too much voltage, is rated below 125 % of the current, or is too small. */
export function gaugeFindings(
  v: ResolvedWireFuseInput,
  checked: { gauge: AwgSize; drop: VoltageDrop; ampacityA: number },
  derating: number,
  minimumByRule: AwgSize | undefined,
): InstallerFinding[] {
  const { gauge, drop, ampacityA } = checked;
  const findings: InstallerFinding[] = [];
  if (drop.percent > v.allowedDropPercent) {
    findings.push({
      severity: 'error',
      code: 'drop-above-allowed',
      message: `${gauge} AWG loses ${drop.volts.toFixed(2)} V (${pct(drop.percent)}) over ${v.oneWayLengthM} m one way; allowed ${v.allowedDropPercent} %`,
    });
  }
  const needed = v.currentA * CONTINUOUS_LOAD_FACTOR;
  if (!carries(ampacityA, needed)) {
    const derated = derating < 1 ? ' after derating' : '';
    findings.push({
      severity: 'error',
      code: 'gauge-below-current',
      message: `${gauge} AWG carries ${amps(ampacityA)} at ${v.insulationRatingC} °C${derated}; a ${amps(v.currentA)} continuous load needs ${amps(needed)} (125 %)`,
    });
  }
  if (minimumByRule !== undefined && AWG_SIZES.indexOf(gauge) < AWG_SIZES.indexOf(minimumByRule)) {
    findings.push({
      severity: 'error',
      code: 'below-minimum-size',
      message: `${gauge} AWG is below the smallest conductor allowed: 16 AWG installed separately, 18 AWG only within a multiconductor sheath (33 CFR 183.425(d), (e))`,
    });
  }
  return findings;
}

/** Findings on the fuse: none fits, the proposed one is too small, too large, allowed above the ampacity, or uncommon. */
export function fuseFindings(
  proposedFuseA: number | undefined,
  range: FuseRange,
  gauge: AwgSize,
  ampacityA: number,
): InstallerFinding[] {
  const findings: InstallerFinding[] = [];
  // An empty range (wire thinner than 125 % of the load) is already a gauge-below-current finding.
  if (range.standardRatingsA.length === 0 && range.minimumA <= range.maximumA) {
    findings.push({
      severity: 'error',
      code: 'no-fuse-fits',
      message: `no common fuse rating lies between ${amps(range.minimumA)} and ${amps(range.maximumA)} (${range.maximumRule}) for ${gauge} AWG: use a thicker conductor`,
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
      message: `a ${amps(proposedFuseA)} fuse exceeds the ${amps(range.maximumA)} allowed on ${gauge} AWG (ampacity ${amps(ampacityA)}; ${range.maximumRule}): the wire could overheat before it opens`,
    });
  } else if (proposedFuseA > ampacityA) {
    findings.push({
      severity: 'info',
      code: 'fuse-above-ampacity-allowed',
      message: `a ${amps(proposedFuseA)} fuse is above ${gauge} AWG's ampacity of ${amps(ampacityA)} but allowed: ${range.maximumRule}`,
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
  return `${formatAmount(value)} A`;
}

function pct(value: number): string {
  return `${value.toFixed(1)} %`;
}
