// A circuit's design figures against what the monitor measured on it: the peak (and how long it lasted)
// against the ratings that answer to short currents, the 99th percentile against those that answer to
// sustained ones, in plain words, with a standing the flag machinery can raise.
import type { RatingComparison, RatingStanding } from '../api/install-register-contract';
import { CONTINUOUS_LOAD_FACTOR } from './fuse-ratings';
import { formatAmount } from './installer-finding';

/**
 * A measured current counts as close to a rating from this fraction of it: 1 / 1.25 = 80 %, the 125 %
 * continuous-load factor of NEC 210.19(A)(1) and 210.20(A) read the other way — a conductor or fuse should
 * carry a continuous load at no more than 80 % of its rating. Applied to peak ratings too (common practice).
 */
export const CLOSE_TO_RATING_FRACTION = 1 / CONTINUOUS_LOAD_FACTOR;

/** A peak's surroundings count as the peak while within this fraction of it (common practice: 10 %). */
export const PEAK_BAND_FRACTION = 0.9;

/** The ratings a circuit's measured current is compared with. */
export interface CircuitRatings {
  fuseA: number;
  protectionDevice: 'fuse' | 'breaker';
  /** The conductor's derated ampacity, A, and its insulation rating, °C. */
  conductorA: number | null;
  insulationRatingC: number;
  /** The BMS's ratings, for circuits the battery's current flows through. */
  bmsContinuousA?: number;
  bmsPeakA?: number;
}

/** What the monitor measured on a circuit over a window. */
export interface MeasuredCurrent {
  samples: number;
  peakA: number | null;
  peakSeconds: number | null;
  p99A: number | null;
}

/** The comparisons, the worst standing among them, and a sentence saying so. */
export interface DesignComparison {
  comparisons: RatingComparison[];
  standing: RatingStanding | 'no-data';
  /** The highest measured / limit ratio, for the flag's peak value (%). */
  worstPercent: number | null;
  sentence: string;
}

/** The nearest-rank percentile (Hyndman & Fan 1996, definition 1; PostgreSQL's percentile_disc). */
export function nearestRankPercentile(values: readonly number[], fraction: number): number | undefined {
  if (values.length === 0) return undefined;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.max(0, Math.ceil(fraction * sorted.length) - 1)];
}

/**
 * How long the current stayed near its peak, s: the run of readings within PEAK_BAND_FRACTION of the peak
 * that holds it, each reading standing for the time until the next (the last one for the gap before it).
 */
export function peakDurationSeconds(samples: readonly { at: number; currentA: number }[]): number | null {
  if (samples.length === 0) return null;
  let peakIndex = 0;
  samples.forEach((s, i) => {
    if (Math.abs(s.currentA) > Math.abs(samples[peakIndex].currentA)) peakIndex = i;
  });
  const band = Math.abs(samples[peakIndex].currentA) * PEAK_BAND_FRACTION;
  const near = (i: number) => Math.abs(samples[i].currentA) >= band;
  let first = peakIndex;
  let last = peakIndex;
  while (first > 0 && near(first - 1)) first--;
  while (last < samples.length - 1 && near(last + 1)) last++;
  const lastGap =
    last < samples.length - 1
      ? samples[last + 1].at - samples[last].at
      : last > 0
        ? samples[last].at - samples[last - 1].at
        : 0;
  return (samples[last].at - samples[first].at + lastGap) / 1000;
}

function standingOf(measuredA: number, limitA: number): RatingStanding {
  if (measuredA > limitA) return 'over';
  return measuredA >= limitA * CLOSE_TO_RATING_FRACTION ? 'close' : 'within';
}

const RATING_WORDS: Record<RatingComparison['rating'], string> = {
  fuse: 'fuse',
  conductor: 'conductor',
  'bms-continuous': 'BMS continuous rating',
  'bms-peak': 'BMS peak rating',
};

