// Judges a charge source from its steady (bulk) run: is its mean current within tolerance of the
// rating, how steady is it, and how much voltage does its cable lose on the way to the battery.
import type { BatteryReading } from '../telemetry/reading';
import { CommissioningOptions, ResolvedCommissioningOptions } from './commissioning-options';
import {
  CommissioningMeasurement,
  CommissioningState,
  feedCommissioning,
  measuredSeconds,
  startCommissioning,
} from './commissioning-tracker';
import { formatAmount, InstallerFinding, InstallerVerdict, verdictOf } from './installer-finding';
import { populationStandardDeviation } from './running-statistics';
import { circuitVoltageDrop } from './wire-gauge';

/** Cable drop above which a charge circuit deserves a look, % (common practice for charging circuits). */
export const CHARGE_CABLE_DROP_WARNING_PERCENT = 3;

/** Sampled current swing above which the source counts as unsteady, % of its rating (Cellwarden's heuristic). */
export const UNSTEADY_CURRENT_PERCENT = 10;

/** Figures of the measured steady (bulk) run. */
export interface BulkPhase {
  /** First measured reading, ms since the epoch. */
  startedAt: number;
  /** Last measured reading, ms since the epoch. */
  endedAt: number;
  /** Seconds measured. */
  seconds: number;
  /** Readings measured. */
  samples: number;
  /** Mean charge current, A. */
  meanCurrentA: number;
  /** Lowest charge current, A. */
  minCurrentA: number;
  /** Highest charge current, A. */
  maxCurrentA: number;
  /** Peak-to-peak swing between samples, A (slow fluctuation at the reading rate, not switching ripple). */
  ripplePeakToPeakA: number;
  /** Population standard deviation of the samples, A. */
  rippleStandardDeviationA: number;
  /** Highest battery voltage reached, V. */
  batteryVoltageReachedV: number;
  /** Battery voltage at the last measured reading, V. */
  finalBatteryVoltageV: number;
}

/** Voltage lost in the charge cable, measured from two voltages or estimated from gauge and length. */
export interface CableDrop {
  /** Volts lost between the source terminals and the battery terminals. */
  volts: number;
  /** Percent of the source's output voltage. */
  percent: number;
  /** How it was found. */
  method: 'measured' | 'estimated';
}

/** The outcome of a commissioning test. */
export interface CommissioningResult {
  /** The steady run measured (or the longest one cut short); undefined when there was none. */
  bulk: BulkPhase | undefined;
  /** The charge cable's drop, when voltages or gauge and length were given. */
  cableDrop: CableDrop | undefined;
  /** Pass (`ok`) or fail, with reasons. */
  verdict: InstallerVerdict;
}

/** Analyses a window of readings in time order; throws InstallerInputError on bad options or readings. */
export function analyzeCommissioning(
  readings: readonly BatteryReading[],
  options: CommissioningOptions,
): CommissioningResult {
  return commissioningResult(readings.reduce(feedCommissioning, startCommissioning(options)));
}

/** The result of a test as it stands: a verdict once done, otherwise the reason there is none yet. */
export function commissioningResult(state: CommissioningState): CommissioningResult {
  const o = state.options;
  const measurement = state.phase === 'done' ? state.measurement : longest(state);
  const bulk = measurement === undefined ? undefined : bulkPhase(measurement);
  const cableDrop = bulk === undefined ? undefined : cableDropOf(o, bulk);
  const findings: InstallerFinding[] = [];
  if (state.phase !== 'done') findings.push(missingBulkFinding(state, bulk));
  if (bulk !== undefined) {
    if (state.phase === 'done') findings.push(ratingFinding(o, bulk.meanCurrentA));
    if (bulk.ripplePeakToPeakA > (UNSTEADY_CURRENT_PERCENT / 100) * o.ratedCurrentA) {
      findings.push({
        severity: 'warning',
        code: 'current-unsteady',
        message: `the current swung ${formatAmount(bulk.ripplePeakToPeakA)} A peak to peak (σ ${formatAmount(bulk.rippleStandardDeviationA)} A): check connections and the source's input supply`,
      });
    }
  }
  if (cableDrop !== undefined) findings.push(...cableFindings(cableDrop));
  return { bulk, cableDrop, verdict: verdictOf(findings) };
}

