// Sizes a DC conductor and its fuse from the load, and checks a proposed pair. The fuse protects the wire,
// so it must sit between the load's continuous current (with margin) and what the rules let the wire's
// derated ampacity carry. A recommended conductor always comes with a fuse range that protects it.
import { AMPACITY_SOURCE, conductorAmpacity } from './conductor-ampacity';
import { DeratingFactor, deratingFactors, deratingMultiplier } from './conductor-derating';
import { ConductorConstruction } from './conductor-resistance';
import { minimumGaugeByAmpacity, minimumGaugeByDrop, VoltageDrop, voltageDropFor } from './conductor-sizing';
import { interruptingRatingFinding, prospectiveFaultCurrentA } from './fault-current';
import { fusePlacementFinding } from './fuse-placement';
import { fuseRange, FuseRange, ProtectionRules } from './fuse-ratings';
import { InstallerVerdict, verdictOf } from './installer-finding';
import {
  fuseFindings,
  gaugeFindings,
  minimumSizeFor,
  recommendationFindings,
  sizingFindings,
} from './wire-fuse-findings';
import { resolveWireFuseInput, ResolvedWireFuseInput, WireFuseCheckInput } from './wire-fuse-input';
import { AWG_SIZES, AwgSize } from './wire-gauge';

export type { WireFuseCheckInput } from './wire-fuse-input';

/** Usual cautions shown with every wire and fuse result. */
export const WIRE_AND_FUSE_CAUTIONS: readonly string[] = [
  'Put the fuse as close to the battery as practical: it protects the wire between it and the load, and nothing protects the wire before it.',
  'The fuse protects the wire, not the load: never raise a fuse rating above what the rules let the wire carry.',
  'DC arcs do not self-extinguish like AC arcs: use fuses and switches rated for DC at the system voltage, with an interrupting rating above the bank’s short-circuit current.',
  'Derating covers the ambient, engine space and bundle you enter; a cable against an exhaust or buried in insulation carries less still.',
  'Local codes, the manufacturers’ installation instructions and licensed practice take precedence.',
  'This is guidance, not certification; it monitors and advises and never replaces a BMS or an inspection.',
];

/** Figures of one conductor carrying the load. */
export interface ConductorFigures {
  gauge: AwgSize;
  /** Expected drop at the conductor temperature and construction given. */
  drop: VoltageDrop;
  /** Ampacity after derating, A. */
  ampacityA: number;
  /** Acceptable fuse ratings, with the rule that sets the largest and allows the recommended one. */
  fuse: FuseRange;
}

/** Sizes, the expected drop and fuse range for the checked gauge, the recommendation, and a verdict. */
export interface WireFuseCheckResult {
  /** Thinnest gauge whose drop stays within the allowance; undefined when even 4/0 does not. */
  minimumGaugeByDrop: AwgSize | undefined;
  /** Thinnest gauge whose derated ampacity is at least 125 % of the current; undefined when even 4/0 is not. */
  minimumGaugeByAmpacity: AwgSize | undefined;
  /** Smallest conductor the rules allow (33 CFR 183.425(d)/(e)); undefined under NEC rules. */
  minimumGaugeByRule: AwgSize | undefined;
  /** The recommended conductor: meets every minimum and has a fuse rating that protects it. */
  governingGauge: AwgSize | undefined;
  /** What sets the recommended gauge (`voltage-drop` when several agree). */
  governedBy: 'voltage-drop' | 'ampacity' | 'minimum-size' | 'fuse-rating' | undefined;
  /** The recommended conductor's figures and fuse range (never an empty one). */
  recommendation: ConductorFigures | undefined;
  /** The proposed gauge, else the recommended one. */
  checkedGauge: AwgSize | undefined;
  /** Expected drop on the checked gauge. */
  drop: VoltageDrop | undefined;
  /** Derated ampacity of the checked gauge, A. */
  ampacityA: number | undefined;
  /** Table ampacity of the checked gauge before derating, A. */
  tableAmpacityA: number | undefined;
  /** Acceptable fuse ratings for the checked gauge. */
  fuse: FuseRange | undefined;
  /** Factors that lowered the ampacity. */
  deratings: DeratingFactor[];
  /** Prospective short-circuit current of the bank, A, when a bank is given. */
  faultCurrentA: number | undefined;
  /** The table the ampacity comes from. */
  ampacitySource: string;
  /** Where the resistance comes from, with the conductor temperature and construction used. */
  resistanceSource: string;
  /** The rule set applied. */
  rules: ProtectionRules;
  /** Verdict on the proposed (or recommended) pair. */
  verdict: InstallerVerdict;
}

