// The shapes of Cellwarden's HTTP API that the server sends and the dashboard reads: one definition for both.
import type { BatteryReading } from '../telemetry/reading';

/** A reading as the server stored it, with the time it arrived and the monitor that measured it. */
export type ReceivedReading = BatteryReading & { receivedAt: number; deviceId?: string };

/** One battery monitor of a system with its newest reading (GET /api/systems/:id/status). */
export interface MonitorLatest {
  deviceId: string;
  label: string;
  /** The monitor the system's headline, analytics and raw history follow. */
  lead: boolean;
  reading: ReceivedReading | null;
}

/** What one may do to one system (the access rule, server/src/access/access-policy.ts, decides). */
export const SYSTEM_ACTIONS = [
  'view', // read readings, status, alerts, settings
  'export',
  'configure', // change settings, acknowledge alerts, upload photos and logs
  'manage-devices',
  'manage-grants',
  'read-audit',
  'commission',
] as const;
export type SystemAction = (typeof SYSTEM_ACTIONS)[number];

/** One battery system the signed-in user may see, as GET /api/systems returns it. */
export interface SystemSummary {
  id: string;
  name: string;
  kind: 'van' | 'cabin' | 'boat';
  chemistry: 'lifepo4' | 'agm' | 'flooded';
  nominalVoltage: 12 | 24 | 48;
  ratedCapacityAh: number;
  usableCapacityAh: number;
  latestReading: ReceivedReading | null;
  /** Flags open on the system now, worst first. */
  activeFlags?: {
    kind: import('./alerts-contract').FlagKind;
    severity: import('./alerts-contract').FlagSeverity;
  }[];
  /** When any of its monitors last reported, ms; null when none ever did. */
  lastSeenAt?: number | null;
  /**
   * What the asking person may do with it, as the access rule decides (GET /api/systems/:id only), so a screen
   * can show a form read-only before anyone tries.
   */
  allowedActions?: SystemAction[];
}

/** One point of GET /api/systems/:id/readings. */
export interface HistoryPoint {
  measuredAt: number;
  voltage: number;
  current: number;
  temperature: number;
  stateOfCharge?: number;
  /** Extremes and energy of the bucket, present when the series is served from rollups (buckets ≥ 1 min). */
  voltageMin?: number;
  voltageMax?: number;
  currentMin?: number;
  currentMax?: number;
  ahIn?: number;
  ahOut?: number;
  whIn?: number;
  whOut?: number;
}

/** The error body every API endpoint uses. */
export interface ApiErrorBody {
  error: { code: string; message: string; field?: string };
}
