import type { BatteryReading } from '@cellwarden/shared';

/** A stored reading, announced to live subscribers. */
export interface StoredReading {
  systemId: string;
  reading: BatteryReading;
}

/** In-process fan-out of stored readings to the live stream (one node; a shared bus can replace it). */
export function createReadingsHub() {
  const listeners = new Set<(event: StoredReading) => void>();
  return {
    publish(event: StoredReading): void {
      for (const listener of listeners) listener(event);
    },
    subscribe(listener: (event: StoredReading) => void): () => void {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export type ReadingsHub = ReturnType<typeof createReadingsHub>;
