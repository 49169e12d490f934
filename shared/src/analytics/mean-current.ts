// Net current averaged over a window, as an exponentially weighted mean with a time constant equal to the
// window: one number of state, O(1) per reading, and correct for irregular reading intervals
// (weight 1 − e^(−Δt/τ) for the newest reading).
import { BatteryReading } from '../telemetry/reading';

/** Default averaging window for the mean net current, minutes. */
export const DEFAULT_MEAN_WINDOW_MINUTES = 30;

/** The rolling summary of net current. */
export interface MeanCurrent {
  /** Mean net current, amperes (positive = charging). */
  meanCurrent: number;
  /** `measuredAt` of the last reading folded in, ms. */
  measuredAt: number;
}

/** Folds one reading into the rolling mean; readings older than the last are ignored. */
export function stepMeanCurrent(
  state: MeanCurrent | undefined,
  reading: BatteryReading,
  windowMinutes: number = DEFAULT_MEAN_WINDOW_MINUTES,
): MeanCurrent {
  if (state === undefined) return { meanCurrent: reading.current, measuredAt: reading.measuredAt };
  if (!(reading.measuredAt > state.measuredAt)) return state;
  const gap = reading.measuredAt - state.measuredAt;
  const weight = 1 - Math.exp(-gap / (windowMinutes * 60_000));
  return {
    meanCurrent: state.meanCurrent + weight * (reading.current - state.meanCurrent),
    measuredAt: reading.measuredAt,
  };
}
