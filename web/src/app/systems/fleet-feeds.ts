import { Signal } from '@angular/core';
import { toObservable } from '@angular/core/rxjs-interop';
import type { SystemStatus, SystemSummary } from '@cellwarden/shared';
import { EMPTY, Observable, catchError, from, mergeMap, scan, switchMap } from 'rxjs';
import { Api } from '../core/api';
import { LoadState, toLoadState } from '../core/load-state';

/** Loading, failed, or the systems. */
export type FleetLoad = LoadState<SystemSummary[]>;

// Statuses are fetched a few at a time so a large fleet does not flood the server.
const STATUS_CONCURRENCY = 4;

/** The systems the user may see, starting with 'loading'. */
export function fleetLoad(api: Api): Observable<FleetLoad> {
  // Whatever the cause, the list says the same (the connection is the usual one).
  return toLoadState(
    api.systems(),
    () => 'The systems could not be loaded. Check the connection and reload the page.',
  );
}

/** Each loaded system's status as it arrives; a status that fails is left out (the row shows the summary). */
export function statusesOf(api: Api, load: Signal<FleetLoad>): Observable<Map<string, SystemStatus>> {
  return toObservable(load).pipe(
    switchMap((state) => {
      if (state.status !== 'loaded') return EMPTY;
      return from(state.value).pipe(
        mergeMap((s) => api.status(s.id).pipe(catchError(() => EMPTY)), STATUS_CONCURRENCY),
        scan(
          (statuses, status) => new Map(statuses).set(status.systemId, status),
          new Map<string, SystemStatus>(),
        ),
      );
    }),
  );
}
