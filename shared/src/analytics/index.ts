// Public surface of shared/src/analytics: state of charge, projections and flags, one O(1) step per reading.
export type { AnalyticsErrorCode } from './analytics-error';
export { AnalyticsSettingError } from './analytics-error';
export type { BatterySetup, NominalVoltage, ResolvedBatterySetup } from './battery-setup';
export { resolveBatterySetup, usableCapacityAt, packInternalResistance } from './battery-setup';
export { stateOfChargeFromOpenCircuit, openCircuitWeight } from './open-circuit-soc';
export type { SocEstimate } from './soc-estimator';
export { stepSocEstimate, compensatedVoltage, MAX_INTEGRATION_GAP_MS } from './soc-estimator';
export type { MeanCurrent } from './mean-current';
export { stepMeanCurrent, DEFAULT_MEAN_WINDOW_MINUTES } from './mean-current';
export type { ProjectionStart, ChargeProjection } from './projections';
export { hoursToEmpty, hoursToFull, projectStateOfCharge, NEGLIGIBLE_CURRENT_A } from './projections';
export { nextLocalTime } from './local-time';
export { utcOffsetMinutes, wallClockIn, zoneOffsetMs } from './zone-offset';
// FlagKind and FlagSeverity are exported by the API contract (shared/src/api/alerts-contract.ts).
export type { FlagTransition, FlagEvent, ActiveFlag } from './flag-event';
export { FLAG_KINDS } from './flag-event';
export type { FlagThresholds, FlagThresholdOverrides } from './flag-thresholds';
export { defaultFlagThresholds, resolveFlagThresholds } from './flag-thresholds';
export type { ChargeSourceRating, FlagSettings, FlagMemory } from './flag-settings';
export type { FlagState, FlagInput } from './flag-engine';
export { stepFlags, checkSilence, activeFlags, emptyFlagState } from './flag-engine';
export type { FlagDescription } from './flag-catalogue';
export { describeFlag } from './flag-catalogue';
export type {
  SystemAnalyticsConfig,
  SystemAnalyticsSettings,
  SystemAnalyticsState,
  DerivedSystemState,
} from './derive-system-state';
export { deriveSystemState, resolveSystemAnalyticsSettings } from './derive-system-state';
export {
  analyticsConfigFromSettings,
  thresholdSettingDefaults,
  DEFAULT_MORNING_TIME,
} from './settings-mapping';
export type { FlagEpisode } from './flag-episodes';
export { flagEpisodes } from './flag-episodes';
