// Bridges the system settings form (shared/src/api/settings-contract.ts) and the analytics: the form keeps
// one low-voltage and one over-temperature level, which here become the warning level, with the critical
// level kept at its default unless the owner's choice is already beyond it.
import type { FlagThresholdSettings, SystemSettings } from '../api/settings-contract';
import { Chemistry } from '../battery/chemistry-profile';
import { NominalVoltage } from './battery-setup';
import { SystemAnalyticsConfig } from './derive-system-state';
import { defaultFlagThresholds, FlagThresholdOverrides } from './flag-thresholds';

/** Local time the "by morning" projection aims at. */
export const DEFAULT_MORNING_TIME = '07:00';

/** The chemistry defaults in the settings form's shape (shown beside each threshold). */
export function thresholdSettingDefaults(
  chemistry: Chemistry,
  nominalVoltage: NominalVoltage,
  ratedCapacityAh?: number,
): FlagThresholdSettings {
  const defaults = defaultFlagThresholds(chemistry, nominalVoltage, ratedCapacityAh);
  return {
    lowChargeWarningPercent: defaults.lowChargeWarningPercent,
    lowChargeCriticalPercent: defaults.lowChargeCriticalPercent,
    lowVoltageV: defaults.lowVoltageWarningV,
    overTemperatureC: defaults.overTemperatureWarningC,
    silentAfterMinutes: defaults.silentAfterMinutes,
  };
}

/** The analytics configuration of a system from its stored settings and its zone's UTC offset now. */
export function analyticsConfigFromSettings(
  settings: Pick<SystemSettings, 'battery' | 'bms' | 'chargeSources' | 'thresholds'>,
  utcOffsetMinutes: number,
  morningTime: string = DEFAULT_MORNING_TIME,
): SystemAnalyticsConfig {
  const { battery } = settings;
  const defaults = defaultFlagThresholds(battery.chemistry, battery.nominalVoltage, battery.ratedCapacityAh);
  const form: Partial<FlagThresholdSettings> = settings.thresholds ?? {};
  const overrides: FlagThresholdOverrides = {
    lowChargeWarningPercent: form.lowChargeWarningPercent,
    lowChargeCriticalPercent: form.lowChargeCriticalPercent,
    silentAfterMinutes: form.silentAfterMinutes,
    bmsContinuousCurrentA: settings.bms?.continuousDischargeA,
  };
  if (form.lowVoltageV !== undefined) {
    overrides.lowVoltageWarningV = form.lowVoltageV;
    overrides.lowVoltageCriticalV = Math.min(defaults.lowVoltageCriticalV, form.lowVoltageV);
  }
  if (form.overTemperatureC !== undefined) {
    overrides.overTemperatureWarningC = form.overTemperatureC;
    overrides.overTemperatureCriticalC = Math.max(defaults.overTemperatureCriticalC, form.overTemperatureC);
  }
  return {
    battery: { ...battery },
    thresholds: withoutUndefined(overrides),
    sources: settings.chargeSources.map(({ id, kind, ratedCurrentA }) => ({ id, kind, ratedCurrentA })),
    morning: { localTime: morningTime, utcOffsetMinutes },
  };
}

function withoutUndefined<T extends object>(value: T): T {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as T;
}
