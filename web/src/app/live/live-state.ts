import type {
  AlertEvent,
  DerivedState,
  MonitorLatest,
  ReceivedReading,
  SystemStatus,
} from '@cellwarden/shared';
import type { SystemStreamEvent } from '../core/live-stream';

/** An active flag as the live view shows it. */
export type ActiveFlag = DerivedState['activeFlags'][number];

/** What the live view knows about one system at a moment. */
export interface LiveState {
  reading: ReceivedReading | null;
  derived: DerivedState | null;
  /** Active flags: from the derived state, kept current by alert messages between readings. */
  flags: ActiveFlag[];
  /** Time between the last two readings, ms; null until two have arrived. */
  intervalMs: number | null;
  /** The server ended this person's access to the system. */
  accessEnded: boolean;
  /** Every monitor of the bank with its newest reading, lead first; `reading` above is the lead's. */
  monitors: MonitorLatest[];
}

/** The state before anything has loaded. */
export const EMPTY_LIVE_STATE: LiveState = {
  reading: null,
  derived: null,
  flags: [],
  intervalMs: null,
  accessEnded: false,
  monitors: [],
};

/** The state from GET /api/systems/:id/status. */
export function seedLiveState(status: SystemStatus): LiveState {
  const flags = status.derived?.activeFlags ?? [];
  const fromAlerts = status.activeAlerts.filter((a) => a.endedAt === null).reduce(withAlert, flags);
  return {
    ...EMPTY_LIVE_STATE,
    reading: status.latestReading,
    derived: status.derived,
    flags: fromAlerts,
    // Absent from a status cached for offline use before monitors were listed.
    monitors: status.monitors ?? [],
  };
}

/** The state after one stream event; once access ended nothing changes it any more. */
export function applyStreamEvent(state: LiveState, event: SystemStreamEvent): LiveState {
  if (state.accessEnded) return state;
  switch (event.type) {
    case 'access-ended':
      return { ...state, accessEnded: true };
    case 'alert':
      return { ...state, flags: withAlert(state.flags, event.alert) };
    case 'reading':
      return withReading(state, event.reading, event.derived);
  }
}

/** The monitor the headline follows, when the status named one. */
export function leadMonitorId(state: LiveState): string | null {
  return state.monitors.find((m) => m.lead)?.deviceId ?? null;
}

function withReading(state: LiveState, reading: ReceivedReading, derived: DerivedState | null): LiveState {
  const monitors = withMonitorReading(state.monitors, reading);
  const lead = leadMonitorId(state);
  // Another monitor of the same bank updates its own row only: the headline never alternates between two.
  if (lead !== null && reading.deviceId !== undefined && reading.deviceId !== lead)
    return { ...state, monitors };
  const previous = state.reading;
  // An older reading arriving late (a device catching up) must not replace the newest values.
  if (previous && reading.measuredAt < previous.measuredAt) return { ...state, monitors };
  const intervalMs = previous
    ? reading.measuredAt - previous.measuredAt || state.intervalMs
    : state.intervalMs;
  return {
    ...state,
    monitors,
    reading,
    intervalMs,
    derived: derived ?? state.derived,
    flags: derived ? derived.activeFlags : state.flags,
  };
}

function withMonitorReading(monitors: MonitorLatest[], reading: ReceivedReading): MonitorLatest[] {
  if (reading.deviceId === undefined || monitors.length === 0) return monitors;
  const known = monitors.some((m) => m.deviceId === reading.deviceId);
  // A monitor added after the page opened shows under its id until the next status names it.
  const all = known
    ? monitors
    : [...monitors, { deviceId: reading.deviceId, label: reading.deviceId, lead: false, reading: null }];
  return all.map((m) =>
    m.deviceId === reading.deviceId && (!m.reading || m.reading.measuredAt <= reading.measuredAt)
      ? { ...m, reading }
      : m,
  );
}

function withAlert(flags: readonly ActiveFlag[], alert: AlertEvent): ActiveFlag[] {
  const others = flags.filter((f) => f.kind !== alert.kind);
  if (alert.endedAt !== null) return others;
  const flag: ActiveFlag = {
    kind: alert.kind,
    severity: alert.severity,
    since: alert.startedAt,
    peakValue: alert.peakValue,
  };
  return [...others, flag];
}
