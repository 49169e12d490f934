import type { SystemSettings } from '@cellwarden/shared';
import { Observable, catchError, map, of, startWith } from 'rxjs';
import { ApiProblem, apiProblem } from '../core/api-error';
import { SettingsApi } from '../core/settings-api';

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
