import type { SystemSettings } from '@cellwarden/shared';
import type { Observable } from 'rxjs';
import { LoadState, dataFailure, toLoadState } from '../core/load-state';
import { SettingsApi } from '../core/settings-api';

/** One system's settings, starting with 'loading'. */
export function settingsLoad(api: SettingsApi, systemId: string): Observable<LoadState<SystemSettings>> {
  return toLoadState(
    api.settings(systemId),
    dataFailure('The settings could not be loaded. Reload the page to try again.'),
  );
}
