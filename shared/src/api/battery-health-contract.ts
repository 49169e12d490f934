// Shapes of the battery life-cycle screen and report (GET /api/systems/:id/battery-health and its downloads).
// Times are ms since the epoch; temperatures °C; charge Ah; energy Wh. The figures are shared/src/health's own.
import type { CapacityTrend, LifeCycleFigures } from '../health/health-types';

/** GET /api/systems/:id/battery-health. */
export interface BatteryHealthResponse {
  systemId: string;
  systemName: string;
  chemistry: 'lifepo4' | 'agm' | 'flooded';
  nominalVoltage: number;
  ratedCapacityAh: number;
  usableCapacityAh: number;
  /** IANA time zone the months and episode dates are given in. */
  timeZone: string;
  /** First and last hour the life-cycle figures cover; null before any rollup was consumed. */
  period: { from: number; to: number } | null;
  /** Monthly estimates with their 1σ band and the present estimate (absent before the first sample). */
  capacity: CapacityTrend;
  /** Capacity samples the trend was made from. */
  sampleCount: number;
  figures: LifeCycleFigures | null;
  /** Plain sentences, the first the headline. */
  words: string[];
  /** How the estimate is made, with its published basis. */
  method: string;
  /** Whether the asking person may download the report (owner and those with export rights). */
  mayExport: boolean;
  /** Rollups that reached the store after the job had passed them, when any: what was done about them. */
  lateDataNote: string | null;
}

/** Longest period a report may cover, days. */
export const HEALTH_REPORT_MAX_DAYS = 800;
