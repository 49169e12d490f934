import { conductorResistancePerMetre, fineStrandFactor } from './conductor-resistance';
import { AWG_SIZES } from './wire-gauge';

const ohmPerKft = (ohmPerMetre: number) => ohmPerMetre * 304.8;

describe('conductor resistance', () => {
  it('reads the stranded rows of NEC Chapter 9 Table 8 at 75 °C', () => {
    // NEC Chapter 9 Table 8, uncoated copper, stranded (secondary: reprinted tables): 14 AWG 3.14, 10 AWG 1.24,
    // 8 AWG 0.778, 4 AWG 0.308, 1/0 0.122, 4/0 0.0608 Ω/kft
    expect(ohmPerKft(conductorResistancePerMetre('14', 'stranded', 75))).toBeCloseTo(3.14, 6);
    expect(ohmPerKft(conductorResistancePerMetre('10', 'stranded', 75))).toBeCloseTo(1.24, 6);
    expect(ohmPerKft(conductorResistancePerMetre('8', 'stranded', 75))).toBeCloseTo(0.778, 6);
    expect(ohmPerKft(conductorResistancePerMetre('4', 'stranded', 75))).toBeCloseTo(0.308, 6);
    expect(ohmPerKft(conductorResistancePerMetre('1/0', 'stranded', 75))).toBeCloseTo(0.122, 6);
    expect(ohmPerKft(conductorResistancePerMetre('4/0', 'stranded', 75))).toBeCloseTo(0.0608, 6);
  });

  it('agrees with the solid rows of the same table for solid conductors', () => {
    // NEC Chapter 9 Table 8, solid: 14 AWG 3.07, 10 AWG 1.21, 8 AWG 0.764 Ω/kft at 75 °C
    expect(ohmPerKft(conductorResistancePerMetre('14', 'solid', 75))).toBeCloseTo(3.07, 1);
    expect(ohmPerKft(conductorResistancePerMetre('10', 'solid', 75))).toBeCloseTo(1.21, 2);
    expect(ohmPerKft(conductorResistancePerMetre('8', 'solid', 75))).toBeCloseTo(0.764, 2);
  });

  it('corrects to another conductor temperature with the table note', () => {
    // NEC Chapter 9 Table 8 note 2: R2 = R1 [1 + 0.00323 (T2 − 75)]; 4 AWG at 20 °C: 0.308 × 0.82235 = 0.2533 Ω/kft
    expect(ohmPerKft(conductorResistancePerMetre('4', 'stranded', 20))).toBeCloseTo(0.2533, 4);
  });

  it('puts fine-stranded cable above stranded by the IEC 60228 class 5 to class 2 ratio', () => {
    // IEC 60228 (from memory) 25 mm² (nearest to 4 AWG): class 2 0.727, class 5 0.780 Ω/km → × 1.073
    expect(fineStrandFactor('4')).toBeCloseTo(0.78 / 0.727, 6);
    for (const gauge of AWG_SIZES) {
      expect(conductorResistancePerMetre(gauge, 'fine-stranded', 20)).toBeGreaterThanOrEqual(
        conductorResistancePerMetre(gauge, 'stranded', 20),
      );
    }
  });
});
