// Public surface of shared/src/health: capacity estimated from the data, life-cycle figures, plain words.
export type * from './health-types';
export type { CapacityTracker } from './capacity-tracker';
export { createCapacityTracker } from './capacity-tracker';
export { capacityTrend } from './capacity-trend';
export type { LifeCycleAccumulator } from './life-cycle-accumulator';
export { createLifeCycleAccumulator } from './life-cycle-accumulator';
export { healthWords } from './health-words';
