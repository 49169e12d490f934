// The life of one flag, as a Schmitt trigger followed by a delay: the condition switches on when a rule's
// start threshold is crossed and off only when its release threshold is crossed (hysteresis); the flag
// starts once the condition has stayed on for the minimum duration, so a shorter spike starts nothing.
// Escalation to critical needs the critical threshold held for the same duration.
import { FlagEvent, FlagKind, FlagSeverity } from './flag-event';

/** What a rule says about its condition at one reading. */
export interface FlagSignal {
  /** The most severe level whose start threshold is crossed now; undefined when none is. */
  trigger?: FlagSeverity;
  /** Whether the condition is still on, judged against the release threshold. */
  holds: boolean;
  value: number;
  unit: string;
  /** Which way is worse, for the peak: `low` (charge, voltage) or `high` (temperature, current). */
  worse: 'low' | 'high';
  sourceId?: string;
}

/** The remembered life of one flag; absent while its condition is off. */
export interface FlagTrack {
  phase: 'pending' | 'active';
  /** When the condition switched on, ms. */
  since: number;
  severity: FlagSeverity;
  peak: number;
  unit: string;
  /** Since when a warning has been at the critical level, ms. */
  escalatingSince?: number;
  /** Since when an active flag's condition has stopped holding (it ends after the release delay), ms. */
  releasingSince?: number;
  sourceId?: string;
}

// A flag that is off and stays off: the answer of nearly every rule on nearly every reading, shared rather than
// made anew (frozen, so no caller can change it for the others).
const STAYS_OFF: { track: undefined; events: FlagEvent[] } = Object.freeze({
  track: undefined,
  events: Object.freeze([]) as unknown as FlagEvent[],
});

/** One step of a flag's life: the new track (undefined = off) and the events it produced. */
export function stepFlagTrack(
  kind: FlagKind,
  track: FlagTrack | undefined,
  signal: FlagSignal,
  at: number,
  minimumDurationMs: number,
  releaseDelayMs = 0,
): { track: FlagTrack | undefined; events: FlagEvent[] } {
  if (track === undefined) {
    if (signal.trigger === undefined) return STAYS_OFF;
    const started: FlagTrack = {
      phase: 'pending',
      since: at,
      severity: signal.trigger,
      peak: signal.value,
      unit: signal.unit,
    };
    if (signal.sourceId !== undefined) started.sourceId = signal.sourceId;
    return stepPending(kind, started, signal, at, minimumDurationMs);
  }
  if (!signal.holds) {
    if (track.phase !== 'active') return STAYS_OFF;
    // A short lapse (a heater's start-up surge pulling the net current negative) does not end the flag.
    const releasingSince = track.releasingSince ?? at;
    if (at - releasingSince < releaseDelayMs) {
      const releasing = copyTrack(track, true, true);
      releasing.releasingSince = releasingSince;
      return { track: releasing, events: [] };
    }
    return { track: undefined, events: [eventOf(kind, 'end', track, signal, at)] };
  }
  const updated = copyTrack(track, true, false);
  updated.peak = worseOf(track.peak, signal.value, signal.worse);
  if (signal.sourceId !== undefined) updated.sourceId = signal.sourceId;
  if (updated.phase === 'pending') return stepPending(kind, updated, signal, at, minimumDurationMs);
  return stepEscalation(kind, updated, signal, at, minimumDurationMs);
}

/** Ends the flag whatever the signal says (e.g. a silent device has spoken again). */
export function endFlagTrack(
  kind: FlagKind,
  track: FlagTrack | undefined,
  value: number,
  at: number,
): FlagEvent[] {
  if (track === undefined || track.phase !== 'active') return [];
  return [eventOf(kind, 'end', track, { holds: false, value, unit: track.unit, worse: 'high' }, at)];
}

function stepPending(
  kind: FlagKind,
  track: FlagTrack,
  signal: FlagSignal,
  at: number,
  minimumDurationMs: number,
): { track: FlagTrack; events: FlagEvent[] } {
  const severity = signal.trigger === 'critical' ? 'critical' : track.severity;
  const pending = copyTrack(track, true, true);
  pending.severity = severity;
  if (at - pending.since < minimumDurationMs) return { track: pending, events: [] };
  const active = copyTrack(pending, true, true);
  active.phase = 'active';
  return { track: active, events: [eventOf(kind, 'start', active, signal, at)] };
}

function stepEscalation(
  kind: FlagKind,
  track: FlagTrack,
  signal: FlagSignal,
  at: number,
  minimumDurationMs: number,
): { track: FlagTrack; events: FlagEvent[] } {
  if (track.severity === 'critical' || signal.trigger !== 'critical') {
    return { track: copyTrack(track, false, true), events: [] };
  }
  const escalatingSince = track.escalatingSince ?? at;
  if (at - escalatingSince < minimumDurationMs) {
    const escalating = copyTrack(track, true, true);
    escalating.escalatingSince = escalatingSince;
    return { track: escalating, events: [] };
  }
  const escalated = copyTrack(track, false, true);
  escalated.severity = 'critical';
  return { track: escalated, events: [eventOf(kind, 'escalate', escalated, signal, at)] };
}

/**
 * A track copied field by field, with or without its escalation and release timers: runs on every reading while a
 * flag is on, and V8 copies an object holding fractional numbers through its slow path when spread (`{ ...track }`).
 */
function copyTrack(track: FlagTrack, keepEscalating: boolean, keepReleasing: boolean): FlagTrack {
  const copy: FlagTrack = {
    phase: track.phase,
    since: track.since,
    severity: track.severity,
    peak: track.peak,
    unit: track.unit,
  };
  if (keepEscalating && track.escalatingSince !== undefined) copy.escalatingSince = track.escalatingSince;
  if (keepReleasing && track.releasingSince !== undefined) copy.releasingSince = track.releasingSince;
  if (track.sourceId !== undefined) copy.sourceId = track.sourceId;
  return copy;
}

function eventOf(
  kind: FlagKind,
  transition: FlagEvent['transition'],
  track: FlagTrack,
  signal: FlagSignal,
  at: number,
): FlagEvent {
  const event: FlagEvent = {
    kind,
    transition,
    severity: track.severity,
    at,
    value: signal.value,
    unit: track.unit,
    peak: track.peak,
  };
  if (track.sourceId !== undefined) event.sourceId = track.sourceId;
  return event;
}

function worseOf(a: number, b: number, worse: 'low' | 'high'): number {
  return worse === 'low' ? Math.min(a, b) : Math.max(a, b);
}
