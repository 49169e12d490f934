// Sizes a DC conductor and its fuse from the load, and checks a proposed pair. The fuse protects the
// wire, so it must sit between the load's continuous current (with margin) and the wire's ampacity.
import {
  AMPACITY_SOURCE,
  conductorAmpacity,
  INSULATION_RATINGS_C,
  InsulationRatingC,
} from './conductor-ampacity';
import { minimumGaugeByAmpacity, minimumGaugeByDrop, VoltageDrop, voltageDropFor } from './conductor-sizing';
import { fuseRange, FuseRange } from './fuse-ratings';
import { InstallerVerdict, verdictOf } from './installer-finding';
import { requireNumberInRange, requireOneOf } from './installer-input-error';
import { fuseFindings, gaugeFindings, sizingFindings } from './wire-fuse-findings';
import { SYSTEM_VOLTAGES, SystemVoltage } from './system-voltage';
import { AWG_SIZES, AwgSize } from './wire-gauge';

/** Usual cautions shown with every wire and fuse result. */
export const WIRE_AND_FUSE_CAUTIONS: readonly string[] = [
  'Put the fuse as close to the battery as practical: it protects the wire between it and the load.',
  'The fuse protects the wire, not the load: never raise a fuse rating above what the wire can carry.',
  'DC arcs do not self-extinguish like AC arcs: use fuses and switches rated for DC at the system voltage.',
  'Cable bundled, in engine spaces or in hot areas carries less current than this table states.',
  'Local codes, the manufacturers’ installation instructions and licensed practice take precedence.',
  'This is guidance, not certification; it monitors and advises and never replaces a BMS or an inspection.',
];

/** What the installer asks about: a load, its run, and optionally the wire and fuse they propose. */
export interface WireFuseCheckInput {
  /** Continuous current of the load or charger, A. */
  currentA: number;
  /** Distance from source to load, one way, m. */
  oneWayLengthM: number;
  /** Nominal system voltage, V. */
  systemVoltage: SystemVoltage;
  /** Allowed voltage drop, % of nominal (3 for critical loads, 10 for others — ABYC E-11). */
  allowedDropPercent: number;
  /** Temperature rating of the conductor's insulation, °C. */
  insulationRatingC: InsulationRatingC;
  /** The conductor the installer proposes. */
  proposedGauge?: AwgSize;
  /** The fuse rating the installer proposes, A. */
  proposedFuseA?: number;
  /** Conductor temperature for resistance, °C (default 20, the IEC 60028 reference). */
  conductorTemperatureC?: number;
}

/** Sizes, the expected drop and fuse range for the checked gauge, and a verdict. */
export interface WireFuseCheckResult {
  /** Thinnest gauge whose drop stays within the allowance; undefined when even 4/0 does not. */
  minimumGaugeByDrop: AwgSize | undefined;
  /** Thinnest gauge whose ampacity is at least 125 % of the current; undefined when even 4/0 does not. */
  minimumGaugeByAmpacity: AwgSize | undefined;
  /** The thicker of the two minimums; undefined when either is. */
  governingGauge: AwgSize | undefined;
  /** Which rule sets the governing gauge (`voltage-drop` when both agree). */
  governedBy: 'voltage-drop' | 'ampacity' | undefined;
  /** The proposed gauge, else the governing one. */
  checkedGauge: AwgSize | undefined;
  /** Expected drop on the checked gauge. */
  drop: VoltageDrop | undefined;
  /** Ampacity of the checked gauge, A. */
  ampacityA: number | undefined;
  /** Acceptable fuse ratings for the checked gauge. */
  fuse: FuseRange | undefined;
  /** The table the ampacity comes from. */
  ampacitySource: string;
  /** Verdict on the proposed (or recommended) pair. */
  verdict: InstallerVerdict;
}

function validate(
  input: WireFuseCheckInput,
): Required<Omit<WireFuseCheckInput, 'proposedGauge' | 'proposedFuseA'>> {
  requireNumberInRange('currentA', input.currentA, { min: 0, max: 1000, exclusiveMin: true, unit: 'A' });
  requireNumberInRange('oneWayLengthM', input.oneWayLengthM, {
    min: 0,
    max: 100,
    exclusiveMin: true,
    unit: 'm',
  });
  requireOneOf('systemVoltage', input.systemVoltage, SYSTEM_VOLTAGES);
  requireNumberInRange('allowedDropPercent', input.allowedDropPercent, {
    min: 0,
    max: 20,
    exclusiveMin: true,
    unit: '%',
  });
  requireOneOf('insulationRatingC', input.insulationRatingC, INSULATION_RATINGS_C);
  if (input.proposedGauge !== undefined) requireOneOf('proposedGauge', input.proposedGauge, AWG_SIZES);
  if (input.proposedFuseA !== undefined) {
    requireNumberInRange('proposedFuseA', input.proposedFuseA, {
      min: 0,
      max: 1000,
      exclusiveMin: true,
      unit: 'A',
    });
  }
  const conductorTemperatureC = input.conductorTemperatureC ?? 20;
  requireNumberInRange('conductorTemperatureC', conductorTemperatureC, { min: -40, max: 105, unit: '°C' });
  return { ...input, conductorTemperatureC };
}

function thicker(a: AwgSize, b: AwgSize): AwgSize {
  return AWG_SIZES.indexOf(a) >= AWG_SIZES.indexOf(b) ? a : b;
}

/** Sizes the conductor and fuse for a load and judges the proposed pair; throws InstallerInputError on bad input. */
export function checkWireAndFuse(input: WireFuseCheckInput): WireFuseCheckResult {
  const v = validate(input);
  const t = v.conductorTemperatureC;
  const byDrop = minimumGaugeByDrop(v.currentA, v.oneWayLengthM, v.systemVoltage, v.allowedDropPercent, t);
  const byAmpacity = minimumGaugeByAmpacity(v.currentA, v.insulationRatingC);
  const governingGauge = byDrop && byAmpacity ? thicker(byDrop, byAmpacity) : undefined;
  const checkedGauge = input.proposedGauge ?? governingGauge;
  const findings = sizingFindings(v, byDrop, byAmpacity);
  let checked: Pick<WireFuseCheckResult, 'drop' | 'ampacityA' | 'fuse'> = {
    drop: undefined,
    ampacityA: undefined,
    fuse: undefined,
  };
  if (checkedGauge !== undefined) {
    const drop = voltageDropFor(checkedGauge, v.currentA, v.oneWayLengthM, v.systemVoltage, t);
    const ampacityA = conductorAmpacity(checkedGauge, v.insulationRatingC);
    const fuse = fuseRange(v.currentA, ampacityA);
    findings.push(
      ...gaugeFindings(v, checkedGauge, drop, ampacityA),
      ...fuseFindings(input.proposedFuseA, fuse, checkedGauge),
    );
    checked = { drop, ampacityA, fuse };
  }
  return {
    minimumGaugeByDrop: byDrop,
    minimumGaugeByAmpacity: byAmpacity,
    governingGauge,
    governedBy:
      governingGauge === undefined ? undefined : governingGauge === byDrop ? 'voltage-drop' : 'ampacity',
    checkedGauge,
    ...checked,
    ampacitySource: AMPACITY_SOURCE,
    verdict: verdictOf(findings),
  };
}
