// Settings that cannot describe a real battery system are a caller's bug or a bad form entry; they are
// thrown with a stable code so the server maps them like any other input error.

/** Why a battery setup, threshold or time setting was refused. */
export type AnalyticsErrorCode = 'bad_battery_setup' | 'bad_local_time' | 'bad_threshold';

/** A refused analytics setting: a stable `code` and the setting's `field` name. */
export class AnalyticsSettingError extends Error {
  /** Stable, machine-readable reason. */
  readonly code: AnalyticsErrorCode;
  /** The setting that is wrong, e.g. `usableCapacityAh`. */
  readonly field: string;

  constructor(code: AnalyticsErrorCode, field: string, message: string) {
    super(message);
    this.name = 'AnalyticsSettingError';
    this.code = code;
    this.field = field;
  }
}

/** The error for a setting that must be a positive, finite number. */
export function notPositiveError(field: string, value: number, unit: string): AnalyticsSettingError {
  return new AnalyticsSettingError(
    'bad_battery_setup',
    field,
    `${field} must be a positive number of ${unit}; got ${value}`,
  );
}
