// Welford's online algorithm: mean and variance in one pass and constant memory, numerically stable
// where the naive sum-of-squares loses precision (Welford 1962; Knuth, TAOCP vol. 2, 4.2.2).

/** Count, mean, spread and extremes of the samples seen so far. */
export interface RunningStatistics {
  /** Samples seen. */
  readonly count: number;
  /** Their mean (0 when none). */
  readonly mean: number;
  /** Sum of squared differences from the mean (Welford's M2). */
  readonly sumSquaredDeviations: number;
  /** Smallest sample (+∞ when none). */
  readonly min: number;
  /** Largest sample (−∞ when none). */
  readonly max: number;
}

/** Statistics of no samples. */
export const EMPTY_STATISTICS: RunningStatistics = {
  count: 0,
  mean: 0,
  sumSquaredDeviations: 0,
  min: Number.POSITIVE_INFINITY,
  max: Number.NEGATIVE_INFINITY,
};

/** The statistics with one more sample (a new object; the argument is unchanged). */
export function addSample(stats: RunningStatistics, sample: number): RunningStatistics {
  const count = stats.count + 1;
  const delta = sample - stats.mean;
  const mean = stats.mean + delta / count;
  return {
    count,
    mean,
    sumSquaredDeviations: stats.sumSquaredDeviations + delta * (sample - mean),
    min: Math.min(stats.min, sample),
    max: Math.max(stats.max, sample),
  };
}

/** Population standard deviation of the samples (0 for fewer than two). */
export function populationStandardDeviation(stats: RunningStatistics): number {
  return stats.count < 2 ? 0 : Math.sqrt(stats.sumSquaredDeviations / stats.count);
}
