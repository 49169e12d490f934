import { CHEMISTRY_PROFILES } from '../battery/chemistry-profile';
import {
  capacityFromCount,
  CURRENT_OFFSET_SIGMA_A,
  lowVoltageCutoff,
  REST_VOLTAGE_SIGMA_PER_BLOCK_V,
  restedStateOfCharge,
} from './capacity-measurement';

describe('capacity measurement', () => {
  it('reads a rested LiFePO4 voltage low on the curve to about a percent', () => {
    // 12.9 V lies on the 10–20 % segment (12.8 → 13.0 V): 0.02 V per %, so ± 0.02 V is ± 1 %.
    const { stateOfCharge, sigma } = restedStateOfCharge('lifepo4', 12, 12.9);
    expect(stateOfCharge).toBeCloseTo(0.15, 6);
    expect(sigma).toBeCloseTo(REST_VOLTAGE_SIGMA_PER_BLOCK_V / 0.02 / 100, 6);
  });

  it('knows a rest on the LiFePO4 plateau says little', () => {
    // 13.15 V is mid-plateau: 0.005 V per %, so ± 0.02 V is ± 4 %.
    const { stateOfCharge, sigma } = restedStateOfCharge('lifepo4', 12, 13.15);
    expect(stateOfCharge).toBeCloseTo(0.5, 6);
    expect(sigma).toBeCloseTo(0.04, 6);
  });

  it('scales the voltage uncertainty with the bank voltage', () => {
    const twelve = restedStateOfCharge('agm', 12, 12.1);
    const twentyFour = restedStateOfCharge('agm', 24, 24.2);
    expect(twentyFour.stateOfCharge).toBeCloseTo(twelve.stateOfCharge, 9);
    expect(twentyFour.sigma).toBeCloseTo(twelve.sigma, 9);
  });

  it('turns a count into a capacity with the uncertainty worked by hand', () => {
    // 150 Ah drawn over 50 h to 20 % ± 1 % at full capacity factor, 20 Ah of charge in between (LiFePO4).
    const result = capacityFromCount({
      chemistry: 'lifepo4',
      countedAh: 150,
      chargeAh: 20,
      hours: 50,
      socAtEnd: 0.2,
      socSigma: 0.01,
      capacityFactor: 1,
    });
    expect(result.capacityAh).toBeCloseTo(187.5, 9);
    const countSigma = Math.hypot(CURRENT_OFFSET_SIGMA_A * 50, 0.005 * 20) / 0.8;
    const socSigma = (187.5 * 0.01) / 0.8;
    expect(result.sigmaAh).toBeCloseTo(Math.hypot(countSigma, socSigma), 9);
  });

  it('brings a cold measurement back to 25 °C through the capacity factor', () => {
    const warm = capacityFromCount({
      chemistry: 'agm',
      countedAh: 60,
      chargeAh: 0,
      hours: 10,
      socAtEnd: 0.4,
      socSigma: 0.02,
      capacityFactor: 1,
    });
    const cold = capacityFromCount({
      chemistry: 'agm',
      countedAh: 48,
      chargeAh: 0,
      hours: 10,
      socAtEnd: 0.4,
      socSigma: 0.02,
      capacityFactor: 0.8,
    });
    expect(cold.capacityAh).toBeCloseTo(warm.capacityAh, 9);
  });

  it('takes the cut-off from the chemistry profile', () => {
    expect(lowVoltageCutoff('lifepo4', 24)).toBeCloseTo(CHEMISTRY_PROFILES.lifepo4.lowVoltageCutoff * 2, 9);
  });
});
