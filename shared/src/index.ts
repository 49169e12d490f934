// The curated public surface of Cellwarden's domain library. Pure TypeScript: no I/O, no frameworks.
export type { BatteryReading } from './telemetry/reading';
export { TOPIC_ROOT, readingsTopic, deviceIdFromReadingsTopic } from './telemetry/topics';
export type { Chemistry, ChemistryProfile } from './battery/chemistry-profile';
export { CHEMISTRY_PROFILES, CHARGE_VOLTAGE_REFERENCE_C } from './battery/chemistry-profile';
export { interpolateTable } from './battery/interpolate-table';
export {
  openCircuitVoltage,
  capacityFactor,
  peukertRuntimeHours,
  peukertEffectiveCurrent,
  cRate,
  wattHours,
  chargeVoltageCompensation,
  chemistryNominalVoltage,
} from './battery/battery-math';
export { TelemetryInputError } from './telemetry/telemetry-input-error';
export type { ReadingValidationErrorCode } from './telemetry/reading-validation';
export {
  ReadingValidationError,
  validateReading,
  VOLTAGE_RANGE_V,
  CURRENT_RANGE_A,
  TEMPERATURE_RANGE_C,
  STATE_OF_CHARGE_RANGE_PERCENT,
  POWER_RANGE_W,
  MAX_FUTURE_SKEW_MS,
  MAX_READING_AGE_MS,
} from './telemetry/reading-validation';
export type { SenmlRecord, ResolvedSenmlRecord } from './senml/senml-record';
export { SENML_VERSION, RELATIVE_TIME_LIMIT } from './senml/senml-record';
export type { SenmlErrorCode } from './senml/senml-error';
export { SenmlError } from './senml/senml-error';
export { isSenmlName } from './senml/senml-name';
export { checkPack } from './senml/check-pack';
export { resolvePack } from './senml/resolve-pack';
export { MAX_READING_PAYLOAD_BYTES } from './senml/reading-measurement';
export { encodeReadingPack, decodeReadingPack, parseReadingPayload } from './senml/reading-pack';
export type {
  ApiErrorBody,
  HistoryPoint,
  MonitorLatest,
  ReceivedReading,
  SystemAction,
  SystemSummary,
} from './api/api-contract';
export { SYSTEM_ACTIONS } from './api/api-contract';
export { fromHistoryColumns, toHistoryColumns, type HistoryColumns } from './api/history-columns';
export {
  READINGS_CSV_HEADER,
  ReadingsCsvError,
  readingToCsvRecord,
  checkReadingsCsvHeader,
  csvRecordToReading,
} from './telemetry/readings-csv';
export * from './analytics/index';
export * from './installer/index';
export * from './health/index';
export type * from './api/accounts-contract';
export { COMPANY_ROLES, MAX_PASSWORD_BYTES, MIN_PASSWORD_LENGTH, ROLES } from './api/accounts-contract';
export type * from './api/access-contract';
export type * from './api/alerts-contract';
export type * from './api/stream-contract';
export {
  MAX_STREAM_SUBSCRIPTIONS,
  STREAM_CLOSE,
  STREAM_PROTOCOL,
  STREAM_TOKEN_PREFIX,
} from './api/stream-contract';
export type * from './api/settings-contract';
export { DEFAULT_EMAIL_FLAGS } from './api/settings-contract';
export {
  EARLIEST_QUERY_TIME,
  LATEST_QUERY_TIME,
  UUID_PATTERN,
  epochMsSchema,
  idSchema,
  isoTimeSchema,
  queryRangeMessage,
} from './api/common-schemas';
export type * from './api/installer-contract';
export type * from './api/install-register-contract';
export { COMPONENT_KINDS } from './api/install-register-contract';
export type * from './api/battery-health-contract';
export { HEALTH_REPORT_MAX_DAYS } from './api/battery-health-contract';
export type * from './api/onboarding-contract';
export type * from './api/access-requests-contract';
export * from './onboarding/index';