function longest(state: CommissioningState): CommissioningMeasurement | undefined {
  return measuredSeconds(state.measurement) >= measuredSeconds(state.longestCutShort)
    ? state.measurement
    : state.longestCutShort;
}

function bulkPhase(m: CommissioningMeasurement): BulkPhase {
  return {
    startedAt: m.startedAt,
    endedAt: m.endedAt,
    seconds: measuredSeconds(m),
    samples: m.current.count,
    meanCurrentA: m.current.mean,
    minCurrentA: m.current.min,
    maxCurrentA: m.current.max,
    ripplePeakToPeakA: m.current.max - m.current.min,
    rippleStandardDeviationA: populationStandardDeviation(m.current),
    batteryVoltageReachedV: m.voltage.max,
    finalBatteryVoltageV: m.finalVoltageV,
  };
}

function missingBulkFinding(state: CommissioningState, bulk: BulkPhase | undefined): InstallerFinding {
  const o = state.options;
  const threshold = (o.startThresholdPercent / 100) * o.ratedCurrentA;
  if (state.peakCurrentA < threshold) {
    const source = o.sourceId === undefined ? '' : ` and that it reports as '${o.sourceId}'`;
    return {
      severity: 'error',
      code: 'no-charge-current',
      message: `no charge current above ${formatAmount(threshold)} A was seen: check the source is running${source}`,
    };
  }
  if (state.phase === 'measuring' && state.measurement !== undefined) {
    return {
      severity: 'error',
      code: 'measurement-incomplete',
      message: `the current was still steady after ${Math.round(measuredSeconds(state.measurement))} s of the ${o.measureSeconds} s needed: keep the source running until the test finishes`,
    };
  }
  const measured =
    bulk === undefined ? '' : ` (steady for only ${Math.round(bulk.seconds)} s of ${o.measureSeconds} s)`;
  return {
    severity: 'error',
    code: 'no-settled-bulk',
    message: `no settled bulk phase found${measured}: the battery may be nearly full — discharge it first`,
  };
}

function ratingFinding(o: ResolvedCommissioningOptions, meanA: number): InstallerFinding {
  const deviation = ((meanA - o.ratedCurrentA) / o.ratedCurrentA) * 100;
  const stated = `mean ${formatAmount(meanA)} A is ${Math.round(Math.abs(deviation))} %`;
  const rating = `the ${formatAmount(o.ratedCurrentA)} A rating (tolerance ${o.tolerancePercent} %)`;
  if (Math.abs(deviation) <= o.tolerancePercent) {
    return { severity: 'info', code: 'within-rating', message: `${stated} from ${rating}` };
  }
  return deviation < 0
    ? { severity: 'error', code: 'below-rating', message: `${stated} below ${rating}` }
    : {
        severity: 'error',
        code: 'above-rating',
        message: `${stated} above ${rating}: check the current-limit setting`,
      };
}

function cableDropOf(o: ResolvedCommissioningOptions, bulk: BulkPhase): CableDrop | undefined {
  if (o.sourceOutputVoltage !== undefined && o.batteryTerminalVoltage !== undefined) {
    const volts = o.sourceOutputVoltage - o.batteryTerminalVoltage;
    return { volts, percent: (volts / o.sourceOutputVoltage) * 100, method: 'measured' };
  }
  if (o.gauge !== undefined && o.oneWayLengthM !== undefined) {
    const volts = circuitVoltageDrop(o.gauge, bulk.meanCurrentA, o.oneWayLengthM);
    // The source sits one drop above the battery it is charging.
    const sourceV = bulk.finalBatteryVoltageV + volts;
    return { volts, percent: (volts / sourceV) * 100, method: 'estimated' };
  }
  return undefined;
}

function cableFindings(drop: CableDrop): InstallerFinding[] {
  if (drop.volts < 0) {
    return [
      {
        severity: 'warning',
        code: 'voltages-inconsistent',
        message: `the battery terminals read ${(-drop.volts).toFixed(2)} V above the source output: re-measure both under charge`,
      },
    ];
  }
  if (drop.percent <= CHARGE_CABLE_DROP_WARNING_PERCENT) return [];
  return [
    {
      severity: 'warning',
      code: 'cable-drop-high',
      message: `the charge cable loses ${drop.volts.toFixed(2)} V (${drop.percent.toFixed(1)} %), more than ${CHARGE_CABLE_DROP_WARNING_PERCENT} %: consider a thicker or shorter cable`,
    },
  ];
}
