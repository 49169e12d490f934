// What the flag rules need to know about one system besides the reading itself.
import type { ChargeSource } from '../api/settings-contract';
import { BatterySetup } from './battery-setup';
import { FlagThresholds } from './flag-thresholds';

/** What the rules need of a charge source (the settings contract's, without its label). */
export type ChargeSourceRating = Pick<ChargeSource, 'id' | 'kind' | 'ratedCurrentA'>;

/** Per-system inputs of the flag engine. */
export interface FlagSettings {
  battery: BatterySetup;
  thresholds: FlagThresholds;
  sources?: readonly ChargeSourceRating[];
}

/** What the engine remembers of recent readings for rules that need a trend or a before-and-after. */
export interface FlagMemory {
  previous?: { measuredAt: number; current: number; temperature: number; compensatedVoltage: number };
  /** Smoothed rate of change of pack temperature, °C per hour (negative = cooling). */
  temperatureTrendCPerHour?: number;
}
