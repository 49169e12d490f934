// The one call the server makes per reading: estimator, rolling mean, projections and flags for one
// system, with the state to keep and the summary to send to the dashboard.
import type { DerivedState } from '../api/alerts-contract';
import { BatteryReading } from '../telemetry/reading';
import { BatterySetup, resolveBatterySetup, ResolvedBatterySetup } from './battery-setup';
import { ActiveFlag, FlagEvent } from './flag-event';
import { activeFlags, FlagState, stepFlags } from './flag-engine';
import { ChargeSourceRating } from './flag-settings';
import {
  defaultFlagThresholds,
  FlagThresholdOverrides,
  FlagThresholds,
  resolveFlagThresholds,
} from './flag-thresholds';
import { nextLocalTime } from './local-time';
import { DEFAULT_MEAN_WINDOW_MINUTES, MeanCurrent, stepMeanCurrent } from './mean-current';
import {
  ChargeProjection,
  hoursToEmpty,
  ProjectionStart,
  hoursToFull,
  projectStateOfCharge,
} from './projections';
import { SocEstimate, stepSocEstimate } from './soc-estimator';

/** A system's analytics configuration as stored: the bank, owner overrides, sources and the morning check. */
export interface SystemAnalyticsConfig {
  battery: BatterySetup;
  thresholds?: FlagThresholdOverrides;
  sources?: readonly ChargeSourceRating[];
  /** Window of the mean net current, minutes. */
  meanWindowMinutes?: number;
  /** State of charge counted as empty for hours-to-empty, percent of usable capacity. */
  floorPercent?: number;
  /** Local time to project the charge to (e.g. "07:00") and the system's UTC offset at present. */
  morning?: { localTime: string; utcOffsetMinutes: number };
}

/** A configuration checked and filled with defaults, made once when the system's settings load. */
export interface SystemAnalyticsSettings {
  battery: ResolvedBatterySetup;
  thresholds: FlagThresholds;
  sources: readonly ChargeSourceRating[];
  meanWindowMinutes: number;
  floorPercent: number;
  morning?: { localTime: string; utcOffsetMinutes: number };
}

/** Everything kept between readings for one system (JSON-serialisable). */
export interface SystemAnalyticsState {
  estimate: SocEstimate;
  meanCurrent: MeanCurrent;
  flags: FlagState;
}

/** What the dashboard shows for one system after a reading: the API contract's `DerivedState`, filled in. */
export interface DerivedSystemState extends DerivedState {
  stateOfCharge: number;
  stateOfChargeSource: 'reported' | 'estimated';
  meanCurrent: number;
  /** Null when no morning time is configured. */
  byMorning: ChargeProjection | null;
  activeFlags: ActiveFlag[];
}

/** Checks a stored configuration and fills chemistry defaults; throws AnalyticsSettingError when invalid. */
export function resolveSystemAnalyticsSettings(config: SystemAnalyticsConfig): SystemAnalyticsSettings {
  const battery = resolveBatterySetup(config.battery);
  const defaults = defaultFlagThresholds(battery.chemistry, battery.nominalVoltage, battery.ratedCapacityAh);
  const settings: SystemAnalyticsSettings = {
    battery,
    thresholds: resolveFlagThresholds(defaults, config.thresholds),
    sources: config.sources ?? [],
    meanWindowMinutes: config.meanWindowMinutes ?? DEFAULT_MEAN_WINDOW_MINUTES,
    floorPercent: config.floorPercent ?? 0,
  };
  if (config.morning !== undefined) {
    // Validates the time and offset now rather than on the first reading.
    nextLocalTime(0, config.morning.localTime, config.morning.utcOffsetMinutes);
    settings.morning = config.morning;
  }
  return settings;
}

/** Runs all analytics for one reading of one system. */
export function deriveSystemState(
  state: SystemAnalyticsState | undefined,
  reading: BatteryReading,
  settings: SystemAnalyticsSettings,
): { state: SystemAnalyticsState; derived: DerivedSystemState; events: FlagEvent[] } {
  const estimate = stepSocEstimate(state?.estimate, reading, settings.battery);
  const meanCurrent = stepMeanCurrent(state?.meanCurrent, reading, settings.meanWindowMinutes);
  const reported = reading.stateOfCharge !== undefined;
  const stateOfCharge = reading.stateOfCharge ?? estimate.stateOfCharge;
  const flagStep = stepFlags(state?.flags, {
    reading,
    estimate: { stateOfCharge, disagreement: estimate.disagreement },
    // The resolved settings are the flag settings too (battery, thresholds, sources): no copy per reading.
    settings,
  });
  const start = { battery: settings.battery, stateOfCharge, temperature: reading.temperature };
  const derived: DerivedSystemState = {
    stateOfCharge,
    stateOfChargeSource: reported ? 'reported' : 'estimated',
    hoursToEmpty: hoursToEmpty(start, meanCurrent.meanCurrent, settings.floorPercent) ?? null,
    hoursToFull: hoursToFull(start, reading.current) ?? null,
    meanCurrent: meanCurrent.meanCurrent,
    byMorning: morningProjection(start, meanCurrent.meanCurrent, reading.measuredAt, settings),
    activeFlags: activeFlags(flagStep.state),
  };
  return { state: { estimate, meanCurrent, flags: flagStep.state }, derived, events: flagStep.events };
}

function morningProjection(
  start: ProjectionStart,
  meanCurrent: number,
  nowMs: number,
  settings: SystemAnalyticsSettings,
): ChargeProjection | null {
  if (settings.morning === undefined) return null;
  const at = nextLocalTime(nowMs, settings.morning.localTime, settings.morning.utcOffsetMinutes);
  return projectStateOfCharge(start, meanCurrent, nowMs, at, settings.thresholds.lowChargeWarningPercent);
}
