import {
  ambientCorrectionFactor,
  bundleFactor,
  deratingFactors,
  deratingMultiplier,
} from './conductor-derating';

describe('conductor derating', () => {
  it('gives the NEC ambient correction factors based on 30 °C', () => {
    // NEC Table 310.15(B)(2)(a) (2014) / 310.15(B)(1) (2020) (secondary: published reprints), 60/75/90 °C:
    // 36–40 °C 0.82 0.88 0.91; 41–45 °C 0.71 0.82 0.87; 46–50 °C 0.58 0.75 0.82; 51–55 °C 0.41 0.67 0.76
    expect([60, 75, 90].map((r) => ambientCorrectionFactor(r as 60, 40))).toEqual([0.82, 0.88, 0.91]);
    expect([60, 75, 90].map((r) => ambientCorrectionFactor(r as 60, 43))).toEqual([0.71, 0.82, 0.87]);
    expect([60, 75, 90].map((r) => ambientCorrectionFactor(r as 60, 50))).toEqual([0.58, 0.75, 0.82]);
    expect([60, 75, 90].map((r) => ambientCorrectionFactor(r as 60, 55))).toEqual([0.41, 0.67, 0.76]);
    // same table, 21–25 °C: 1.08 1.05 1.04; 26–30 °C: 1.00
    expect([60, 75, 90].map((r) => ambientCorrectionFactor(r as 60, 25))).toEqual([1.08, 1.05, 1.04]);
    expect(ambientCorrectionFactor(105, 30)).toBe(1);
    // 60 °C insulation has no row from 56 °C on
    expect(ambientCorrectionFactor(60, 58)).toBe(0);
  });

  it('gives the engine-space factors of 33 CFR 183.425 Table 5 note 1', () => {
    // 33 CFR 183.425 Table 5 note 1 (as ABYC E-11; from memory): 60 °C 0.58, 75 °C 0.75, 90 °C 0.82, 105 °C 0.86
    const engine = (rating: 60 | 75 | 90 | 105) =>
      deratingMultiplier(deratingFactors(rating, { ambientC: 30, engineSpace: true, bundledConductors: 1 }));
    expect([engine(60), engine(75), engine(90), engine(105)]).toEqual([0.58, 0.75, 0.82, 0.86]);
  });

  it('gives the bundling factors of 33 CFR 183.425 Table 5 note 2', () => {
    // 33 CFR 183.425 Table 5 note 2 (secondary: USCG guideline reprinted in a marine catalogue):
    // 3 → 0.70, 4–6 → 0.60, 7–24 → 0.50, 25 and over → 0.40
    expect([1, 2, 3, 4, 6, 7, 24, 25, 40].map(bundleFactor)).toEqual([
      1, 1, 0.7, 0.6, 0.6, 0.5, 0.5, 0.4, 0.4,
    ]);
  });

  it('multiplies the factors, taking the hotter of the engine space and the ambient', () => {
    // NEC 310.15: ambient and bundling factors multiply; 105 °C at 40 °C: √(65/75) = 0.93; × 0.7 for 3 bundled
    const factors = deratingFactors(105, { ambientC: 40, engineSpace: false, bundledConductors: 3 });
    expect(factors.map((f) => f.factor)).toEqual([0.93, 0.7]);
    expect(deratingMultiplier(factors)).toBeCloseTo(0.651, 6);
    // 60 °C ambient in an engine space beats its 50 °C assumption: √(45/75) = 0.77 < 0.86
    expect(deratingFactors(105, { ambientC: 60, engineSpace: true, bundledConductors: 1 })).toEqual([
      expect.objectContaining({ code: 'ambient', factor: 0.77 }),
    ]);
  });
});
