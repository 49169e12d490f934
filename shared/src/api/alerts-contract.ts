// Shapes of alert events and the derived state of a system (GET /api/systems/:id/alerts, /status, live stream).

/** A condition the flag engine watches for; the meaning and advice of each come from `describeFlag`. */
export type FlagKind =
  | 'low-charge'
  | 'low-voltage'
  | 'cold-charging'
  | 'cold-charge-ahead'
  | 'hot-charging'
  | 'cold-charge-current'
  | 'over-temperature'
  | 'over-discharge'
  | 'bms-cutoff-suspected'
  | 'device-silent'
  | 'charger-under-delivering'
  | 'soc-disagreement'
  | 'circuit-near-rating';

/** How urgent a flag is. */
export type FlagSeverity = 'warning' | 'critical';

/** One recorded alert: a flag from its start to its end. */
export interface AlertEvent {
  id: string;
  systemId: string;
  kind: FlagKind;
  severity: FlagSeverity;
  startedAt: number;
  /** Null while the flag is still active. */
  endedAt: number | null;
  /** The worst value seen while active, in `unit`. */
  peakValue: number | null;
  unit: string;
  acknowledgedAt: number | null;
  acknowledgedBy: { id: string; displayName: string } | null;
  note: string | null;
}

/** GET /api/systems/:id/alerts?from=&to=&active=true answers { alerts: AlertEvent[] }. */
export interface AlertsResponse {
  alerts: AlertEvent[];
}

/** POST /api/systems/:id/alerts/:alertId/acknowledge body; answers the updated AlertEvent. */
export interface AlertAcknowledgement {
  /** Up to 500 characters. */
  note: string;
}

/** What Cellwarden works out from the readings, beside the latest one. */
export interface DerivedState {
  stateOfCharge: number | null;
  stateOfChargeSource: 'reported' | 'estimated' | null;
  /** Hours until the usable floor at the recent mean load; null while charging or idle. */
  hoursToEmpty: number | null;
  /** Hours until full at the present charge current; null while discharging. */
  hoursToFull: number | null;
  /** Mean net current over the projection window, A (+ = into the battery). */
  meanCurrent: number | null;
  /** The projection to the next morning (07:00 in the system's time zone). */
  byMorning: { at: number; stateOfCharge: number; crossesLowAt: number | null } | null;
  activeFlags: { kind: FlagKind; severity: FlagSeverity; since: number; peakValue: number | null }[];
}

/** GET /api/systems/:id/status. */
export interface SystemStatus {
  systemId: string;
  latestReading: import('./api-contract').ReceivedReading | null;
  derived: DerivedState | null;
  activeAlerts: AlertEvent[];
  /** Every monitor in service on the system, lead first; a bank with two shows both, each labelled. */
  monitors: import('./api-contract').MonitorLatest[];
}
