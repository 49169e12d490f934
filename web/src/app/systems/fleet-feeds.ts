import { Signal } from '@angular/core';
import { toObservable } from '@angular/core/rxjs-interop';
import type { SystemStatus, SystemSummary } from '@cellwarden/shared';
import { EMPTY, Observable, catchError, from, map, mergeMap, of, scan, startWith, switchMap } from 'rxjs';
import { Api } from '../core/api';
import { ApiProblem, apiProblem } from '../core/api-error';

/** Loading, failed, or the systems. */
export type FleetLoad =
  | { status: 'loading' }
  | { status: 'error'; problem: ApiProblem }
  | { status: 'loaded'; systems: SystemSummary[] };

// Statuses are fetched a few at a time so a large fleet does not flood the server.
const STATUS_CONCURRENCY = 4;

/** The systems the user may see, starting with 'loading'. */
export function fleetLoad(api: Api): Observable<FleetLoad> {
  return api.systems().pipe(
    map((systems): FleetLoad => ({ status: 'loaded', systems })),
    catchError((error: unknown) => of<FleetLoad>({ status: 'error', problem: apiProblem(error) })),
    startWith<FleetLoad>({ status: 'loading' }),
  );
}

/** Each loaded system's status as it arrives; a status that fails is left out (the row shows the summary). */
export function statusesOf(api: Api, load: Signal<FleetLoad>): Observable<Map<string, SystemStatus>> {
  return toObservable(load).pipe(
    switchMap((state) => {
      if (state.status !== 'loaded') return EMPTY;
      return from(state.systems).pipe(
        mergeMap((s) => api.status(s.id).pipe(catchError(() => EMPTY)), STATUS_CONCURRENCY),
        scan(
          (statuses, status) => new Map(statuses).set(status.systemId, status),
          new Map<string, SystemStatus>(),
        ),
      );
    }),
  );
}
