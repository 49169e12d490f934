import { isColdCharging } from './cold-charge';

describe('isColdCharging', () => {
  it('flags a LiFePO4 pack charged at 2 A at -3 °C', () =>
    expect(isColdCharging('lifepo4', { current: 2, temperature: -3 })).toBe(true));
  it('ignores a trickle of 0.5 A or less', () =>
    expect(isColdCharging('lifepo4', { current: 0.5, temperature: -3 })).toBe(false));
  it('ignores a cold pack that is discharging', () =>
    expect(isColdCharging('lifepo4', { current: -10, temperature: -10 })).toBe(false));
  it('ignores charging at exactly 0 °C', () =>
    expect(isColdCharging('lifepo4', { current: 5, temperature: 0 })).toBe(false));
  it('ignores lead-acid chemistries', () =>
    expect(isColdCharging('agm', { current: 5, temperature: -5 })).toBe(false));
});