/**
 * Compares a circuit's measured current with its ratings. A fuse (or breaker) and a BMS peak rating answer to
 * the peak: a protective device opens on current above its rating, sooner the higher. A conductor's ampacity
 * and a BMS continuous rating are thermal, continuous ratings: a few seconds do not heat copper or cells, so
 * they take the 99th percentile (what the current stays under 99 % of the time).
 */
export function compareWithRatings(
  circuitName: string,
  measured: MeasuredCurrent,
  ratings: CircuitRatings,
  /** How a temperature reads in the sentence (the viewer's unit); °C by default. */
  temperature: (celsius: number) => string = (celsius) => `${celsius} °C`,
): DesignComparison {
  if (measured.samples === 0 || measured.peakA === null || measured.p99A === null)
    return {
      comparisons: [],
      standing: 'no-data',
      worstPercent: null,
      sentence: `${circuitName}: no measured current in this window yet`,
    };
  const peak = measured.peakA;
  const p99 = measured.p99A;
  const comparisons: RatingComparison[] = [];
  const add = (rating: RatingComparison['rating'], limitA: number, measure: 'peak' | 'p99') =>
    comparisons.push({
      rating,
      limitA,
      measure,
      measuredA: measure === 'peak' ? peak : p99,
      standing: standingOf(measure === 'peak' ? peak : p99, limitA),
    });
  add('fuse', ratings.fuseA, 'peak');
  if (ratings.conductorA !== null) add('conductor', ratings.conductorA, 'p99');
  if (ratings.bmsContinuousA !== undefined) {
    add('bms-continuous', ratings.bmsContinuousA, 'p99');
  }
  if (ratings.bmsPeakA !== undefined) add('bms-peak', ratings.bmsPeakA, 'peak');
  const worst = comparisons.reduce((a, b) => (b.measuredA / b.limitA > a.measuredA / a.limitA ? b : a));
  const standing: RatingStanding = comparisons.some((c) => c.standing === 'over')
    ? 'over'
    : comparisons.some((c) => c.standing === 'close')
      ? 'close'
      : 'within';
  return {
    comparisons,
    standing,
    worstPercent: (worst.measuredA / worst.limitA) * 100,
    sentence: sentenceFor(circuitName, measured, ratings, comparisons, standing, temperature),
  };
}

function sentenceFor(
  circuitName: string,
  measured: MeasuredCurrent,
  ratings: CircuitRatings,
  comparisons: RatingComparison[],
  standing: RatingStanding,
  temperature: (celsius: number) => string,
): string {
  const amps = (value: number) => `${formatAmount(value)} A`;
  const lasted = measured.peakSeconds === null ? '' : ` for ${formatAmount(measured.peakSeconds)} s`;
  const limits = comparisons.map((c) => {
    if (c.rating === 'fuse') return `${ratings.protectionDevice} ${amps(c.limitA)}`;
    if (c.rating === 'conductor')
      return `conductor ${amps(c.limitA)} at ${temperature(ratings.insulationRatingC)}`;
    return c.rating === 'bms-peak' ? `BMS ${amps(c.limitA)} peak` : `BMS ${amps(c.limitA)} continuous`;
  });
  const head = `${circuitName} peaked at ${amps(measured.peakA!)}${lasted}, 99 % of the time at or below ${amps(measured.p99A!)} — ${limits.join(', ')}`;
  if (standing === 'within') return `${head}: within limits`;
  const named = comparisons
    .filter((c) => c.standing === standing)
    .map(
      (c) =>
        `${c.measure === 'peak' ? 'the peak' : 'the 99th percentile'} is ${Math.round((c.measuredA / c.limitA) * 100)} % of the ${RATING_WORDS[c.rating]}`,
    );
  return standing === 'over'
    ? `${head}: over a rating — ${named.join('; ')}`
    : `${head}: close to a rating (80 % or more) — ${named.join('; ')}`;
}
