import type { AlertEvent } from '@cellwarden/shared';
import { Observable, catchError, map, of, startWith } from 'rxjs';
import { AlertsApi } from '../core/alerts-api';
import { ApiProblem, apiProblem } from '../core/api-error';

/** How far back the alerts list reaches, ms (the longest range history shows). */
export const ALERTS_LOOKBACK_MS = 366 * 24 * 60 * 60 * 1000;

/** Loading, failed, or the alerts. */
export type AlertsLoad =
  { phase: 'loading' } | { phase: 'error'; problem: ApiProblem } | { phase: 'ready'; value: AlertEvent[] };

/** The alerts of the last year, starting with 'loading'. */
export function alertsLoad(api: AlertsApi, systemId: string): Observable<AlertsLoad> {
  const to = new Date();
  const from = new Date(to.getTime() - ALERTS_LOOKBACK_MS);
  return api.alerts(systemId, { from, to }).pipe(
    map((value): AlertsLoad => ({ phase: 'ready', value })),
    catchError((error: unknown) => of<AlertsLoad>({ phase: 'error', problem: apiProblem(error) })),
    startWith<AlertsLoad>({ phase: 'loading' }),
  );
}
