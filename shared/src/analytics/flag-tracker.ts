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
      ...(signal.sourceId === undefined ? {} : { sourceId: signal.sourceId }),
    };
    return stepPending(kind, started, signal, at, minimumDurationMs);
  }
  if (!signal.holds) {
    if (track.phase !== 'active') return STAYS_OFF;
    // A short lapse (a heater's start-up surge pulling the net current negative) does not end the flag.
    const releasingSince = track.releasingSince ?? at;
    if (at - releasingSince < releaseDelayMs) return { track: { ...track, releasingSince }, events: [] };
    return { track: undefined, events: [eventOf(kind, 'end', track, signal, at)] };
  }
  const updated: FlagTrack = { ...track, peak: worseOf(track.peak, signal.value, signal.worse) };
  delete updated.releasingSince;
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
  const pending: FlagTrack = { ...track, severity };
  if (at - pending.since < minimumDurationMs) return { track: pending, events: [] };
  const active: FlagTrack = { ...pending, phase: 'active' };
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
    const steady = { ...track };
    delete steady.escalatingSince;
    return { track: steady, events: [] };
  }
  const escalatingSince = track.escalatingSince ?? at;
  if (at - escalatingSince < minimumDurationMs) return { track: { ...track, escalatingSince }, events: [] };
  const escalated: FlagTrack = { ...track, severity: 'critical' };
  delete escalated.escalatingSince;
  return { track: escalated, events: [eventOf(kind, 'escalate', escalated, signal, at)] };
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
