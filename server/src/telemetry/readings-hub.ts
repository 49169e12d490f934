import type { StreamMessage } from '@cellwarden/shared';

/** Something for the live subscribers of one system: a stored reading with its derived state, or an alert. */
export interface LiveEvent {
  systemId: string;
  message: Extract<StreamMessage, { type: 'reading' } | { type: 'alert' }>;
}

/** In-process fan-out of live events to the stream (one node; a shared bus can replace it). */
export function createReadingsHub() {
  const listeners = new Set<(event: LiveEvent) => void>();
  const accessListeners = new Set<(systemId: string) => void>();
  return {
    publish(event: LiveEvent): void {
      for (const listener of listeners) listener(event);
    },
    subscribe(listener: (event: LiveEvent) => void): () => void {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    /** Says that access to a system changed (a grant revoked), so every stream checks its subscribers again. */
    accessChanged(systemId: string): void {
      for (const listener of accessListeners) listener(systemId);
    },
    /** Listens for `accessChanged`; returns the function that stops listening. */
    onAccessChanged(listener: (systemId: string) => void): () => void {
      accessListeners.add(listener);
      return () => accessListeners.delete(listener);
    },
  };
}

export type ReadingsHub = ReturnType<typeof createReadingsHub>;
