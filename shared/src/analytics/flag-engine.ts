// Runs every flag rule on each reading of one system and keeps the small, JSON-serialisable state the
// rules and trackers need between readings. Device silence has no reading to run on, so the server calls
// `checkSilence` on a timer; the next reading ends it.
import { BatteryReading } from '../telemetry/reading';
import { ActiveFlag, FlagEvent, FlagKind } from './flag-event';
import { FLAG_RULES, FlagContext, FlagRule, loadCompensatedVoltage } from './flag-rules';
import { FlagMemory, FlagSettings } from './flag-settings';
import { endFlagTrack, FlagTrack, stepFlagTrack } from './flag-tracker';

/** Smoothing time constant of the temperature trend, ms. */
const TEMPERATURE_TREND_TAU_MS = 15 * 60_000;
/** A gap longer than this restarts the temperature trend, ms. */
const TREND_GAP_MS = 10 * 60_000;
const MS_PER_HOUR = 3_600_000;

// Listed once: the engine runs every rule on every reading of every system.
const RULES = Object.entries(FLAG_RULES) as [FlagKind, FlagRule][];

/** What the flag engine remembers for one system. */
export interface FlagState {
  tracks: Partial<Record<FlagKind, FlagTrack>>;
  /** `measuredAt` of the newest reading seen, ms. */
  lastReadingAt?: number;
  /** Silence threshold from the last settings seen, ms (the silence check receives no settings). */
  silentAfterMs: number;
  memory: FlagMemory;
}

/** The inputs of one engine step. */
export interface FlagInput {
  reading: BatteryReading;
  /** The state of charge to judge (reported or estimated) and the reported-vs-estimated gap. */
  estimate: { stateOfCharge: number; disagreement?: number };
  settings: FlagSettings;
}

/** Runs all reading-based rules once; a reading older than the newest seen changes nothing. */
export function stepFlags(
  state: FlagState | undefined,
  input: FlagInput,
): { state: FlagState; events: FlagEvent[] } {
  const { reading, settings } = input;
  const previous = state ?? emptyFlagState();
  if (previous.lastReadingAt !== undefined && reading.measuredAt <= previous.lastReadingAt) {
    return { state: previous, events: [] };
  }
  const silentFor = previous.lastReadingAt === undefined ? 0 : reading.measuredAt - previous.lastReadingAt;
  const silent = previous.tracks['device-silent'];
  const events: FlagEvent[] =
    silent === undefined ? [] : endFlagTrack('device-silent', silent, silentFor / 60_000, reading.measuredAt);

  // The tracks are built afresh rather than copied and pruned with `delete` (which would leave a slow object on
  // every reading); a rule whose flag is off and stays off adds nothing.
  const tracks: Partial<Record<FlagKind, FlagTrack>> = {};
  const context: FlagContext = {
    reading,
    estimate: input.estimate,
    settings,
    memory: previous.memory,
  };
  const { minimumDurationSeconds, releaseDelaySeconds } = settings.thresholds;
  for (const [kind, rule] of RULES) {
    const minimumMs = minimumDurationSeconds[kind] * 1000;
    const releaseMs = (releaseDelaySeconds?.[kind] ?? 0) * 1000;
    const step = stepFlagTrack(
      kind,
      previous.tracks[kind],
      rule(context),
      reading.measuredAt,
      minimumMs,
      releaseMs,
    );
    if (step.track !== undefined) tracks[kind] = step.track;
    for (const event of step.events) events.push(event);
  }
  // Kinds the engine has no rule for (none today but silence) keep their tracks as they were.
  for (const kind in previous.tracks)
    if (kind !== 'device-silent' && !(kind in FLAG_RULES))
      tracks[kind as FlagKind] = previous.tracks[kind as FlagKind];
  return {
    state: {
      tracks,
      lastReadingAt: reading.measuredAt,
      silentAfterMs: settings.thresholds.silentAfterMinutes * 60_000,
      memory: nextMemory(previous.memory, reading, settings),
    },
    events,
  };
}

/** Starts `device-silent` once no reading has arrived for the configured minutes before `nowMs`. */
export function checkSilence(state: FlagState, nowMs: number): { state: FlagState; events: FlagEvent[] } {
  if (state.lastReadingAt === undefined || state.tracks['device-silent'] !== undefined) {
    return { state, events: [] };
  }
  const silentMs = nowMs - state.lastReadingAt;
  if (silentMs < state.silentAfterMs) return { state, events: [] };
  const minutes = silentMs / 60_000;
  const track: FlagTrack = {
    phase: 'active',
    since: state.lastReadingAt,
    severity: 'warning',
    peak: minutes,
    unit: 'min',
  };
  const event: FlagEvent = {
    kind: 'device-silent',
    transition: 'start',
    severity: 'warning',
    at: nowMs,
    value: minutes,
    unit: 'min',
    peak: minutes,
  };
  return { state: { ...state, tracks: { ...state.tracks, 'device-silent': track } }, events: [event] };
}

/** The flags active now, most severe first. */
export function activeFlags(state: FlagState | undefined): ActiveFlag[] {
  if (state === undefined) return [];
  const active: ActiveFlag[] = [];
  for (const kind in state.tracks) {
    const track = state.tracks[kind as FlagKind];
    if (track === undefined || track.phase !== 'active') continue;
    const flag: ActiveFlag = {
      kind: kind as FlagKind,
      severity: track.severity,
      since: track.since,
      peakValue: track.peak,
      unit: track.unit,
    };
    if (track.sourceId !== undefined) flag.sourceId = track.sourceId;
    active.push(flag);
  }
  return active.length < 2
    ? active
    : active.sort((a, b) => severityRank(b) - severityRank(a) || a.since - b.since);
}

/** A fresh engine state, before any reading. */
export function emptyFlagState(): FlagState {
  return { tracks: {}, silentAfterMs: 10 * 60_000, memory: {} };
}

function nextMemory(memory: FlagMemory, reading: BatteryReading, settings: FlagSettings): FlagMemory {
  const next: FlagMemory = {
    previous: {
      measuredAt: reading.measuredAt,
      current: reading.current,
      temperature: reading.temperature,
      compensatedVoltage: loadCompensatedVoltage(reading, settings),
    },
  };
  const before = memory.previous;
  const gap = before === undefined ? Infinity : reading.measuredAt - before.measuredAt;
  if (before === undefined || gap > TREND_GAP_MS) return next;
  const slope = ((reading.temperature - before.temperature) / gap) * MS_PER_HOUR;
  const weight = 1 - Math.exp(-gap / TEMPERATURE_TREND_TAU_MS);
  // Starting from "steady" rather than the first step keeps one sensor quantum from reading as a plunge.
  const trend = memory.temperatureTrendCPerHour ?? 0;
  next.temperatureTrendCPerHour = trend + weight * (slope - trend);
  return next;
}

function severityRank(flag: ActiveFlag): number {
  return flag.severity === 'critical' ? 1 : 0;
}
