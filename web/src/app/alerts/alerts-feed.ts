import type { AlertEvent } from '@cellwarden/shared';
import type { Observable } from 'rxjs';
import { AlertsApi } from '../core/alerts-api';
import { LoadState, dataFailure, toLoadState } from '../core/load-state';

/** How far back the alerts list reaches, ms (the longest range history shows). */
export const ALERTS_LOOKBACK_MS = 366 * 24 * 60 * 60 * 1000;

/** The alerts of the last year, starting with 'loading'. */
export function alertsLoad(api: AlertsApi, systemId: string): Observable<LoadState<AlertEvent[]>> {
  const to = new Date();
  const from = new Date(to.getTime() - ALERTS_LOOKBACK_MS);
  return toLoadState(
    api.alerts(systemId, { from, to }),
    dataFailure('The alerts could not be loaded. Reload the page to try again.'),
  );
}
