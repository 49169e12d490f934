import { DOCUMENT, Injectable, effect, inject, signal } from '@angular/core';

const STORAGE_KEY = 'cellwarden.theme';
// The browser's own bar follows the theme: night indigo by day, the dark theme's surface (neutral tone 6) at night.
const BAR_COLOUR: Record<ThemeMode, string> = { light: '#2a266f', dark: '#131317' };

/** The colour scheme: light, or dark for living spaces at night. */
export type ThemeMode = 'light' | 'dark';

/** The chosen theme, remembered in localStorage, defaulting to prefers-color-scheme. */
@Injectable({ providedIn: 'root' })
export class Theme {
  private readonly document = inject(DOCUMENT);
  /** The current mode. */
  readonly mode = signal<ThemeMode>(this.initialMode());

  constructor() {
    effect(() => this.apply(this.mode()));
  }

  /** Switches between light and dark and remembers the choice. */
  toggle(): void {
    const next: ThemeMode = this.mode() === 'dark' ? 'light' : 'dark';
    this.mode.set(next);
    localStorage.setItem(STORAGE_KEY, next);
  }

  private initialMode(): ThemeMode {
    const stored = localStorage.getItem(STORAGE_KEY);
    if (stored === 'light' || stored === 'dark') return stored;
    const prefersDark = this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)').matches;
    return prefersDark ? 'dark' : 'light';
  }

  private apply(mode: ThemeMode): void {
    const root = this.document.documentElement;
    root.classList.toggle('cw-dark', mode === 'dark');
    root.classList.toggle('cw-light', mode === 'light');
    this.document.querySelector('meta[name="theme-color"]')?.setAttribute('content', BAR_COLOUR[mode]);
  }
}
