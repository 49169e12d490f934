import {
  COMMON_DC_FUSE_RATINGS_A,
  fuseRange,
  maximumFuseRating,
  NEC_STANDARD_RATINGS_A,
} from './fuse-ratings';
import { verdictOf } from './installer-finding';

describe('fuse ratings', () => {
  it('puts the range between 125 % of the load and the ampacity when the ampacity is a standard rating', () => {
    // NEC 210.20(A) continuous-load rule: 40 A × 1.25 = 50 A; 33 CFR 183.425 Table 5, 105 °C: 8 AWG 80 A,
    // a standard rating in NEC 240.6(A), so NEC 240.4 caps the fuse there
    expect(fuseRange(40, 80)).toMatchObject({
      minimumA: 50,
      maximumA: 80,
      standardRatingsA: [50, 60, 70, 80],
      recommendedA: 50,
    });
  });

  it('allows the next standard rating above an ampacity that is not one (NEC 240.4(B))', () => {
    // NEC 240.4(B): Table 5 105 °C 2 AWG 210 A is not in NEC 240.6(A); the next rating up is 225 A
    expect(maximumFuseRating(210, 'nec', 12).maximumA).toBe(225);
    // 166.7 A × 1.25 = 208.3 A: nothing common between 208.3 and 210 A, 225 A under the allowance
    expect(fuseRange(2000 / 12, 210, { rules: 'nec' })).toMatchObject({
      standardRatingsA: [225],
      recommendedA: 225,
    });
  });

  it('allows 150 % of the ampacity on boats under 50 V and the next size within 150 % above (33 CFR 183.455(c))', () => {
    // 33 CFR 183.455(c)(1): 150 % × 120 A = 180 A
    expect(maximumFuseRating(120, 'marine', 12).maximumA).toBe(180);
    expect(maximumFuseRating(120, 'marine', 24).maximumA).toBe(180);
    // 33 CFR 183.455(c)(2): 50 V or more (a 48 V bank charges above 50 V): the next larger common rating, 125 A
    expect(maximumFuseRating(120, 'marine', 48).maximumA).toBe(125);
    expect(maximumFuseRating(100, 'marine', 48).maximumA).toBe(100);
  });

  it('leaves the range empty when the wire is too thin for the margin, whatever the rules', () => {
    expect(fuseRange(60, 60).standardRatingsA).toEqual([]);
    expect(fuseRange(60, 60, { rules: 'marine' })).toMatchObject({
      standardRatingsA: [],
      recommendedA: undefined,
    });
  });

  it('lists the common and the NEC standard ratings in ascending order', () => {
    // Common practice: blade fuses from 1 A, bolt-down fuses to 500 A
    expect([...COMMON_DC_FUSE_RATINGS_A].sort((a, b) => a - b)).toEqual(COMMON_DC_FUSE_RATINGS_A);
    expect(COMMON_DC_FUSE_RATINGS_A[0]).toBe(1);
    expect(COMMON_DC_FUSE_RATINGS_A.at(-1)).toBe(500);
    // NEC 240.6(A): 15 … 800 A with 110, 450 and the fuse-only 1, 3, 6, 10, 601 A
    expect([...NEC_STANDARD_RATINGS_A].sort((a, b) => a - b)).toEqual(NEC_STANDARD_RATINGS_A);
    expect(NEC_STANDARD_RATINGS_A).toEqual(expect.arrayContaining([1, 3, 6, 10, 45, 110, 450, 601, 800]));
  });
});

describe('installer verdict', () => {
  it('fails on any error and lists errors first', () => {
    const verdict = verdictOf([
      { severity: 'info', code: 'a', message: 'a' },
      { severity: 'error', code: 'b', message: 'b' },
      { severity: 'warning', code: 'c', message: 'c' },
    ]);
    expect(verdict.ok).toBe(false);
    expect(verdict.findings.map((f) => f.code)).toEqual(['b', 'c', 'a']);
    expect(verdictOf([{ severity: 'warning', code: 'c', message: 'c' }]).ok).toBe(true);
  });
});
