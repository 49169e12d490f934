// Public surface of shared/src/health: capacity estimated from the data, life-cycle figures, plain words.
export type * from './health-types';
export type { CapacityTracker } from './capacity-tracker';
export { createCapacityTracker } from './capacity-tracker';
export { capacityTrend } from './capacity-trend';
export type { LifeCycleAccumulator } from './life-cycle-accumulator';
export { createLifeCycleAccumulator } from './life-cycle-accumulator';
export { healthWords } from './health-words';
export { rollUpHour, hoursOf } from './hour-rollup';
export {
  COLD_CHARGE_BELOW_C,
  HOT_CHARGE_ABOVE_C,
  HOT_STORAGE_FROM_C,
  HIGH_CHARGE_FROM_PERCENT,
  FULL_FROM_PERCENT,
  DEPTH_BAND_PERCENT,
} from './life-cycle-accumulator';
export { CAPACITY_REST_MINUTES, MIN_SAMPLE_DEPTH } from './capacity-measurement';
export { CURRENT_WINDOW_DAYS } from './capacity-trend';
