// What a commissioning test is told about the charger and the wiring, with defaults chosen for a
// person standing beside the installation watching it for about a minute.
import { requireNumberInRange, requireOneOf } from './installer-input-error';
import { AWG_SIZES, AwgSize } from './wire-gauge';

/** What to check a charge source against. */
export interface CommissioningOptions {
  /** The source's rated charge current, A. */
  ratedCurrentA: number;
  /** Allowed deviation of the mean from the rating, % (default 10). */
  tolerancePercent?: number;
  /** Voltage measured at the source's output terminals during bulk, V. */
  sourceOutputVoltage?: number;
  /** Voltage measured at the battery terminals at the same time, V. */
  batteryTerminalVoltage?: number;
  /** Gauge of the charge cable, to estimate its drop when no voltages were measured. */
  gauge?: AwgSize;
  /** One-way length of the charge cable, m. */
  oneWayLengthM?: number;
  /** Key in `reading.sourceCurrents` of the source under test; `reading.current` when absent from a reading. */
  sourceId?: string;
  /** Seconds of steady current needed for a verdict (default 60). */
  measureSeconds?: number;
  /** Seconds the current must already be steady before measuring, to skip the ramp-up (default 10). */
  settleSeconds?: number;
  /** Widest current swing, peak to peak, still counted as steady, % of the rating (default 15). */
  settleBandPercent?: number;
  /** Current below which the source counts as not delivering, % of the rating (default 10). */
  startThresholdPercent?: number;
  /** Longest gap between readings before the steady run restarts, s (default 30). */
  maxGapSeconds?: number;
}

/** Options with every default filled in. */
export type ResolvedCommissioningOptions = Required<
  Omit<
    CommissioningOptions,
    'sourceOutputVoltage' | 'batteryTerminalVoltage' | 'gauge' | 'oneWayLengthM' | 'sourceId'
  >
> &
  Pick<
    CommissioningOptions,
    'sourceOutputVoltage' | 'batteryTerminalVoltage' | 'gauge' | 'oneWayLengthM' | 'sourceId'
  >;

const DEFAULTS = {
  tolerancePercent: 10,
  measureSeconds: 60,
  settleSeconds: 10,
  settleBandPercent: 15,
  startThresholdPercent: 10,
  maxGapSeconds: 30,
};

const positive = (max: number, unit: string) => ({ min: 0, max, exclusiveMin: true, unit });

/** Fills in defaults and validates; throws InstallerInputError naming the first bad field. */
export function resolveCommissioningOptions(options: CommissioningOptions): ResolvedCommissioningOptions {
  const o = { ...DEFAULTS, ...withoutUndefined(options) } as ResolvedCommissioningOptions;
  requireNumberInRange('ratedCurrentA', o.ratedCurrentA, positive(1000, 'A'));
  requireNumberInRange('tolerancePercent', o.tolerancePercent, positive(50, '%'));
  requireNumberInRange('measureSeconds', o.measureSeconds, positive(3600, 's'));
  requireNumberInRange('settleSeconds', o.settleSeconds, { min: 0, max: 600, unit: 's' });
  requireNumberInRange('settleBandPercent', o.settleBandPercent, positive(100, '%'));
  requireNumberInRange('startThresholdPercent', o.startThresholdPercent, positive(100, '%'));
  requireNumberInRange('maxGapSeconds', o.maxGapSeconds, positive(3600, 's'));
  if (o.sourceOutputVoltage !== undefined) {
    requireNumberInRange('sourceOutputVoltage', o.sourceOutputVoltage, positive(70, 'V'));
  }
  if (o.batteryTerminalVoltage !== undefined) {
    requireNumberInRange('batteryTerminalVoltage', o.batteryTerminalVoltage, positive(70, 'V'));
  }
  if (o.gauge !== undefined) requireOneOf('gauge', o.gauge, AWG_SIZES);
  if (o.oneWayLengthM !== undefined)
    requireNumberInRange('oneWayLengthM', o.oneWayLengthM, positive(100, 'm'));
  return o;
}

function withoutUndefined<T extends object>(value: T): Partial<T> {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as Partial<T>;
}
