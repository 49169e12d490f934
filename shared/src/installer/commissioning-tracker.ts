// Follows a charge source reading by reading: waits for current, lets the ramp-up pass, then measures a
// steady (bulk) run. Each step is pure and O(1), so the server can keep one state per test in memory.
import type { BatteryReading } from '../telemetry/reading';
import {
  CommissioningOptions,
  ResolvedCommissioningOptions,
  resolveCommissioningOptions,
} from './commissioning-options';
import { InstallerInputError } from './installer-input-error';
import { addSample, EMPTY_STATISTICS, RunningStatistics } from './running-statistics';

/** Where a commissioning test stands. */
export type CommissioningPhase = 'waiting-for-current' | 'settling' | 'measuring' | 'done';

/** What to show while a test runs. */
export interface CommissioningProgress {
  /** The current phase. */
  phase: CommissioningPhase;
  /** Seconds of steady current measured so far. */
  secondsMeasured: number;
  /** Seconds needed for a verdict. */
  secondsNeeded: number;
}

/** A steady run being measured: charge current and battery voltage statistics. */
export interface CommissioningMeasurement {
  /** First measured reading, ms since the epoch. */
  readonly startedAt: number;
  /** Last measured reading, ms since the epoch. */
  readonly endedAt: number;
  /** Charge current of the source, A. */
  readonly current: RunningStatistics;
  /** Battery voltage, V. */
  readonly voltage: RunningStatistics;
  /** Battery voltage at the last measured reading, V. */
  readonly finalVoltageV: number;
}

/** Everything the tracker remembers; treat as opaque and pass back to `feedCommissioning`. */
export interface CommissioningState {
  readonly options: ResolvedCommissioningOptions;
  readonly phase: CommissioningPhase;
  readonly lastAt: number | undefined;
  /** Candidate steady run: when it began and the current's range within it. */
  readonly run: { readonly startedAt: number; readonly minA: number; readonly maxA: number } | undefined;
  readonly measurement: CommissioningMeasurement | undefined;
  /** The longest measurement cut short, kept to explain a failed test. */
  readonly longestCutShort: CommissioningMeasurement | undefined;
  readonly peakCurrentA: number;
}

/** A fresh test; throws InstallerInputError naming a bad option. */
export function startCommissioning(options: CommissioningOptions): CommissioningState {
  return {
    options: resolveCommissioningOptions(options),
    phase: 'waiting-for-current',
    lastAt: undefined,
    run: undefined,
    measurement: undefined,
    longestCutShort: undefined,
    peakCurrentA: 0,
  };
}

/** The source's current in a reading: its `sourceCurrents` entry when present, else the pack current. */
export function sourceCurrent(reading: BatteryReading, sourceId: string | undefined): number {
  const own = sourceId === undefined ? undefined : reading.sourceCurrents?.[sourceId];
  return own ?? reading.current;
}

/** Seconds measured so far, for a measurement (0 when none). */
export function measuredSeconds(measurement: CommissioningMeasurement | undefined): number {
  return measurement === undefined ? 0 : (measurement.endedAt - measurement.startedAt) / 1000;
}

/** Progress of a test, for display. */
export function commissioningProgress(state: CommissioningState): CommissioningProgress {
  return {
    phase: state.phase,
    secondsMeasured: measuredSeconds(state.measurement),
    secondsNeeded: state.options.measureSeconds,
  };
}

/** The state after one more reading (readings in time order); a finished test ignores further readings. */
export function feedCommissioning(state: CommissioningState, reading: BatteryReading): CommissioningState {
  if (state.phase === 'done') return state;
  const currentA = checkedReading(state, reading);
  const o = state.options;
  const gap = state.lastAt !== undefined && reading.measuredAt - state.lastAt > o.maxGapSeconds * 1000;
  const base = { ...(gap ? interrupted(state) : state), lastAt: reading.measuredAt };
  const next = { ...base, peakCurrentA: Math.max(base.peakCurrentA, currentA) };
  if (currentA < (o.startThresholdPercent / 100) * o.ratedCurrentA) {
    return { ...interrupted(next), phase: 'waiting-for-current' };
  }
  const run = next.run;
  const minA = Math.min(run?.minA ?? currentA, currentA);
  const maxA = Math.max(run?.maxA ?? currentA, currentA);
  if (run === undefined || maxA - minA > (o.settleBandPercent / 100) * o.ratedCurrentA) {
    // Still ramping (or the level moved): a new candidate run starts at this reading.
    const restarted = run === undefined ? next : interrupted(next);
    return {
      ...restarted,
      phase: 'settling',
      run: { startedAt: reading.measuredAt, minA: currentA, maxA: currentA },
    };
  }
  const steady = { ...next, run: { ...run, minA, maxA } };
  if (steady.phase === 'settling' && reading.measuredAt - run.startedAt < o.settleSeconds * 1000)
    return steady;
  const measurement = measure(steady.measurement, reading, currentA);
  const done = measuredSeconds(measurement) >= o.measureSeconds;
  return { ...steady, measurement, phase: done ? 'done' : 'measuring' };
}

function checkedReading(state: CommissioningState, reading: BatteryReading): number {
  if (
    !Number.isFinite(reading.measuredAt) ||
    (state.lastAt !== undefined && reading.measuredAt < state.lastAt)
  ) {
    throw new InstallerInputError(
      'installer-input-out-of-range',
      'measuredAt',
      `measuredAt must be a time no earlier than the previous reading's; got ${reading.measuredAt}`,
    );
  }
  const currentA = sourceCurrent(reading, state.options.sourceId);
  if (!Number.isFinite(currentA) || !Number.isFinite(reading.voltage)) {
    const field = Number.isFinite(reading.voltage) ? 'current' : 'voltage';
    throw new InstallerInputError('installer-input-not-finite', field, `${field} must be a finite number`);
  }
  return currentA;
}

// Drops the candidate run and any measurement, keeping the longest cut-short measurement for the report.
function interrupted(state: CommissioningState): CommissioningState {
  const keep =
    measuredSeconds(state.measurement) > measuredSeconds(state.longestCutShort)
      ? state.measurement
      : state.longestCutShort;
  return { ...state, run: undefined, measurement: undefined, longestCutShort: keep };
}

function measure(
  measurement: CommissioningMeasurement | undefined,
  reading: BatteryReading,
  currentA: number,
): CommissioningMeasurement {
  return {
    startedAt: measurement?.startedAt ?? reading.measuredAt,
    endedAt: reading.measuredAt,
    current: addSample(measurement?.current ?? EMPTY_STATISTICS, currentA),
    voltage: addSample(measurement?.voltage ?? EMPTY_STATISTICS, reading.voltage),
    finalVoltageV: reading.voltage,
  };
}
