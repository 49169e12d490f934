import type { AbstractControl, ValidationErrors } from '@angular/forms';

/** The IANA zones this browser knows, for the time zone picker (UTC first). */
export function knownTimeZones(): string[] {
  const zones = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
  return ['UTC', ...zones.filter((zone) => zone !== 'UTC')];
}

/** The zone this browser is in, as the picker's starting value. */
export function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** Up to `limit` zones whose name contains what was typed (spaces match underscores: "new york"). */
export function matchingZones(zones: readonly string[], typed: string, limit = 50): string[] {
  const needle = typed.trim().toLowerCase().replace(/\s+/g, '_');
  return zones.filter((zone) => zone.toLowerCase().includes(needle)).slice(0, limit);
}

/** Validator factory: the value must be one of the zones. */
export function oneOfZones(zones: readonly string[]) {
  const known = new Set(zones);
  return (control: AbstractControl<string>): ValidationErrors | null =>
    !control.value || known.has(control.value) ? null : { zone: true };
}

/** Validator for a group: usable capacity at most the rated one, peak discharge at least the continuous one. */
export function withinRatings(group: AbstractControl): ValidationErrors | null {
  const value = group.value as Record<string, number | null>;
  const errors: ValidationErrors = {};
  if (
    value['usableCapacityAh'] != null &&
    value['ratedCapacityAh'] != null &&
    value['usableCapacityAh'] > value['ratedCapacityAh']
  )
    errors['usableAboveRated'] = true;
  if (
    value['bmsPeakDischargeA'] != null &&
    value['bmsContinuousDischargeA'] != null &&
    value['bmsPeakDischargeA'] < value['bmsContinuousDischargeA']
  )
    errors['peakBelowContinuous'] = true;
  return Object.keys(errors).length ? errors : null;
}
