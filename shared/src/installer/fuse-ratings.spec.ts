import { COMMON_DC_FUSE_RATINGS_A, fuseRange } from './fuse-ratings';
import { verdictOf } from './installer-finding';

describe('fuse ratings', () => {
  it('puts the range between 125 % of the load and the ampacity', () => {
    // NEC 210.20(A) continuous-load rule: 40 A × 1.25 = 50 A; 33 CFR 183.425 Table 5, 105 °C: 8 AWG 80 A
    expect(fuseRange(40, 80)).toEqual({ minimumA: 50, maximumA: 80, standardRatingsA: [50, 60, 70, 80] });
  });

  it('leaves the range empty when the wire is too thin for the margin', () => {
    expect(fuseRange(60, 60).standardRatingsA).toEqual([]);
  });

  it('lists the common ratings in ascending order', () => {
    // Common practice: blade fuses from 1 A, bolt-down fuses to 500 A
    expect([...COMMON_DC_FUSE_RATINGS_A].sort((a, b) => a - b)).toEqual(COMMON_DC_FUSE_RATINGS_A);
    expect(COMMON_DC_FUSE_RATINGS_A[0]).toBe(1);
    expect(COMMON_DC_FUSE_RATINGS_A.at(-1)).toBe(500);
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
