// Capacity samples combined into a monthly series and a present estimate with its uncertainty.
import { CapacitySample, CapacityTrend } from './health-types';

/** Monthly inverse-variance means in `timeZone` and the present capacity against `ratedUsableAh`. */
export function capacityTrend(
  samples: readonly CapacitySample[],
  ratedUsableAh: number,
  timeZone: string,
): CapacityTrend {
  void samples;
  void ratedUsableAh;
  void timeZone;
  throw new Error('capacityTrend: implementation lands in the next commit');
}
