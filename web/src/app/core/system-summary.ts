import type { BatteryReading } from '@cellwarden/shared';

/** A reading as the server stored it, with the time it arrived. */
export type ReceivedReading = BatteryReading & { receivedAt: number };

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
}

/** One point of GET /api/systems/:id/readings. */
export interface HistoryPoint {
  measuredAt: number;
  voltage: number;
  current: number;
  temperature: number;
  stateOfCharge?: number;
}

/** A user as the auth endpoints return it. */
export interface User {
  id: string;
  email: string;
  displayName: string;
  roles: ('owner' | 'installer' | 'support' | 'admin')[];
}

/** The error body every API endpoint uses. */
export interface ApiErrorBody {
  error: { code: string; message: string; field?: string };
}
