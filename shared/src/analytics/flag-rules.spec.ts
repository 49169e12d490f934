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

  it('flags charging a LiFePO4 pack above its charge temperature limit', () => {
    // Cell datasheets (from memory): many makers stop charging at about 45 °C
    expect(FLAG_RULES['hot-charging'](context({ current: 20, temperature: 46 }))).toMatchObject({
      trigger: 'warning',
      holds: true,
    });
    expect(FLAG_RULES['hot-charging'](context({ current: 20, temperature: 51 })).trigger).toBe('critical');
    expect(FLAG_RULES['hot-charging'](context({ current: -20, temperature: 51 })).trigger).toBeUndefined();
    expect(FLAG_RULES['hot-charging'](context({ current: 20, temperature: 44 })).trigger).toBeUndefined();
  });

  it('flags a charge current above the reduced rate between 0 and 10 °C', () => {
    // Cell datasheets (from memory): ≤ 0.1 C between 0 and about 10 °C → 20 A on this 200 Ah bank
    expect(settings.thresholds.reducedChargeCurrentA).toBe(20);
    expect(FLAG_RULES['cold-charge-current'](context({ current: 40, temperature: 5 }))).toMatchObject({
      trigger: 'warning',
      value: 40,
    });
    expect(
      FLAG_RULES['cold-charge-current'](context({ current: 15, temperature: 5 })).trigger,
    ).toBeUndefined();
    expect(
      FLAG_RULES['cold-charge-current'](context({ current: 40, temperature: 12 })).trigger,
    ).toBeUndefined();
    // Below 0 °C it is cold charging, not this flag
    expect(
      FLAG_RULES['cold-charge-current'](context({ current: 40, temperature: -1 })).trigger,
    ).toBeUndefined();
  });

  it('never raises the charge-temperature flags for lead-acid, whose profile sets no such limits', () => {
    const agm = resolveBatterySetup({
      chemistry: 'agm',
      nominalVoltage: 12,
      ratedCapacityAh: 100,
      usableCapacityAh: 50,
    });
    const agmSettings: FlagSettings = { battery: agm, thresholds: defaultFlagThresholds('agm', 12, 100) };
    const hot = { ...context({ current: 80, temperature: 48 }), settings: agmSettings };
    const cold = { ...context({ current: 80, temperature: 3 }), settings: agmSettings };
    expect(FLAG_RULES['hot-charging'](hot).trigger).toBeUndefined();
    expect(FLAG_RULES['cold-charge-current'](cold).trigger).toBeUndefined();
  });

  it('judges a hot lead-acid bank in absorption at its compensated voltage, not as under-delivering', () => {
    // AGM datasheets (from memory): 14.4 V at 25 °C, −24 mV/°C per 12 V block; at 40 °C absorption is 14.04 V
    const agm = resolveBatterySetup({
      chemistry: 'agm',
      nominalVoltage: 12,
      ratedCapacityAh: 100,
      usableCapacityAh: 50,
    });
    const agmSettings: FlagSettings = {
      battery: agm,
      thresholds: defaultFlagThresholds('agm', 12, 100),
      sources: [{ id: 'dcdc', kind: 'dc-dc', ratedCurrentA: 30 }],
    };
    const absorbing = {
      ...context({ current: 5, voltage: 14.0, temperature: 40, sourceCurrents: { dcdc: 5 } }),
      settings: agmSettings,
    };
    expect(FLAG_RULES['charger-under-delivering'](absorbing).trigger).toBeUndefined();
    const cool = { ...absorbing, reading: { ...absorbing.reading, temperature: 25 } };
    expect(FLAG_RULES['charger-under-delivering'](cool).trigger).toBe('warning');
  });
});
