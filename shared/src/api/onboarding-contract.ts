// Shapes of setting up a system and its first monitor (/api/systems, /api/handovers, .../monitor-status).
import type { SystemSummary } from './api-contract';

/** POST /api/systems body: an installer of a company (with `ownerEmail`) or an owner (for themselves). */
export interface NewSystemRequest {
  name: string;
  kind: SystemSummary['kind'];
  nominalVoltage: SystemSummary['nominalVoltage'];
  chemistry: SystemSummary['chemistry'];
  ratedCapacityAh: number;
  usableCapacityAh: number;
  /** What the BMS lets through without limit, A. */
  bmsContinuousDischargeA: number;
  /** What the BMS lets through for a few seconds (inverter start, surge), A; at least the continuous rating. */
  bmsPeakDischargeA: number;
  /** Whether the BMS stops charging below freezing on its own. */
  coldChargeCutoff: boolean;
  /** IANA time zone, e.g. Europe/Oslo. */
  timeZone: string;
  /** The customer the system is set up for (installers only); they become its owner once they accept. */
  ownerEmail?: string;
}

/** POST /api/systems answer (201). The same whether or not `ownerEmail` already has an account. */
export interface CreatedSystem {
  system: SystemSummary;
  /** Present when set up for a customer: their address and until when the offer stands. */
  handover: { ownerEmail: string; expiresAt: number } | null;
}

/** A system set up for me, waiting for me to accept it (GET /api/handovers). */
export interface SystemHandover {
  id: string;
  systemId: string;
  systemName: string;
  offeredBy: string;
  companyName: string | null;
  createdAt: number;
  expiresAt: number;
}
// POST /api/handovers/:id/accept makes me the owner (200 { systemId }).
// DELETE /api/systems/:id/installer (owner) ends the installer company's rights (204).

/** Why the broker refused a monitor, by kind; counted per device on the node it connects to. */
export interface MonitorRefusals {
  /** Unknown device, wrong secret, revoked, client id not the device's, or slowed after many failures. */
  credentials: number;
  /** Published to a topic that is not the device's own. */
  topic: number;
  /** A payload that was not a valid SenML reading pack. */
  payload: number;
  /** The last refusal: its kind, its stable code and when, ms. */
  last: { kind: 'credentials' | 'topic' | 'payload'; code: string; at: number } | null;
}

/** GET /api/systems/:id/devices/:deviceId/status: has the first reading arrived, and if not, what went wrong. */
export interface MonitorStatus {
  deviceId: string;
  state: 'waiting' | 'arrived' | 'refused';
  /** When the newest stored reading of this device was measured, ms; null before the first. */
  lastSeenAt: number | null;
  latestReading: { measuredAt: number; voltage: number; current: number; temperature: number } | null;
  refusals: MonitorRefusals;
}
