// Capacity samples combined into a monthly series and a present estimate with its uncertainty. Each
// estimate is an inverse-variance weighted mean (the minimum-variance combination of independent
// measurements; any statistics text, e.g. Taylor, "An Introduction to Error Analysis", 2nd ed., §7.2), widened
// when the samples scatter more than their own uncertainties allow (the Particle Data Group's scale factor
// √(χ²/(N−1)), Review of Particle Physics, "Introduction: averaging" — from memory), plus the errors every
// sample shares: the current sensor's zero offset and gain, which averaging cannot remove.
import { AnalyticsSettingError } from '../analytics/analytics-error';
import { CURRENT_OFFSET_SIGMA_A } from './capacity-measurement';
import { CapacitySample, CapacityTrend } from './health-types';
import { monthStartIn } from './month-start';

/** Gain (scale) error of the current sensor, fraction: shunt tolerance and calibration (common practice). */
export const CURRENT_GAIN_SIGMA = 0.005;

/**
 * The present estimate uses the samples of this many days up to the latest one: long enough for several
 * weekly samples, short enough that a fade of a few percent a year moves it by well under 1 % (a 90-day
 * window lags the truth by about 45 days of fade).
 */
export const CURRENT_WINDOW_DAYS = 90;

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;

/** Monthly inverse-variance means in `timeZone` and the present capacity against `ratedUsableAh`. */
export function capacityTrend(
  samples: readonly CapacitySample[],
  ratedUsableAh: number,
  timeZone: string,
): CapacityTrend {
  if (!Number.isFinite(ratedUsableAh) || ratedUsableAh <= 0) {
    throw new AnalyticsSettingError(
      'bad_battery_setup',
      'ratedUsableAh',
      `ratedUsableAh must be a positive number of Ah; got ${ratedUsableAh}`,
    );
  }
  const kept = bestPerSync(samples.filter(isSound)).sort((a, b) => a.at - b.at);
  const byMonth = new Map<number, CapacitySample[]>();
  for (const sample of kept) {
    const month = monthStartIn(sample.at, timeZone);
    byMonth.set(month, [...(byMonth.get(month) ?? []), sample]);
  }
  const months = [...byMonth.entries()].map(([monthStart, group]) => ({
    monthStart,
    ...combineSamples(group),
    samples: group.length,
  }));
  if (kept.length === 0) return { months };
  const asOf = kept[kept.length - 1].at;
  const recent = kept.filter((s) => s.at > asOf - CURRENT_WINDOW_DAYS * DAY_MS);
  const { usableAh, sigmaAh } = combineSamples(recent);
  return {
    months,
    current: {
      usableAh,
      sigmaAh,
      stateOfHealth: usableAh / ratedUsableAh,
      sigmaStateOfHealth: sigmaAh / ratedUsableAh,
      asOf,
    },
  };
}

/** Inverse-variance mean of samples, its statistical error scaled by the scatter, plus the shared errors. */
export function combineSamples(samples: readonly CapacitySample[]): { usableAh: number; sigmaAh: number } {
  let weightSum = 0;
  let weighted = 0;
  let sharedOffset = 0;
  for (const s of samples) {
    const w = 1 / (s.sigmaAh * s.sigmaAh);
    weightSum += w;
    weighted += w * s.usableAh;
    // The offset error of a count is offset × hours; relative to the capacity, offset × hours ÷ counted Ah.
    sharedOffset += (w * CURRENT_OFFSET_SIGMA_A * ((s.at - s.fullAt) / HOUR_MS)) / s.countedAh;
  }
  const usableAh = weighted / weightSum;
  let chiSquare = 0;
  for (const s of samples) chiSquare += ((s.usableAh - usableAh) / s.sigmaAh) ** 2;
  const scale = samples.length > 1 ? Math.max(1, Math.sqrt(chiSquare / (samples.length - 1))) : 1;
  const statistical = scale / Math.sqrt(weightSum);
  const shared = usableAh * Math.hypot(sharedOffset / weightSum, CURRENT_GAIN_SIGMA);
  return { usableAh, sigmaAh: Math.hypot(statistical, shared) };
}

/** Samples after one full-charge sync share its count; only the most certain of them is independent. */
function bestPerSync(samples: readonly CapacitySample[]): CapacitySample[] {
  const best = new Map<number, CapacitySample>();
  for (const s of samples) {
    const held = best.get(s.fullAt);
    if (held === undefined || s.sigmaAh / s.usableAh < held.sigmaAh / held.usableAh) best.set(s.fullAt, s);
  }
  return [...best.values()];
}

function isSound(s: CapacitySample): boolean {
  return (
    [s.at, s.fullAt, s.usableAh, s.sigmaAh, s.countedAh].every(Number.isFinite) &&
    s.usableAh > 0 &&
    s.sigmaAh > 0 &&
    s.countedAh > 0 &&
    s.at > s.fullAt
  );
}
