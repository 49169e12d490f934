import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { SystemSettings, UserPreferences } from '@cellwarden/shared';
import { Observable, map } from 'rxjs';
import { systemPath } from './api';

/** Typed client for system settings and the signed-in person's preferences. */
@Injectable({ providedIn: 'root' })
export class SettingsApi {
  private readonly http = inject(HttpClient);

  /** The settings of one system, with the chemistry's threshold defaults. */
  settings(systemId: string): Observable<SystemSettings> {
    return this.http
      .get<{ settings: SystemSettings }>(systemPath(systemId, '/settings'))
      .pipe(map((body) => body.settings));
  }

  /** Saves the settings of one system; 403 when the user may not configure it. */
  saveSettings(systemId: string, settings: SystemSettings): Observable<SystemSettings> {
    return this.http
      .put<{ settings: SystemSettings }>(systemPath(systemId, '/settings'), settings)
      .pipe(map((body) => body.settings));
  }

  /** The signed-in person's preferences. */
  preferences(): Observable<UserPreferences> {
    return this.http
      .get<{ preferences: UserPreferences }>('/api/me/preferences')
      .pipe(map((body) => body.preferences));
  }

  /** Saves the signed-in person's preferences. */
  savePreferences(preferences: UserPreferences): Observable<UserPreferences> {
    return this.http
      .put<{ preferences: UserPreferences }>('/api/me/preferences', preferences)
      .pipe(map((body) => body.preferences));
  }
}
