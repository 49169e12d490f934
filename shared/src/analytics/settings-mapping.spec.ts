import { resolveSystemAnalyticsSettings } from './derive-system-state';
import { defaultFlagThresholds } from './flag-thresholds';
import { analyticsConfigFromSettings, thresholdSettingDefaults } from './settings-mapping';

const stored = {
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 180 },
  bms: { continuousDischargeA: 150, lowVoltageCutoffV: null },
  chargeSources: [{ id: 'dcdc', kind: 'dc-dc', label: 'Alternator charger', ratedCurrentA: 30 }],
  thresholds: {
    lowChargeWarningPercent: 25,
    lowChargeCriticalPercent: 12,
    lowVoltageV: 11.4,
    overTemperatureC: 48,
    silentAfterMinutes: 15,
  },
} as const;

describe('analyticsConfigFromSettings', () => {
  it('maps the settings form onto analytics thresholds that resolve', () => {
    const config = analyticsConfigFromSettings(
      { ...stored, chargeSources: [...stored.chargeSources], battery: { ...stored.battery } },
      120,
    );
    const settings = resolveSystemAnalyticsSettings(config);
    expect(settings.thresholds).toMatchObject({
      lowChargeWarningPercent: 25,
      lowChargeCriticalPercent: 12,
      lowVoltageWarningV: 11.4,
      // The owner's 11.4 V is below the 11.6 V default critical level, so critical follows it down.
      lowVoltageCriticalV: 11.4,
      overTemperatureWarningC: 48,
      overTemperatureCriticalC: 60,
      bmsContinuousCurrentA: 150,
      silentAfterMinutes: 15,
    });
    expect(settings.sources).toEqual([{ id: 'dcdc', kind: 'dc-dc', ratedCurrentA: 30 }]);
    expect(settings.morning).toEqual({ localTime: '07:00', utcOffsetMinutes: 120 });
  });
});

describe('thresholdSettingDefaults', () => {
  it('shows the chemistry defaults in the form’s shape', () => {
    const defaults = defaultFlagThresholds('agm', 24);
    expect(thresholdSettingDefaults('agm', 24)).toEqual({
      lowChargeWarningPercent: defaults.lowChargeWarningPercent,
      lowChargeCriticalPercent: defaults.lowChargeCriticalPercent,
      lowVoltageV: defaults.lowVoltageWarningV,
      overTemperatureC: defaults.overTemperatureWarningC,
      silentAfterMinutes: 10,
    });
  });
});
