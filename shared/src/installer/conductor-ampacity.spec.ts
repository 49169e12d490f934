import { conductorAmpacity } from './conductor-ampacity';

describe('conductor ampacity', () => {
  it('reads the 105 °C column of the marine DC table', () => {
    // 33 CFR 183.425 Table 5 (as ABYC E-11), 105 °C: 18 AWG 20 A, 10 AWG 60 A, 4 AWG 160 A, 1/0 285 A, 4/0 445 A
    expect(conductorAmpacity('18', 105)).toBe(20);
    expect(conductorAmpacity('10', 105)).toBe(60);
    expect(conductorAmpacity('4', 105)).toBe(160);
    expect(conductorAmpacity('1/0', 105)).toBe(285);
    expect(conductorAmpacity('4/0', 105)).toBe(445);
  });

  it('reads the lower insulation ratings of the same table', () => {
    // 33 CFR 183.425 Table 5: 4 AWG 105 A at 60 °C, 125 A at 75 °C, 135 A at 90 °C
    expect(conductorAmpacity('4', 60)).toBe(105);
    expect(conductorAmpacity('4', 75)).toBe(125);
    expect(conductorAmpacity('4', 90)).toBe(135);
    // same table: 12 AWG 25 A at 60 °C, 2/0 265 A at 75 °C, 3 AWG 155 A at 90 °C
    expect(conductorAmpacity('3', 90)).toBe(155);
    expect(conductorAmpacity('12', 60)).toBe(25);
    expect(conductorAmpacity('2/0', 75)).toBe(265);
  });
});
