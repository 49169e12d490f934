// The vocabulary of flags: which conditions exist, how bad one is, and what the engine reports about them.

import type { FlagKind, FlagSeverity } from '../api/alerts-contract';

export type { FlagKind, FlagSeverity };

/** Every condition the flag engine watches (the API contract's `FlagKind`, as a list). */
export const FLAG_KINDS = [
  'low-charge',
  'low-voltage',
  'cold-charging',
  'cold-charge-ahead',
  'hot-charging',
  'cold-charge-current',
  'over-temperature',
  'over-discharge',
  'bms-cutoff-suspected',
  'device-silent',
  'charger-under-delivering',
  'soc-disagreement',
  'circuit-near-rating',
] as const satisfies readonly FlagKind[];

// Fails to compile if the contract gains a kind this list lacks.
const everyKindListed: FlagKind extends (typeof FLAG_KINDS)[number] ? true : never = true;
void everyKindListed;

/**
 * What happened to a flag: it started, it ended, or it worsened from warning to critical while active
 * (`escalate`). A flag never de-escalates while active; it ends, and may start again as a warning.
 */
export type FlagTransition = 'start' | 'escalate' | 'end';

/** One change in a flag, as the server stores it and the dashboard shows it. */
export interface FlagEvent {
  kind: FlagKind;
  transition: FlagTransition;
  severity: FlagSeverity;
  /** When the engine decided (the reading's `measuredAt`, or the silence check's now), ms. */
  at: number;
  /** The watched value at that moment. */
  value: number;
  unit: string;
  /** The worst value seen while the flag was active (so far, for start and escalate). */
  peak: number;
  /** For a flag about one charge source, that source's id. */
  sourceId?: string;
}

/** A flag that is active now. */
export interface ActiveFlag {
  kind: FlagKind;
  severity: FlagSeverity;
  /** When the condition first held (before the minimum duration had passed), ms. */
  since: number;
  /** The worst value seen so far. */
  peakValue: number;
  unit: string;
  sourceId?: string;
}
