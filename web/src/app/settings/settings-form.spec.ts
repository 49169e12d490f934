import type { SystemSettings } from '@cellwarden/shared';
import {
  chargeSourceGroup,
  fillSettingsForm,
  isTimeZone,
  readSettingsForm,
  settingsForm,
} from './settings-form';

const settings: SystemSettings = {
  name: 'Blue van',
  kind: 'van',
  timeZone: 'Europe/Lisbon',
  battery: { chemistry: 'lifepo4', nominalVoltage: 12, ratedCapacityAh: 200, usableCapacityAh: 180 },
  bms: { continuousDischargeA: 150, lowVoltageCutoffV: 10 },
  chargeSources: [{ id: 'solar', kind: 'solar', label: 'Roof panels', ratedCurrentA: 30 }],
  thresholds: {
    lowChargeWarningPercent: 25,
    lowChargeCriticalPercent: 10,
    lowVoltageV: 12,
    overTemperatureC: 45,
    silentAfterMinutes: 15,
  },
};

describe('settings form', () => {
  it('round-trips loaded settings unchanged', () => {
    const form = settingsForm(() => 'C');
    fillSettingsForm(form, settings, 'C');
    expect(form.valid).toBe(true);
    expect(readSettingsForm(form, 'C')).toEqual(settings);
  });

  it('shows the over-temperature threshold in °F and saves it in °C', () => {
    const form = settingsForm(() => 'F');
    fillSettingsForm(form, settings, 'F');
    // NIST SP 811 (2008), B.9: 45 °C × 1.8 + 32 = 113 °F.
    expect(form.controls.thresholds.controls.overTemperatureC.value).toBe(113);
    expect(readSettingsForm(form, 'F').thresholds.overTemperatureC).toBe(45);
  });

  it('refuses a usable capacity above the rated capacity', () => {
    const form = settingsForm(() => 'C');
    fillSettingsForm(form, settings, 'C');
    form.controls.battery.controls.usableCapacityAh.setValue(210);
    expect(form.controls.battery.hasError('usableAboveRated')).toBe(true);
  });

  it('refuses a critical charge level at or above the warning level', () => {
    const form = settingsForm(() => 'C');
    fillSettingsForm(form, settings, 'C');
    form.controls.thresholds.controls.lowChargeCriticalPercent.setValue(25);
    expect(form.controls.thresholds.hasError('criticalNotBelowWarning')).toBe(true);
  });

  it('refuses two charge sources with the same id', () => {
    const form = settingsForm(() => 'C');
    fillSettingsForm(form, settings, 'C');
    form.controls.chargeSources.push(chargeSourceGroup({ ...settings.chargeSources[0], label: 'Second' }));
    expect(form.controls.chargeSources.hasError('duplicateSourceId')).toBe(true);
  });

  it('checks the over-temperature range in the unit being typed', () => {
    const form = settingsForm(() => 'F');
    fillSettingsForm(form, settings, 'F');
    // 60 °F is about 15.6 °C, below the 20 °C floor.
    form.controls.thresholds.controls.overTemperatureC.setValue(60);
    expect(form.controls.thresholds.controls.overTemperatureC.hasError('temperatureRange')).toBe(true);
  });

  it('refuses a source id with capitals or spaces', () => {
    const group = chargeSourceGroup({ id: 'Roof Solar', kind: 'solar', label: 'x', ratedCurrentA: 10 });
    expect(group.controls.id.hasError('pattern')).toBe(true);
  });
});

describe('isTimeZone', () => {
  // IANA tz database zone names.
  it('knows IANA zone names', () => expect(isTimeZone('America/Halifax')).toBe(true));
  it('refuses a made-up zone', () => expect(isTimeZone('Mars/Olympus')).toBe(false));
});
