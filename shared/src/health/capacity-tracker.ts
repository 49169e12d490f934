// Usable capacity measured from the data: amp-hours counted from a full-charge sync to a later point whose
// state of charge is known (a rested open-circuit voltage low on the curve, or a BMS low-voltage cut-off).
import { BatterySetup } from '../analytics/battery-setup';
import { CapacitySample, CapacityTrackerState, MinuteSummary } from './health-types';

/** A capacity tracker for one battery: feed it minutes in order, keep its state() between runs. */
export interface CapacityTracker {
  /** Takes one minute; returns a capacity sample when this minute completes one. */
  push(minute: MinuteSummary): CapacitySample | undefined;
  /** The JSON state to persist and resume from. */
  state(): CapacityTrackerState;
}

/** Creates a tracker for `setup`, resuming from `state` when given. */
export function createCapacityTracker(setup: BatterySetup, state?: CapacityTrackerState): CapacityTracker {
  void setup;
  void state;
  throw new Error('createCapacityTracker: implementation lands in the next commit');
}
