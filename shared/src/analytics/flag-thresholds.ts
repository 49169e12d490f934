// Per-system flag thresholds with chemistry defaults. Every start threshold has a release threshold a
// little on the safe side of it (hysteresis), and every flag a minimum duration before it starts, so a
// value dithering at a limit or a one-reading spike does not flood the owner with notifications.
import { CHEMISTRY_PROFILES, Chemistry } from '../battery/chemistry-profile';
import { AnalyticsSettingError } from './analytics-error';
import { FlagKind } from './flag-event';

/** Every number the flag rules compare against. Voltages are for the whole bank. */
export interface FlagThresholds {
  lowChargeWarningPercent: number;
  lowChargeCriticalPercent: number;
  /** Percentage points above the warning level the charge must regain to end the flag. */
  lowChargeReleasePoints: number;
  lowVoltageWarningV: number;
  lowVoltageCriticalV: number;
  /** Volts above the warning level the load-compensated voltage must regain to end the flag. */
  lowVoltageReleaseV: number;
  /** Below this pack temperature charging harms the cells, °C. */
  minimumChargeTemperatureC: number;
  /** Charge current above which the pack counts as being charged, A. */
  chargeFlowingA: number;
  /** Above this pack temperature charging should stop, °C; undefined when the chemistry sets none. */
  maximumChargeTemperatureC?: number;
  /** Below this pack temperature (and above the minimum) the charge current should be reduced, °C. */
  reducedChargeBelowC?: number;
  /** The reduced charge current allowed there, A. */
  reducedChargeCurrentA?: number;
  /** Start cold-charge-ahead when the limit is projected within this many minutes. */
  coldChargeAheadMinutes: number;
  overTemperatureWarningC: number;
  overTemperatureCriticalC: number;
  /** Degrees below the warning level the pack must cool to end the flag. */
  overTemperatureReleaseC: number;
  /** The BMS's continuous discharge rating, A; 1.5× this is critical. */
  bmsContinuousCurrentA: number;
  /** Discharge current that counts as real demand (for BMS cut-off detection), A. */
  demandCurrentA: number;
  /** Minutes without a reading before the device counts as silent. */
  silentAfterMinutes: number;
  /** Fraction of a source's rating below which it under-delivers during bulk. */
  underDeliveryFraction: number;
  /** Percentage points between reported and estimated SoC that start a disagreement flag. */
  socDisagreementPoints: number;
  /** Seconds a condition must hold before its flag starts. */
  minimumDurationSeconds: Record<FlagKind, number>;
  /** How long an active flag's condition must stay clear before the flag ends, per kind, seconds. */
  releaseDelaySeconds?: Partial<Record<FlagKind, number>>;
}

/** Owner overrides: any threshold, and any subset of the minimum durations. */
export type FlagThresholdOverrides = Partial<Omit<FlagThresholds, 'minimumDurationSeconds'>> & {
  minimumDurationSeconds?: Partial<Record<FlagKind, number>>;
};

const MINIMUM_DURATION_SECONDS: Record<FlagKind, number> = {
  'low-charge': 60,
  // Inverter and compressor start-up sags last seconds; compensation removes most of the rest.
  'low-voltage': 30,
  'cold-charging': 30,
  'cold-charge-ahead': 120,
  'hot-charging': 60,
  // A DC-DC charger ramps up for a minute or so; a cold pack warming from its own charge ends it soon enough.
  'cold-charge-current': 120,
  'over-temperature': 60,
  'over-discharge': 10,
  'bms-cutoff-suspected': 0,
  'device-silent': 0,
  // Chargers ramp up over minutes and DC-DC units derate when hot: only a sustained shortfall counts.
  'charger-under-delivering': 600,
  'soc-disagreement': 600,
  // Judged by the install register over a window of readings (server/src/install-register), not per reading.
  'circuit-near-rating': 0,
};

