import { Injectable, computed, inject, signal } from '@angular/core';
import type { FlagKind, UserPreferences } from '@cellwarden/shared';
import { Observable, tap } from 'rxjs';
import { Auth } from './auth';
import { SettingsApi } from './settings-api';
import type { TemperatureUnit } from './temperature-unit';

const DEFAULT_PREFERENCES: UserPreferences = { temperatureUnit: 'C', emailFlags: [] };

/** The signed-in person's preferences, loaded once from GET /api/me/preferences and shared by every screen. */
@Injectable({ providedIn: 'root' })
export class Preferences {
  private readonly api = inject(SettingsApi);
  private readonly auth = inject(Auth);
  private readonly current = signal<UserPreferences | null>(null);
  private requested = false;

  /** The unit every temperature on screen is shown in. */
  readonly temperatureUnit = computed<TemperatureUnit>(() => {
    this.ensureLoaded();
    return this.current()?.temperatureUnit ?? DEFAULT_PREFERENCES.temperatureUnit;
  });
  /** Flag kinds the person wants e-mail about. */
  readonly emailFlags = computed<FlagKind[]>(() => this.current()?.emailFlags ?? []);
  /** The loaded preferences, or null before they arrive. */
  readonly value = this.current.asReadonly();

  /** Loads the preferences (once per session); failures keep the defaults. */
  load(): Observable<UserPreferences> {
    this.requested = true;
    return this.api.preferences().pipe(tap((preferences) => this.current.set(preferences)));
  }

  /** Saves new preferences and applies them at once. */
  save(preferences: UserPreferences): Observable<UserPreferences> {
    return this.api.savePreferences(preferences).pipe(tap((saved) => this.current.set(saved)));
  }

  private ensureLoaded(): void {
    if (this.requested || !this.auth.isSignedIn()) return;
    this.requested = true;
    // Deferred so a template reading the unit does not write a signal while it renders.
    queueMicrotask(() => this.load().subscribe({ error: () => undefined }));
  }
}
