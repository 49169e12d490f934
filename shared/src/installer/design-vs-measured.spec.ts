import {
  CLOSE_TO_RATING_FRACTION,
  compareWithRatings,
  nearestRankPercentile,
  peakDurationSeconds,
} from './design-vs-measured';

const inverterFeed = {
  fuseA: 250,
  protectionDevice: 'fuse' as const,
  conductorA: 245,
  insulationRatingC: 105,
  bmsContinuousA: 200,
};

describe('design against measured', () => {
  it('takes the nearest-rank percentile', () => {
    // Hyndman & Fan (1996) definition 1: the smallest value with at least p of the data at or below it
    const hundred = Array.from({ length: 100 }, (_, i) => i + 1);
    expect(nearestRankPercentile(hundred, 0.99)).toBe(99);
    expect(nearestRankPercentile([5, 1, 3], 0.5)).toBe(3);
    expect(nearestRankPercentile([], 0.99)).toBeUndefined();
  });

  it('measures how long the current stayed within 10 % of its peak, each reading lasting until the next', () => {
    const at = (s: number) => s * 1000;
    const samples = [20, 30, 170, 181, 175, 40, 20].map((currentA, i) => ({ at: at(i), currentA }));
    // 170, 181, 175 are within 10 % of 181 (≥ 162.9): from 2 s to the next reading at 5 s
    expect(peakDurationSeconds(samples)).toBe(3);
    expect(
      peakDurationSeconds([
        { at: 0, currentA: -90 },
        { at: 10_000, currentA: -10 },
      ]),
    ).toBe(10);
    expect(peakDurationSeconds([])).toBeNull();
  });

  it('says an inverter feed within its ratings is within limits, in words', () => {
    const result = compareWithRatings(
      'inverter feed',
      { samples: 600, peakA: 181, peakSeconds: 4, p99A: 120 },
      inverterFeed,
    );
    expect(result.standing).toBe('within');
    expect(result.sentence).toBe(
      'inverter feed peaked at 181 A for 4 s, 99 % of the time at or below 120 A — fuse 250 A, conductor 245 A at 105 °C, BMS 200 A continuous: within limits',
    );
  });

  it("names the conductor's rating in the viewer's unit", () => {
    const result = compareWithRatings(
      'inverter feed',
      { samples: 600, peakA: 181, peakSeconds: 4, p99A: 120 },
      inverterFeed,
      // °F = °C × 9/5 + 32: 105 °C is 221 °F
      (c) => `${(c * 9) / 5 + 32} °F`,
    );
    expect(result.sentence).toContain('conductor 245 A at 221 °F');
  });

  it('is close from 80 % of a rating — the 125 % continuous-load factor read backwards (NEC 210.19(A)(1), 210.20(A))', () => {
    expect(CLOSE_TO_RATING_FRACTION).toBeCloseTo(0.8, 12);
    const result = compareWithRatings(
      'inverter feed',
      { samples: 600, peakA: 190, peakSeconds: 30, p99A: 165 },
      inverterFeed,
    );
    // p99 165 A ≥ 0.8 × 200 A BMS continuous = 160 A; peak 190 A < 0.8 × 250 A fuse = 200 A
    expect(result.standing).toBe('close');
    expect(result.comparisons.find((c) => c.rating === 'bms-continuous')).toMatchObject({
      measure: 'p99',
      standing: 'close',
    });
    expect(result.sentence).toMatch(
      /close to a rating .* the 99th percentile is 83 % of the BMS continuous rating/,
    );
  });

  it('is over when the peak passes the fuse or a BMS peak rating, and leaves the BMS continuous rating to the 99th percentile', () => {
    // 260 A peak against the 250 A fuse: 104 %
    const over = compareWithRatings(
      'main feed',
      { samples: 10, peakA: 260, peakSeconds: 2, p99A: 100 },
      inverterFeed,
    );
    expect(over.standing).toBe('over');
    expect(over.worstPercent).toBeCloseTo(104, 6);
    expect(over.comparisons.find((c) => c.rating === 'bms-continuous')).toMatchObject({
      measure: 'p99',
      standing: 'within',
    });
    const withPeak = compareWithRatings(
      'main feed',
      { samples: 10, peakA: 220, peakSeconds: 2, p99A: 100 },
      { ...inverterFeed, fuseA: 400, bmsPeakA: 300 },
    );
    // 220 A against a 300 A peak rating: 73 % — within; the p99 of 100 A against 200 A continuous: within
    expect(withPeak.standing).toBe('within');
  });

  it('says when there is nothing measured yet', () => {
    const result = compareWithRatings(
      'DC-DC output',
      { samples: 0, peakA: null, peakSeconds: null, p99A: null },
      inverterFeed,
    );
    expect(result).toMatchObject({ standing: 'no-data', comparisons: [], worstPercent: null });
  });
});
