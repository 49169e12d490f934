import {
  AbstractControl,
  FormArray,
  FormControl,
  FormGroup,
  ValidationErrors,
  ValidatorFn,
  Validators,
} from '@angular/forms';
import type { ChargeSource, FlagThresholdSettings, SystemSettings } from '@cellwarden/shared';
import { TemperatureUnit, inUnit, toCelsius } from '../core/temperature-unit';

const num = (value: number | null, validators: ValidatorFn[] = []) =>
  new FormControl<number | null>(value, { validators: [Validators.required, ...validators] });

/** A charge source id as a device sends it in `source:<id>`: lowercase letters, digits, dashes (common practice). */
export const SOURCE_ID_PATTERN = /^[a-z0-9][a-z0-9-]{0,31}$/;

/** Usable capacity may not exceed rated capacity. */
export function usableWithinRated(group: AbstractControl): ValidationErrors | null {
  const { ratedCapacityAh, usableCapacityAh } = group.value as {
    ratedCapacityAh: number;
    usableCapacityAh: number;
  };
  return ratedCapacityAh != null && usableCapacityAh != null && usableCapacityAh > ratedCapacityAh
    ? { usableAboveRated: true }
    : null;
}

/** The critical low-charge level must be below the warning level. */
export function criticalBelowWarning(group: AbstractControl): ValidationErrors | null {
  const { lowChargeWarningPercent: warning, lowChargeCriticalPercent: critical } =
    group.value as FlagThresholdSettings;
  return warning != null && critical != null && critical >= warning
    ? { criticalNotBelowWarning: true }
    : null;
}

/** Each charge source needs its own id. */
export function uniqueSourceIds(array: AbstractControl): ValidationErrors | null {
  const ids = (array.value as { id: string }[]).map((s) => s.id).filter(Boolean);
  return new Set(ids).size === ids.length ? null : { duplicateSourceId: true };
}

/** Whether a name is an IANA time zone the browser knows. */
export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: name });
    return name.length > 0;
  } catch {
    return false;
  }
}

function timeZoneValidator(control: AbstractControl<string>): ValidationErrors | null {
  return control.value && !isTimeZone(control.value) ? { timeZone: true } : null;
}

/** One charge source's form group. */
export function chargeSourceGroup(source?: ChargeSource) {
  return new FormGroup({
    kind: new FormControl<ChargeSource['kind']>(source?.kind ?? 'solar', { nonNullable: true }),
    label: new FormControl(source?.label ?? '', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(60)],
    }),
    id: new FormControl(source?.id ?? '', {
      nonNullable: true,
      validators: [Validators.required, Validators.pattern(SOURCE_ID_PATTERN)],
    }),
    ratedCurrentA: num(source?.ratedCurrentA ?? null, [Validators.min(0.1), Validators.max(1000)]),
  });
}

/** The plausible over-temperature threshold range, °C (common practice for battery spaces). */
export const OVER_TEMPERATURE_RANGE_C = { min: 20, max: 80 } as const;

/** Checks a temperature typed in the person's current unit against a °C range. */
export function temperatureWithin(range: { min: number; max: number }, unitOf: () => TemperatureUnit) {
  return (control: AbstractControl<number | null>): ValidationErrors | null => {
    if (control.value == null) return null;
    const celsius = toCelsius(control.value, unitOf());
    return celsius < range.min || celsius > range.max ? { temperatureRange: true } : null;
  };
}

/** The settings form; the over-temperature field holds the person's unit, read through `unitOf`. */
export function settingsForm(unitOf: () => TemperatureUnit) {
  return new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(80)],
    }),
    kind: new FormControl<SystemSettings['kind']>('van', { nonNullable: true }),
    timeZone: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, timeZoneValidator],
    }),
    battery: new FormGroup(
      {
        chemistry: new FormControl<SystemSettings['battery']['chemistry']>('lifepo4', { nonNullable: true }),
        nominalVoltage: new FormControl<12 | 24 | 48>(12, { nonNullable: true }),
        ratedCapacityAh: num(null, [Validators.min(1), Validators.max(20000)]),
        usableCapacityAh: num(null, [Validators.min(1), Validators.max(20000)]),
      },
      { validators: usableWithinRated },
    ),
    bms: new FormGroup({
      continuousDischargeA: num(null, [Validators.min(1), Validators.max(2000)]),
      lowVoltageCutoffV: new FormControl<number | null>(null, [Validators.min(5), Validators.max(70)]),
    }),
    chargeSources: new FormArray<ReturnType<typeof chargeSourceGroup>>([], { validators: uniqueSourceIds }),
    thresholds: new FormGroup(
      {
        lowChargeWarningPercent: num(null, [Validators.min(1), Validators.max(99)]),
        lowChargeCriticalPercent: num(null, [Validators.min(0), Validators.max(98)]),
        lowVoltageV: num(null, [Validators.min(5), Validators.max(70)]),
        overTemperatureC: num(null, [temperatureWithin(OVER_TEMPERATURE_RANGE_C, unitOf)]),
        silentAfterMinutes: num(null, [Validators.min(1), Validators.max(1440)]),
      },
      { validators: criticalBelowWarning },
    ),
  });
}

/** The settings form's type. */
export type SettingsForm = ReturnType<typeof settingsForm>;

/** Puts loaded settings into the form, the temperature in the person's unit. */
export function fillSettingsForm(form: SettingsForm, settings: SystemSettings, unit: TemperatureUnit): void {
  form.controls.chargeSources.clear({ emitEvent: false });
  for (const source of settings.chargeSources)
    form.controls.chargeSources.push(chargeSourceGroup(source), { emitEvent: false });
  form.reset({
    name: settings.name,
    kind: settings.kind,
    timeZone: settings.timeZone,
    battery: { ...settings.battery },
    bms: { ...settings.bms },
    chargeSources: settings.chargeSources.map((s) => ({ ...s })),
    thresholds: {
      ...settings.thresholds,
      overTemperatureC: roundTenth(inUnit(settings.thresholds.overTemperatureC, unit)),
    },
  });
}

/** The settings to PUT from the form, temperatures back in °C. */
export function readSettingsForm(form: SettingsForm, unit: TemperatureUnit): SystemSettings {
  const value = form.getRawValue();
  const t = value.thresholds;
  return {
    name: value.name.trim(),
    kind: value.kind,
    timeZone: value.timeZone.trim(),
    battery: {
      chemistry: value.battery.chemistry,
      nominalVoltage: value.battery.nominalVoltage,
      ratedCapacityAh: value.battery.ratedCapacityAh!,
      usableCapacityAh: value.battery.usableCapacityAh!,
    },
    bms: {
      continuousDischargeA: value.bms.continuousDischargeA!,
      lowVoltageCutoffV: value.bms.lowVoltageCutoffV ?? null,
    },
    chargeSources: value.chargeSources.map((s) => ({
      id: s.id.trim(),
      kind: s.kind,
      label: s.label.trim(),
      ratedCurrentA: s.ratedCurrentA!,
    })),
    thresholds: {
      lowChargeWarningPercent: t.lowChargeWarningPercent!,
      lowChargeCriticalPercent: t.lowChargeCriticalPercent!,
      lowVoltageV: t.lowVoltageV!,
      overTemperatureC: roundTenth(toCelsius(t.overTemperatureC!, unit)),
      silentAfterMinutes: t.silentAfterMinutes!,
    },
  };
}

function roundTenth(value: number): number {
  return Math.round(value * 10) / 10;
}
