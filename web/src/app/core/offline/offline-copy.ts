import type { DerivedState, ReceivedReading, SystemStatus, SystemSummary } from '@cellwarden/shared';

/** One system as it was last seen from the server, kept for when the signal drops. */
export interface OfflineSystem {
  id: string;
  name: string;
  nominalVoltage: number;
  reading: ReceivedReading | null;
  stateOfCharge: number | null;
}

/** The last values of every system the person saw, and when the app last had them from the server. */
export interface OfflineCopy {
  savedAt: number;
  systems: OfflineSystem[];
}

export const EMPTY_COPY: OfflineCopy = { savedAt: 0, systems: [] };

/** The copy after GET /api/systems: the list as it is now, keeping a state of charge only the status gave. */
export function withSystems(copy: OfflineCopy, systems: SystemSummary[], now: number): OfflineCopy {
  const known = new Map(copy.systems.map((s) => [s.id, s]));
  return {
    savedAt: now,
    systems: systems.map((s) => {
      const before = known.get(s.id);
      const reading = newer(before?.reading ?? null, s.latestReading);
      return {
        id: s.id,
        name: s.name,
        nominalVoltage: s.nominalVoltage,
        reading,
        stateOfCharge: reading?.stateOfCharge ?? before?.stateOfCharge ?? null,
      };
    }),
  };
}

/** The copy after GET /api/systems/:id/status; a system not in the list yet is left out (its name is unknown). */
export function withStatus(copy: OfflineCopy, status: SystemStatus, now: number): OfflineCopy {
  if (!copy.systems.some((s) => s.id === status.systemId)) return copy;
  return {
    savedAt: now,
    systems: copy.systems.map((s) =>
      s.id === status.systemId
        ? {
            ...s,
            reading: newer(s.reading, status.latestReading),
            stateOfCharge:
              status.derived?.stateOfCharge ?? status.latestReading?.stateOfCharge ?? s.stateOfCharge,
          }
        : s,
    ),
  };
}

/** The copy after a live reading of one system arrived on the stream. */
export function withLiveReading(
  copy: OfflineCopy,
  systemId: string,
  reading: ReceivedReading,
  derived: DerivedState | null,
  now: number,
): OfflineCopy {
  if (!copy.systems.some((s) => s.id === systemId)) return copy;
  return {
    savedAt: now,
    systems: copy.systems.map((s) =>
      s.id === systemId && newer(s.reading, reading) === reading
        ? { ...s, reading, stateOfCharge: derived?.stateOfCharge ?? reading.stateOfCharge ?? s.stateOfCharge }
        : s,
    ),
  };
}

/** Reads a stored copy, treating anything not shaped like one as no copy. */
export function parseCopy(text: string | null): OfflineCopy {
  if (!text) return EMPTY_COPY;
  try {
    const value = JSON.parse(text) as Partial<OfflineCopy>;
    if (typeof value.savedAt !== 'number' || !Array.isArray(value.systems)) return EMPTY_COPY;
    return { savedAt: value.savedAt, systems: value.systems };
  } catch {
    return EMPTY_COPY;
  }
}

// A reply that crossed a newer stream value on the way must not replace it.
function newer(kept: ReceivedReading | null, arrived: ReceivedReading | null): ReceivedReading | null {
  if (!arrived) return kept;
  if (!kept) return arrived;
  return arrived.measuredAt >= kept.measuredAt ? arrived : kept;
}
