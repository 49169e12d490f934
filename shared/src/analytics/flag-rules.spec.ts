import { resolveBatterySetup } from './battery-setup';
import { FLAG_RULES, FlagContext, loadCompensatedVoltage } from './flag-rules';
import { FlagSettings } from './flag-settings';
import { defaultFlagThresholds } from './flag-thresholds';

const battery = resolveBatterySetup({
  chemistry: 'lifepo4',
  nominalVoltage: 24,
  ratedCapacityAh: 200,
  usableCapacityAh: 200,
});
const settings: FlagSettings = { battery, thresholds: defaultFlagThresholds('lifepo4', 24, 200) };

function context(reading: Partial<FlagContext['reading']>, stateOfCharge = 60): FlagContext {
  return {
    reading: { measuredAt: 0, voltage: 26.4, current: -10, temperature: 20, ...reading },
    estimate: { stateOfCharge },
    settings,
    memory: {},
  };
}

describe('loadCompensatedVoltage', () => {
  it('adds back the sag of a discharge and leaves a charging voltage alone', () => {
    // Thevenin model (general reference): V_open ≈ V + |I|·R; 24 V 200 Ah bank = 2 blocks × 8 mΩ × 100/200 = 8 mΩ
    expect(loadCompensatedVoltage(context({ voltage: 25, current: -50 }).reading, settings)).toBeCloseTo(
      25.4,
      9,
    );
    expect(loadCompensatedVoltage(context({ voltage: 27, current: 50 }).reading, settings)).toBe(27);
  });
});

describe('flag rules', () => {
  it('keeps low charge on inside the hysteresis band and off above it', () => {
    // Defaults for LiFePO4: start below 20 %, release at 23 %
    expect(FLAG_RULES['low-charge'](context({}, 21))).toMatchObject({ trigger: undefined, holds: true });
    expect(FLAG_RULES['low-charge'](context({}, 23.5))).toMatchObject({ holds: false });
  });

  it('scales voltage thresholds to the bank', () => {
    // 12.0 V per 12 V block × 2 blocks = 24.0 V warning for a 24 V bank
    expect(FLAG_RULES['low-voltage'](context({ voltage: 23.9, current: 0 })).trigger).toBe('warning');
    expect(FLAG_RULES['low-voltage'](context({ voltage: 24.1, current: 0 })).trigger).toBeUndefined();
  });

  it('treats a trickle as no charge for cold charging', () => {
    // Charge-flowing threshold: C/200 = 1 A for 200 Ah
    expect(FLAG_RULES['cold-charging'](context({ temperature: -5, current: 0.5 })).trigger).toBeUndefined();
    expect(FLAG_RULES['cold-charging'](context({ temperature: -5, current: 3 })).trigger).toBe('critical');
  });

  it('reports minutes to the cold limit from the temperature trend', () => {
    const signal = FLAG_RULES['cold-charge-ahead']({
      ...context({ temperature: 3, current: 20 }),
      memory: { temperatureTrendCPerHour: -6 },
    });
    // Arithmetic: 3 °C above the limit at 6 °C per hour = 30 min
    expect(signal).toMatchObject({ trigger: 'warning', value: 30, unit: 'min' });
  });
});
