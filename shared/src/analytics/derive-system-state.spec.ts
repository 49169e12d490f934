import { BatteryReading } from '../telemetry/reading';
import { AnalyticsSettingError } from './analytics-error';
import {
  deriveSystemState,
  resolveSystemAnalyticsSettings,
  SystemAnalyticsState,
} from './derive-system-state';

// 20:00 UTC; the system sits at UTC+1, so the next 07:00 local is 06:00 UTC tomorrow, 10 h ahead.
const evening = Date.UTC(2026, 11, 2, 20, 0, 0);
const HOUR = 3_600_000;
const settings = resolveSystemAnalyticsSettings({
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 100, usableCapacityAh: 100 },
  morning: { localTime: '07:00', utcOffsetMinutes: 60 },
});

function reading(seconds: number, values: Partial<BatteryReading> = {}): BatteryReading {
  return { measuredAt: evening + seconds * 1000, voltage: 13.1, current: -4, temperature: 25, ...values };
}

describe('deriveSystemState', () => {
  it('uses the reported state of charge and projects the night at the mean load', () => {
    const { derived, events } = deriveSystemState(undefined, reading(0, { stateOfCharge: 50 }), settings);
    expect(derived.stateOfChargeSource).toBe('reported');
    expect(derived.stateOfCharge).toBe(50);
    // Arithmetic: 50 Ah / 4 A = 12.5 h to empty
    expect(derived.hoursToEmpty).toBeCloseTo(12.5, 9);
    expect(derived.hoursToFull).toBeNull();
    // 10 h × 4 A = 40 Ah → 10 % by 07:00; 20 % (the warning level) after 30 Ah / 4 A = 7.5 h
    expect(derived.byMorning).toEqual({
      at: evening + 10 * HOUR,
      stateOfCharge: expect.closeTo(10, 9),
      crossesLowAt: evening + 7.5 * HOUR,
    });
    expect(events).toEqual([]);
  });

  it('falls back to its own estimate and carries state from reading to reading', () => {
    let state: SystemAnalyticsState | undefined;
    let last;
    for (let s = 0; s <= 3600; s += 10) {
      last = deriveSystemState(state, reading(s, { current: -10, voltage: 13.1 }), settings);
      state = last.state;
    }
    expect(last!.derived.stateOfChargeSource).toBe('estimated');
    // The first reading's state of charge comes from the load-compensated voltage (13.1 + 10 × 0.008 = 13.18 V,
    // ≈ 56 % on the profile), then ΔAh = ∫ I dt takes 10 Ah (10 %) over the hour.
    const first = deriveSystemState(undefined, reading(0, { current: -10, voltage: 13.1 }), settings);
    expect(last!.derived.stateOfCharge).toBeCloseTo(first.derived.stateOfCharge - 10, 6);
    expect(last!.derived.meanCurrent).toBeCloseTo(-10, 9);
    expect(JSON.parse(JSON.stringify(state))).toEqual(state);
  });

  it('reports hours to full while charging and the flags that fire', () => {
    let state: SystemAnalyticsState | undefined;
    let last;
    for (let s = 0; s <= 120; s += 10) {
      last = deriveSystemState(
        state,
        reading(s, { current: 20, temperature: -3, stateOfCharge: 60 }),
        settings,
      );
      state = last.state;
    }
    // Profile capacity table, linear interpolation: at −3 °C, 0.88 − 0.18 × 3/20 = 0.853 of 100 Ah usable;
    // 40 % of that is missing, delivered at 20 A × 0.99 efficiency (arithmetic)
    expect(last!.derived.hoursToFull).toBeCloseTo((0.4 * 85.3) / 19.8, 9);
    expect(last!.derived.activeFlags.map((f) => f.kind)).toEqual(['cold-charging']);
  });

  it('refuses a bad morning time when the settings are resolved, not on the first reading', () => {
    expect(() =>
      resolveSystemAnalyticsSettings({
        battery: { chemistry: 'agm', nominalVoltage: 24, ratedCapacityAh: 200, usableCapacityAh: 100 },
        morning: { localTime: '7:00', utcOffsetMinutes: 0 },
      }),
    ).toThrow(AnalyticsSettingError);
  });
});
