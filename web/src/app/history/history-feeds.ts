import type { AlertEvent } from '@cellwarden/shared';
import type { Observable } from 'rxjs';
import { AlertsApi } from '../core/alerts-api';
import { Api, ReadingHistory } from '../core/api';
import { LoadState, dataFailure, toLoadState } from '../core/load-state';
import type { TimeRange } from '../core/time-range';

/** The downsampled readings of a range. */
export function historyReadings(
  api: Api,
  id: string,
  range: TimeRange,
): Observable<LoadState<ReadingHistory>> {
  return toLoadState(
    api.readings(id, new Date(range.from), new Date(range.to)),
    dataFailure('The readings could not be loaded. Try another range or reload the page.'),
  );
}

/** The alerts that overlap a range. */
export function historyAlerts(
  api: AlertsApi,
  id: string,
  range: TimeRange,
): Observable<LoadState<AlertEvent[]>> {
  return toLoadState(
    api.alerts(id, { from: new Date(range.from), to: new Date(range.to) }),
    dataFailure('The alerts could not be loaded.'),
  );
}

/** Words for the server's downsampling resolution ("raw", "300s", "5m", "1h"): "one point per 4 min". */
export function resolutionText(resolution: string): string {
  if (resolution === 'raw') return 'every stored reading';
  const match = /^(\d+(?:\.\d+)?)([smhd])$/.exec(resolution);
  if (!match) return resolution;
  const seconds = Number(match[1]) * UNIT_SECONDS[match[2] as keyof typeof UNIT_SECONDS];
  const single = SINGLE_UNIT_WORDS[seconds];
  if (single) return `one point per ${single}`;
  return `one point per ${bucketWords(seconds)}`;
}

const UNIT_SECONDS = { s: 1, m: 60, h: 3600, d: 86400 } as const;
const SINGLE_UNIT_WORDS: Record<number, string> = { 1: 'second', 60: 'minute', 3600: 'hour', 86400: 'day' };

// Seconds as people say them: "20 s", "4 min", "4 h 23 min", "2 d 4 h".
function bucketWords(seconds: number): string {
  if (seconds < 90) return `${Math.round(seconds)} s`;
  const minutes = Math.round(seconds / 60);
  if (minutes < 90) return `${minutes} min`;
  if (minutes < 48 * 60) {
    const h = Math.floor(minutes / 60);
    const m = minutes % 60;
    return m === 0 ? `${h} h` : `${h} h ${m} min`;
  }
  const hours = Math.round(seconds / 3600);
  return hours % 24 === 0 ? `${hours / 24} d` : `${Math.floor(hours / 24)} d ${hours % 24} h`;
}
