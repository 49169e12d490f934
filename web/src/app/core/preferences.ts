import { Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
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
  private wasSignedIn = false;

  /** The unit every temperature on screen is shown in. */
  readonly temperatureUnit = computed<TemperatureUnit>(
    () => this.current()?.temperatureUnit ?? DEFAULT_PREFERENCES.temperatureUnit,
  );
  /** Flag kinds the person wants e-mail about. */
  readonly emailFlags = computed<FlagKind[]>(() => this.current()?.emailFlags ?? []);
  /** The loaded preferences, or null before they arrive. */
  readonly value = this.current.asReadonly();

  constructor() {
    effect(() => this.followSession(this.auth.isSignedIn()));
  }

  /** Loads the preferences from the server. */
  load(): Observable<UserPreferences> {
    return this.api.preferences().pipe(tap((preferences) => this.current.set(preferences)));
  }

  /** Saves new preferences and applies them at once. */
  save(preferences: UserPreferences): Observable<UserPreferences> {
    return this.api.savePreferences(preferences).pipe(tap((saved) => this.current.set(saved)));
  }

  // Each new session loads its own preferences; signing out forgets them.
  private followSession(signedIn: boolean): void {
    untracked(() => {
      if (signedIn) this.refresh();
      else if (this.wasSignedIn) this.current.set(null);
    });
    this.wasSignedIn = signedIn;
  }

  private refresh(): void {
    // A failure keeps the defaults (°C, no e-mail); the settings screen shows its own error.
    this.load().subscribe({ error: () => undefined });
  }
}
