import { addSample, EMPTY_STATISTICS, populationStandardDeviation } from './running-statistics';

describe('running statistics', () => {
  it('matches the textbook mean and population standard deviation', () => {
    const stats = [2, 4, 4, 4, 5, 5, 7, 9].reduce(addSample, EMPTY_STATISTICS);
    // Wikipedia "Standard deviation", basic example: 2, 4, 4, 4, 5, 5, 7, 9 → mean 5, σ 2
    expect(stats.mean).toBe(5);
    expect(populationStandardDeviation(stats)).toBeCloseTo(2, 12);
    expect([stats.min, stats.max, stats.count]).toEqual([2, 9, 8]);
  });

  it('stays precise for samples with a large offset', () => {
    // Knuth, TAOCP vol. 2, 4.2.2: the one-pass update keeps precision where Σx² − n·mean² cancels;
    // 1e9 + {4, 7, 13, 16} has σ = √22.5 ≈ 4.743
    const stats = [4, 7, 13, 16].map((x) => 1e9 + x).reduce(addSample, EMPTY_STATISTICS);
    expect(populationStandardDeviation(stats)).toBeCloseTo(Math.sqrt(22.5), 6);
  });

  it('reports no spread for a single sample', () => {
    expect(populationStandardDeviation(addSample(EMPTY_STATISTICS, 3))).toBe(0);
  });
});
