import { DOCUMENT, DestroyRef, Injectable, inject, signal } from '@angular/core';
import type { DerivedState, ReceivedReading, SystemStatus, SystemSummary } from '@cellwarden/shared';
import {
  EMPTY_COPY,
  parseCopy,
  withLiveReading,
  withStatus,
  withSystems,
  type OfflineCopy,
} from './offline-copy';

const STORAGE_KEY = 'cellwarden.last-values';

/**
 * The last values of each system, kept in localStorage for when the signal drops. The API answers with
 * `Cache-Control: no-store`, so the copy is the app's, written as answers arrive, and forgotten on sign-out.
 */
@Injectable({ providedIn: 'root' })
export class OfflineStore {
  private readonly window = inject(DOCUMENT).defaultView;
  /** Whether the browser has a network connection. */
  readonly online = signal(this.window?.navigator.onLine ?? true);
  /** The kept copy. */
  readonly copy = signal<OfflineCopy>(parseCopy(this.read()));

  constructor() {
    const update = () => this.online.set(this.window?.navigator.onLine ?? true);
    this.window?.addEventListener('online', update);
    this.window?.addEventListener('offline', update);
    inject(DestroyRef).onDestroy(() => {
      this.window?.removeEventListener('online', update);
      this.window?.removeEventListener('offline', update);
    });
  }

  /** Keeps the systems list as GET /api/systems answered it. */
  recordSystems(systems: SystemSummary[]): void {
    this.save(withSystems(this.copy(), systems, Date.now()));
  }

  /** Keeps one system's status as GET /api/systems/:id/status answered it. */
  recordStatus(status: SystemStatus): void {
    this.save(withStatus(this.copy(), status, Date.now()));
  }

  /** Keeps a live reading as the stream delivered it. */
  recordReading(systemId: string, event: { reading: ReceivedReading; derived: DerivedState | null }): void {
    this.save(withLiveReading(this.copy(), systemId, event.reading, event.derived, Date.now()));
  }

  /** Forgets every kept value (on sign-out, so the next person on this device sees none). */
  forget(): void {
    this.copy.set(EMPTY_COPY);
    try {
      this.window?.localStorage.removeItem(STORAGE_KEY);
    } catch {
      // Storage refused (private mode): nothing was kept.
    }
  }

  private save(copy: OfflineCopy): void {
    this.copy.set(copy);
    try {
      this.window?.localStorage.setItem(STORAGE_KEY, JSON.stringify(copy));
    } catch {
      // Storage full or refused: the copy lasts for this page only.
    }
  }

  private read(): string | null {
    try {
      return this.window?.localStorage.getItem(STORAGE_KEY) ?? null;
    } catch {
      return null;
    }
  }
}
