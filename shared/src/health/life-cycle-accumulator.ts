// Life-cycle figures built hour by hour from the hourly rollups, resumable from a persisted JSON state.
import { HourSummary, LifeCycleFigures, LifeCycleState } from './health-types';

/** A life-cycle accumulator for one battery. */
export interface LifeCycleAccumulator {
  /** Takes one hour (in order; an hour not after the last one is ignored). */
  push(hour: HourSummary): void;
  /** The figures so far. */
  figures(): LifeCycleFigures;
  /** The JSON state to persist and resume from. */
  state(): LifeCycleState;
}

/** Creates an accumulator for a battery of `usableAh`, resuming from `state` when given. */
export function createLifeCycleAccumulator(usableAh: number, state?: LifeCycleState): LifeCycleAccumulator {
  void usableAh;
  void state;
  throw new Error('createLifeCycleAccumulator: implementation lands in the next commit');
}
