import type { Grant, SystemSettings } from '@cellwarden/shared';
import { HttpErrorResponse } from '@angular/common/http';
import { Observable, catchError, forkJoin, map, of, startWith } from 'rxjs';
import { AccessApi } from '../access/access-api';
import { ApiProblem, apiProblem } from '../core/api-error';
import { SettingsApi } from '../core/settings-api';
import type { OwnerAnswer } from './configure-right';

/** Loading, failed, or the settings. */
export type SettingsLoad =
  { phase: 'loading' } | { phase: 'error'; problem: ApiProblem } | { phase: 'ready'; value: SystemSettings };

/** One system's settings, starting with 'loading'. */
export function settingsLoad(api: SettingsApi, systemId: string): Observable<SettingsLoad> {
  return api.settings(systemId).pipe(
    map((value): SettingsLoad => ({ phase: 'ready', value })),
    catchError((error: unknown) => of<SettingsLoad>({ phase: 'error', problem: apiProblem(error) })),
    startWith<SettingsLoad>({ phase: 'loading' }),
  );
}

/** What the dashboard can learn of the person's rights on a system before they try to change anything. */
export function rightsLoad(
  api: AccessApi,
  systemId: string,
): Observable<{ owner: OwnerAnswer; received: Grant[] | null }> {
  // Only the owner may list a system's grants (403 for anyone else who may see it).
  const owner = api.grants(systemId).pipe(
    map((): OwnerAnswer => 'owner'),
    catchError((error: unknown) =>
      of<OwnerAnswer>(error instanceof HttpErrorResponse && error.status === 403 ? 'not-owner' : 'unknown'),
    ),
  );
  const received = api.receivedGrants().pipe(catchError(() => of(null)));
  return forkJoin({ owner, received });
}
