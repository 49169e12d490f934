// What the installer tells the wire and fuse check, its defaults, and its validation: one place that says
// what a sensible entry is, so the rules in wire-fuse-check.ts can trust their input.
import { Chemistry } from '../battery/chemistry-profile';
import { INSULATION_RATINGS_C, InsulationRatingC } from './conductor-ampacity';
import { DEFAULT_INSTALLATION, InstallationConditions, validateConditions } from './conductor-derating';
import { CONDUCTOR_CONSTRUCTIONS, ConductorConstruction } from './conductor-resistance';
import type { FaultBank } from './fault-current';
import { PROTECTION_RULES, ProtectionRules } from './fuse-ratings';
import { requireNumberInRange, requireOneOf } from './installer-input-error';
import { SYSTEM_VOLTAGES, SystemVoltage } from './system-voltage';
import { AWG_SIZES, AwgSize } from './wire-gauge';

/** What the installer asks about: a load, its run, where it runs, and optionally the wire and fuse they propose. */
export interface WireFuseCheckInput extends Partial<InstallationConditions> {
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
  /** How the conductor is built (default stranded: what installers use). */
  construction?: ConductorConstruction;
  /** Rules for the largest fuse and the smallest conductor (default marine: 33 CFR 183 / ABYC E-11). */
  rules?: ProtectionRules;
  /** Distance from the battery to the fuse along the conductor, m; unjudged (with a warning) when absent. */
  fuseDistanceM?: number;
  /** Whether the conductor is sheathed or enclosed from the battery to the fuse (default false). */
  sheathed?: boolean;
  /** The bank feeding the circuit, for its short-circuit current. */
  bank?: FaultBank;
  /** DC interrupting rating of the proposed fuse, A. */
  fuseInterruptingRatingA?: number;
}

/** The input with every default filled in. */
export type ResolvedWireFuseInput = Required<
  Omit<
    WireFuseCheckInput,
    'proposedGauge' | 'proposedFuseA' | 'fuseDistanceM' | 'bank' | 'fuseInterruptingRatingA'
  >
> &
  Pick<
    WireFuseCheckInput,
    'proposedGauge' | 'proposedFuseA' | 'fuseDistanceM' | 'bank' | 'fuseInterruptingRatingA'
  >;

/** Defaults the form shows: 20 °C conductor, stranded, marine rules, unsheathed. */
export const WIRE_FUSE_DEFAULTS = {
  conductorTemperatureC: 20,
  construction: 'stranded' as ConductorConstruction,
  rules: 'marine' as ProtectionRules,
  sheathed: false,
  ...DEFAULT_INSTALLATION,
};

const CHEMISTRIES: readonly Chemistry[] = ['lifepo4', 'agm', 'flooded'];
const positiveUpTo = (max: number, unit: string) => ({ min: 0, max, exclusiveMin: true, unit });

/** Fills defaults and throws InstallerInputError naming the first bad field. */
export function resolveWireFuseInput(input: WireFuseCheckInput): ResolvedWireFuseInput {
  requireNumberInRange('currentA', input.currentA, positiveUpTo(1000, 'A'));
  requireNumberInRange('oneWayLengthM', input.oneWayLengthM, positiveUpTo(100, 'm'));
  requireOneOf('systemVoltage', input.systemVoltage, SYSTEM_VOLTAGES);
  requireNumberInRange('allowedDropPercent', input.allowedDropPercent, positiveUpTo(20, '%'));
  requireOneOf('insulationRatingC', input.insulationRatingC, INSULATION_RATINGS_C);
  if (input.proposedGauge !== undefined) requireOneOf('proposedGauge', input.proposedGauge, AWG_SIZES);
  if (input.proposedFuseA !== undefined) {
    requireNumberInRange('proposedFuseA', input.proposedFuseA, positiveUpTo(1000, 'A'));
  }
  const resolved = { ...WIRE_FUSE_DEFAULTS, ...withoutUndefined(input) } as ResolvedWireFuseInput;
  requireNumberInRange('conductorTemperatureC', resolved.conductorTemperatureC, {
    min: -40,
    max: 105,
    unit: '°C',
  });
  requireOneOf('construction', resolved.construction, CONDUCTOR_CONSTRUCTIONS);
  requireOneOf('rules', resolved.rules, PROTECTION_RULES);
  requireOneOf('sheathed', resolved.sheathed, [true, false]);
  validateConditions(resolved);
  if (resolved.fuseDistanceM !== undefined) {
    requireNumberInRange('fuseDistanceM', resolved.fuseDistanceM, { min: 0, max: 100, unit: 'm' });
  }
  if (resolved.bank !== undefined) {
    requireOneOf('bank.chemistry', resolved.bank.chemistry, CHEMISTRIES);
    requireNumberInRange('bank.capacityAh', resolved.bank.capacityAh, positiveUpTo(20000, 'Ah'));
  }
  if (resolved.fuseInterruptingRatingA !== undefined) {
    requireNumberInRange('fuseInterruptingRatingA', resolved.fuseInterruptingRatingA, positiveUpTo(1e6, 'A'));
  }
  return resolved;
}

function withoutUndefined<T extends object>(value: T): Partial<T> {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as Partial<T>;
}