// Conditions that lapse briefly in normal use (a load switching on, a cloud) must stay clear this long before
// their flag ends, so one episode is one alert, not dozens (common practice for alarm deadbands).
const RELEASE_DELAY_SECONDS: Partial<Record<FlagKind, number>> = {
  'cold-charging': 900,
  'cold-charge-ahead': 300,
  'hot-charging': 300,
  'cold-charge-current': 300,
  'charger-under-delivering': 300,
  'low-voltage': 120,
  'over-discharge': 60,
};

/** Chemistry defaults for a bank; `ratedCapacityAh` (default 100) scales the current thresholds. */
export function defaultFlagThresholds(
  chemistry: Chemistry,
  nominalVoltage: number,
  ratedCapacityAh = 100,
): FlagThresholds {
  const blocks = nominalVoltage / 12;
  const lithium = chemistry === 'lifepo4';
  const profile = CHEMISTRY_PROFILES[chemistry];
  const reduced = profile.reducedChargeCurrent;
  return {
    // Lead-acid lives longest above 50 % (common practice); LiFePO4 tolerates deep cycles.
    lowChargeWarningPercent: lithium ? 20 : 50,
    lowChargeCriticalPercent: lithium ? 10 : 30,
    lowChargeReleasePoints: 3,
    // ≈3.0 and 2.9 V per LiFePO4 cell; ≈20 % and ≈0 % rested lead-acid (from memory).
    lowVoltageWarningV: (lithium ? 12.0 : 11.8) * blocks,
    lowVoltageCriticalV: (lithium ? 11.6 : 11.5) * blocks,
    lowVoltageReleaseV: 0.2 * blocks,
    minimumChargeTemperatureC: profile.minimumChargeTemperature,
    // Charge-when-hot and cold-current limits follow the chemistry profile (none for lead-acid).
    ...(profile.maximumChargeTemperature === undefined
      ? {}
      : { maximumChargeTemperatureC: profile.maximumChargeTemperature }),
    ...(reduced === undefined
      ? {}
      : {
          reducedChargeBelowC: reduced.belowTemperature,
          reducedChargeCurrentA: reduced.maximumCRate * ratedCapacityAh,
        }),
    chargeFlowingA: Math.max(0.2, ratedCapacityAh * 0.005),
    coldChargeAheadMinutes: 45,
    // LiFePO4 cells are usually rated to 60 °C on discharge, lead-acid ages fast above 45 °C (from memory).
    overTemperatureWarningC: lithium ? 50 : 45,
    overTemperatureCriticalC: lithium ? 60 : 55,
    overTemperatureReleaseC: 3,
    // A 1C continuous BMS is the usual pairing for a drop-in LiFePO4 battery (common practice).
    bmsContinuousCurrentA: ratedCapacityAh,
    demandCurrentA: Math.max(2, ratedCapacityAh * 0.05),
    silentAfterMinutes: 10,
    underDeliveryFraction: 0.5,
    socDisagreementPoints: 15,
    minimumDurationSeconds: { ...MINIMUM_DURATION_SECONDS },
    releaseDelaySeconds: { ...RELEASE_DELAY_SECONDS },
  };
}

/** Defaults with an owner's overrides on top; refuses a critical level on the wrong side of its warning. */
export function resolveFlagThresholds(
  defaults: FlagThresholds,
  overrides: FlagThresholdOverrides = {},
): FlagThresholds {
  const resolved: FlagThresholds = {
    ...defaults,
    ...overrides,
    minimumDurationSeconds: { ...defaults.minimumDurationSeconds, ...overrides.minimumDurationSeconds },
  };
  checkOrder('lowChargeCriticalPercent', resolved.lowChargeCriticalPercent, resolved.lowChargeWarningPercent);
  checkOrder('lowVoltageCriticalV', resolved.lowVoltageCriticalV, resolved.lowVoltageWarningV);
  checkOrder('overTemperatureWarningC', resolved.overTemperatureWarningC, resolved.overTemperatureCriticalC);
  return resolved;
}

function checkOrder(field: string, lower: number, upper: number): void {
  if (!(Number.isFinite(lower) && Number.isFinite(upper) && lower <= upper)) {
    throw new AnalyticsSettingError(
      'bad_threshold',
      field,
      `${field} must be a number on the safe side of its paired level; got ${lower} against ${upper}`,
    );
  }
}
