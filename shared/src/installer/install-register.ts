// The install register's circuits judged by the same wire & fuse rules as the one-off check, its components
// turned into an energy budget, and the ratings other checks take from it. Pure: the server stores, this judges.
import type {
  CircuitVerdict,
  CircuitWiring,
  ComponentRatings,
  RegisterComponent,
} from '../api/install-register-contract';
import { AMPACITY_SOURCE } from './conductor-ampacity';
import type { BudgetLoad, BudgetSource, EnergyBudgetInput } from './energy-budget-input';
import { inverterDcCurrent } from './budget-circuits';
import { FUSE_PLACEMENT_RULE } from './fuse-placement';
import type { FuseRange } from './fuse-ratings';
import type { InstallerFinding } from './installer-finding';
import { InstallerInputError } from './installer-input-error';
import type { SystemVoltage } from './system-voltage';
import { checkWireAndFuse } from './wire-fuse-check';
import { AWG_SIZES, AwgSize, awgAreaMm2 } from './wire-gauge';

/** The system a register belongs to, as far as the rules care. */
export interface RegisterSystem {
  kind: 'van' | 'cabin' | 'boat';
  nominalVoltage: SystemVoltage;
}

/**
 * The AWG size a conductor is checked as: its own, or for a metric size the largest AWG whose area is no
 * larger (so the table's ampacity is never credited to more copper than is there); undefined below 18 AWG.
 */
export function checkedAwgOf(conductor: CircuitWiring['conductor']): AwgSize | undefined {
  if (conductor.awg !== undefined) return AWG_SIZES.find((size) => size === conductor.awg);
  // 0.1 % allowance: a nominal size equal to an AWG area up to rounding (none of IEC 60228's sizes is).
  const fitting = AWG_SIZES.filter((size) => awgAreaMm2(size) <= conductor.mm2 * 1.001);
  return fitting[fitting.length - 1];
}

/** The continuous current a component draws or delivers at the class voltage, A (the budget's convention). */
export function componentCurrentA(ratings: ComponentRatings, nominalVoltage: number): number {
  switch (ratings.kind) {
    case 'battery':
      return ratings.bmsContinuousA;
    case 'charge-source':
      return ratings.ratedCurrentA;
    case 'inverter':
      return inverterDcCurrent(ratings.continuousW, nominalVoltage, ratings.efficiency);
    default:
      if (ratings.amps !== undefined) return ratings.amps;
      return ratings.ac ? 0 : (ratings.watts ?? 0) / nominalVoltage;
  }
}

const CONTINUOUS_RULE =
  'NEC 210.19(A)(1) and 210.20(A): conductor and fuse at least 125 % of the continuous current';
const DROP_RULE = 'ABYC E-11 voltage drop: 3 % for critical loads and charging, 10 % for others';
const MINIMUM_SIZE_RULE = '33 CFR 183.425(d), (e): 16 AWG, or 18 AWG within a sheath';
const INTERRUPTING_RULE =
  "common practice: a fuse's interrupting rating above the bank's short-circuit current";

/** The published rule behind one finding of the wire & fuse check. */
export function ruleOfFinding(code: string, fuse: FuseRange | undefined): string {
  if (code.startsWith('fuse-placement') || code === 'fuse-too-far' || code === 'fuse-distance-not-given')
    return FUSE_PLACEMENT_RULE;
  if (code === 'fuse-above-ampacity' || code === 'fuse-above-ampacity-allowed' || code === 'no-fuse-fits')
    return fuse?.maximumRule ?? 'NEC 240.4; 33 CFR 183.455(c)';
  if (code === 'fuse-below-continuous-margin') return CONTINUOUS_RULE;
  if (code === 'gauge-below-current' || code === 'no-gauge-carries-current' || code === 'ampacity-derated')
    return `${AMPACITY_SOURCE}; ${CONTINUOUS_RULE}`;
  if (code === 'drop-above-allowed' || code === 'no-gauge-meets-drop') return DROP_RULE;
  if (code === 'below-minimum-size') return MINIMUM_SIZE_RULE;
  if (code.includes('interrupting')) return INTERRUPTING_RULE;
  return 'common practice';
}

