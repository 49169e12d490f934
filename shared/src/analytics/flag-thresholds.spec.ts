import { AnalyticsSettingError } from './analytics-error';
import { defaultFlagThresholds, resolveFlagThresholds } from './flag-thresholds';

describe('defaultFlagThresholds', () => {
  it('takes the minimum charge temperature from the chemistry', () => {
    // LiFePO4 must not be charged below 0 °C (cell datasheets, common practice; from memory)
    expect(defaultFlagThresholds('lifepo4', 12).minimumChargeTemperatureC).toBe(0);
    expect(defaultFlagThresholds('agm', 12).minimumChargeTemperatureC).toBe(-20);
  });

  it('keeps lead-acid above half charge', () => {
    // Lead-acid cycle life falls steeply below 50 % depth of discharge (common practice)
    expect(defaultFlagThresholds('flooded', 12).lowChargeWarningPercent).toBe(50);
    expect(defaultFlagThresholds('lifepo4', 12).lowChargeWarningPercent).toBeLessThan(50);
  });

  it('scales voltages with the nominal voltage and currents with the capacity', () => {
    const twelve = defaultFlagThresholds('agm', 12, 100);
    const fortyEight = defaultFlagThresholds('agm', 48, 400);
    expect(fortyEight.lowVoltageWarningV).toBeCloseTo(twelve.lowVoltageWarningV * 4, 9);
    expect(fortyEight.bmsContinuousCurrentA).toBe(400);
  });
});

describe('resolveFlagThresholds', () => {
  it('lays owner overrides over the defaults, minimum durations one by one', () => {
    const resolved = resolveFlagThresholds(defaultFlagThresholds('lifepo4', 12), {
      lowChargeWarningPercent: 30,
      minimumDurationSeconds: { 'low-charge': 5 },
    });
    expect(resolved.lowChargeWarningPercent).toBe(30);
    expect(resolved.minimumDurationSeconds['low-charge']).toBe(5);
    expect(resolved.minimumDurationSeconds['over-discharge']).toBe(10);
  });

  it('refuses a critical level on the wrong side of its warning', () => {
    const defaults = defaultFlagThresholds('lifepo4', 12);
    expect(() => resolveFlagThresholds(defaults, { lowChargeCriticalPercent: 40 })).toThrow(
      AnalyticsSettingError,
    );
    expect(() => resolveFlagThresholds(defaults, { overTemperatureCriticalC: 30 })).toThrow(
      /overTemperature/,
    );
  });
});
