import { CHEMISTRY_PROFILES } from '@cellwarden/shared';
import { BMS_CLEAR, BmsConfig, decideBms, lowVoltageRelease } from './battery-protection';
import { PackState, terminalVoltage } from './pack-model';

const config: BmsConfig = {
  blocksColdCharge: true,
  continuousDischargeCurrent: 100,
  overCurrentResetSeconds: 60,
};
const pack: PackState = {
  chemistry: 'lifepo4',
  nominalVoltage: 12,
  ratedCapacityAh: 100,
  stateOfCharge: 50,
  temperature: 15,
  current: 0,
};

describe('BMS', () => {
  it('blocks charging below the chemistry minimum unless it lacks that protection', () => {
    // LiFePO4 must not be charged below 0 °C (cell datasheets, common practice).
    const cold = { ...pack, temperature: CHEMISTRY_PROFILES.lifepo4.minimumChargeTemperature - 1 };
    expect(decideBms(BMS_CLEAR, config, cold, 20, 10).allowCharge).toBe(false);
    expect(decideBms(BMS_CLEAR, { ...config, blocksColdCharge: false }, cold, 20, 10).allowCharge).toBe(true);
    expect(decideBms(BMS_CLEAR, config, pack, 20, 10).allowCharge).toBe(true);
  });

  it('cuts discharge above its continuous rating for its reset time', () => {
    const tripped = decideBms(BMS_CLEAR, config, pack, -120, 10);
    expect(tripped.allowDischarge).toBe(false);
    let state = tripped.state;
    for (let t = 0; t < 50; t += 10) state = decideBms(state, config, pack, -5, 10).state;
    expect(decideBms(state, config, pack, -5, 10).allowDischarge).toBe(true);
  });

  it('cuts discharge at the low-voltage limit and releases only once charge brings the voltage back', () => {
    const empty = { ...pack, stateOfCharge: 1 };
    const cutoff = CHEMISTRY_PROFILES.lifepo4.lowVoltageCutoff;
    expect(terminalVoltage(empty, -40)).toBeLessThan(cutoff);
    const cut = decideBms(BMS_CLEAR, config, empty, -40, 10);
    expect(cut.allowDischarge).toBe(false);
    expect(decideBms(cut.state, config, empty, -1, 10).allowDischarge).toBe(false);
    const recharged = { ...pack, stateOfCharge: 15 };
    expect(terminalVoltage(recharged, 0)).toBeGreaterThan(lowVoltageRelease(recharged));
    expect(decideBms(cut.state, config, recharged, -1, 10).allowDischarge).toBe(true);
  });
});