/** Judges one registered circuit with the wire & fuse rules (marine for vans and boats, NEC for cabins). */
export function judgeCircuit(
  wiring: CircuitWiring,
  component: RegisterComponent | undefined,
  system: RegisterSystem,
): CircuitVerdict {
  const awg = checkedAwgOf(wiring.conductor);
  const currentA =
    wiring.designCurrentA ?? (component ? componentCurrentA(component.ratings, system.nominalVoltage) : 0);
  const base = { checkedAwg: awg ?? null, currentA, ampacityA: null, maximumFuseA: null };
  if (awg === undefined)
    return refusal(base, 'conductor-below-smallest', 'the conductor is thinner than 18 AWG (0.82 mm²)');
  if (!(currentA > 0))
    return refusal(
      base,
      'no-design-current',
      'no continuous current: enter the design current or the component’s rating',
    );
  let result: ReturnType<typeof checkWireAndFuse>;
  try {
    result = checkWireAndFuse({
      currentA,
      oneWayLengthM: wiring.oneWayLengthM,
      systemVoltage: system.nominalVoltage,
      allowedDropPercent: wiring.allowedDropPercent,
      insulationRatingC: wiring.insulationRatingC,
      proposedGauge: awg,
      proposedFuseA: wiring.protection.ratingA,
      construction: wiring.construction,
      rules: system.kind === 'cabin' ? 'nec' : 'marine',
      ambientC: wiring.ambientC,
      engineSpace: wiring.location === 'engine-space',
      bundledConductors: wiring.bundledConductors,
      fuseDistanceM: wiring.fuseDistanceM ?? undefined,
      sheathed: wiring.sheathed,
    });
  } catch (error) {
    // A stored circuit the rules cannot judge (a 20 kW inverter at 12 V is past the tables) gets a verdict
    // saying why, so one circuit never keeps the rest of the register from showing.
    if (error instanceof InstallerInputError) return refusal(base, 'outside-the-rules', error.message);
    throw error;
  }
  const findings = result.verdict.findings.map((f) => ({ ...f, rule: ruleOfFinding(f.code, result.fuse) }));
  const deciding = findings.find((f) => f.severity === 'error');
  return {
    ok: result.verdict.ok,
    summary:
      deciding?.message ??
      `${awg} AWG carries ${Math.round(result.ampacityA ?? 0)} A derated; a ${wiring.protection.ratingA} A ${wiring.protection.device} is within ${Math.round(result.fuse?.minimumA ?? 0)}–${Math.round(result.fuse?.maximumA ?? 0)} A`,
    rule: deciding?.rule ?? `${AMPACITY_SOURCE}; ${result.fuse?.maximumRule ?? ''}; ${FUSE_PLACEMENT_RULE}`,
    checkedAwg: awg,
    currentA,
    ampacityA: result.ampacityA ?? null,
    maximumFuseA: result.fuse?.maximumA ?? null,
    findings,
  };
}

function refusal(
  base: Pick<CircuitVerdict, 'checkedAwg' | 'currentA' | 'ampacityA' | 'maximumFuseA'>,
  code: string,
  message: string,
): CircuitVerdict {
  const finding: InstallerFinding & { rule: string } = {
    severity: 'error',
    code,
    message,
    rule: code === 'conductor-below-smallest' ? MINIMUM_SIZE_RULE : CONTINUOUS_RULE,
  };
  return { ...base, ok: false, summary: message, rule: finding.rule, findings: [finding] };
}

/** An energy budget from the register's components; undefined until a battery is registered. */
export function registerBudgetInput(
  components: readonly RegisterComponent[],
  nominalVoltage: SystemVoltage,
): EnergyBudgetInput | undefined {
  const battery = components.find((c) => c.ratings.kind === 'battery')?.ratings;
  if (battery?.kind !== 'battery') return undefined;
  const inverter = components.find((c) => c.ratings.kind === 'inverter')?.ratings;
  const loads: BudgetLoad[] = [];
  const sources: BudgetSource[] = [];
  for (const { name, ratings } of components) {
    if (ratings.kind === 'heater' || ratings.kind === 'fridge' || ratings.kind === 'load') {
      const common = { name, hoursPerDay: ratings.hoursPerDay, dutyCycle: ratings.dutyCycle, ac: ratings.ac };
      loads.push(
        ratings.amps !== undefined && !ratings.ac
          ? { ...common, amps: ratings.amps }
          : { ...common, watts: ratings.watts ?? 0 },
      );
    } else if (ratings.kind === 'charge-source') {
      if (ratings.sourceKind === 'solar')
        sources.push({ kind: 'solar', watts: ratings.panelWatts ?? 0, peakSunHours: ratings.hoursPerDay });
      else
        sources.push({
          kind: ratings.sourceKind === 'shore' ? 'shore' : 'dc-dc',
          amps: ratings.ratedCurrentA,
          hoursPerDay: ratings.hoursPerDay,
        });
    }
  }
  return {
    loads,
    sources,
    system: {
      nominalVoltage,
      chemistry: battery.chemistry,
      batteryCapacityAh: battery.capacityAh,
      bmsContinuousA: battery.bmsContinuousA,
      bmsPeakA: battery.bmsPeakA,
      // LiFePO4 ~0.9, lead-acid 0.5 of rated capacity (common practice, as the budget form's defaults).
      usableFraction: battery.chemistry === 'lifepo4' ? 0.9 : 0.5,
      daysOfAutonomy: 2,
      inverterRatedW: inverter?.kind === 'inverter' ? inverter.continuousW : 0,
      inverterEfficiency: inverter?.kind === 'inverter' ? inverter.efficiency : 0.9,
      inverterSurgeW: inverter?.kind === 'inverter' ? inverter.surgeW : undefined,
      inverterStandbyW: inverter?.kind === 'inverter' ? inverter.standbyW : undefined,
    },
  };
}

/** The rated current the register gives a monitored charge source, for a commissioning check. */
export function registeredSourceRatingA(
  components: readonly RegisterComponent[],
  monitorSourceId: string,
): number | undefined {
  for (const { ratings } of components)
    if (ratings.kind === 'charge-source' && ratings.monitorSourceId === monitorSourceId)
      return ratings.ratedCurrentA;
  return undefined;
}