const RESISTANCE_SOURCES: Record<ConductorConstruction, string> = {
  solid: 'solid copper (ASTM B258 area, IEC 60028 resistivity; NEC Chapter 9 Table 8 solid rows)',
  stranded: 'stranded copper (NEC Chapter 9 Table 8 stranded rows)',
  'fine-stranded': 'fine-stranded copper (NEC Chapter 9 Table 8 stranded rows × IEC 60228 class 5/class 2)',
};

function figuresFor(v: ResolvedWireFuseInput, gauge: AwgSize, derating: number): ConductorFigures {
  const ampacityA = conductorAmpacity(gauge, v.insulationRatingC) * derating;
  return {
    gauge,
    drop: voltageDropFor(
      gauge,
      v.currentA,
      v.oneWayLengthM,
      v.systemVoltage,
      v.conductorTemperatureC,
      v.construction,
    ),
    ampacityA,
    fuse: fuseRange(v.currentA, ampacityA, { rules: v.rules, systemVoltage: v.systemVoltage }),
  };
}

function recommend(
  v: ResolvedWireFuseInput,
  derating: number,
  minimums: { byDrop?: AwgSize; byAmpacity?: AwgSize; byRule?: AwgSize },
): { figures: ConductorFigures; governedBy: WireFuseCheckResult['governedBy'] } | undefined {
  const { byDrop, byAmpacity, byRule } = minimums;
  if (byDrop === undefined || byAmpacity === undefined) return undefined;
  const index = (g: AwgSize | undefined) => (g === undefined ? -1 : AWG_SIZES.indexOf(g));
  const start = Math.max(index(byDrop), index(byAmpacity), index(byRule));
  const governedBy =
    start === index(byDrop) ? 'voltage-drop' : start === index(byAmpacity) ? 'ampacity' : 'minimum-size';
  for (let i = start; i < AWG_SIZES.length; i++) {
    const figures = figuresFor(v, AWG_SIZES[i], derating);
    if (figures.fuse.standardRatingsA.length > 0) {
      return { figures, governedBy: i === start ? governedBy : 'fuse-rating' };
    }
  }
  return undefined;
}

/** Sizes the conductor and fuse for a load and judges the proposed pair; throws InstallerInputError on bad input. */
export function checkWireAndFuse(input: WireFuseCheckInput): WireFuseCheckResult {
  const v = resolveWireFuseInput(input);
  const deratings = deratingFactors(v.insulationRatingC, v);
  const derating = deratingMultiplier(deratings);
  const t = v.conductorTemperatureC;
  const byDrop = minimumGaugeByDrop(
    v.currentA,
    v.oneWayLengthM,
    v.systemVoltage,
    v.allowedDropPercent,
    t,
    v.construction,
  );
  const byAmpacity = minimumGaugeByAmpacity(v.currentA, v.insulationRatingC, derating);
  const byRule = minimumSizeFor(v);
  const recommended = recommend(v, derating, { byDrop, byAmpacity, byRule });
  const checkedGauge = v.proposedGauge ?? recommended?.figures.gauge;
  const checked = checkedGauge === undefined ? undefined : figuresFor(v, checkedGauge, derating);
  const faultCurrentA = v.bank === undefined ? undefined : prospectiveFaultCurrentA(v.bank, v.systemVoltage);
  const findings = [
    ...sizingFindings(v, byDrop, byAmpacity, derating),
    ...recommendationFindings(byDrop, byAmpacity, recommended !== undefined, deratings),
  ];
  if (checked !== undefined) {
    findings.push(
      ...gaugeFindings(v, checked, derating, byRule),
      ...fuseFindings(v.proposedFuseA, checked.fuse, checked.gauge, checked.ampacityA),
    );
  }
  findings.push(fusePlacementFinding(v.fuseDistanceM, v.sheathed));
  const interrupting = interruptingRatingFinding(
    faultCurrentA,
    v.fuseInterruptingRatingA,
    v.bank,
    v.systemVoltage,
  );
  if (interrupting !== undefined) findings.push(interrupting);
  return {
    minimumGaugeByDrop: byDrop,
    minimumGaugeByAmpacity: byAmpacity,
    minimumGaugeByRule: byRule,
    governingGauge: recommended?.figures.gauge,
    governedBy: recommended?.governedBy,
    recommendation: recommended?.figures,
    checkedGauge,
    drop: checked?.drop,
    ampacityA: checked?.ampacityA,
    tableAmpacityA:
      checkedGauge === undefined ? undefined : conductorAmpacity(checkedGauge, v.insulationRatingC),
    fuse: checked?.fuse,
    deratings,
    faultCurrentA,
    ampacitySource: AMPACITY_SOURCE,
    resistanceSource: `${RESISTANCE_SOURCES[v.construction]} at ${t} °C`,
    rules: v.rules,
    verdict: verdictOf(findings),
  };
}
