/** One charge source's part of the charge current. */
export interface SourceShare {
  id: string;
  label: string;
  currentA: number;
  /** Fraction of the total charge current from all sources, 0–1. */
  share: number;
}

/** Each source's share of the current the sources deliver, largest first; sources at or below 0 A share 0. */
export function sourceShares(
  sourceCurrents: Record<string, number> | undefined,
  labels: Record<string, string> = {},
): SourceShare[] {
  const entries = Object.entries(sourceCurrents ?? {}).filter(([, a]) => Number.isFinite(a));
  const total = entries.reduce((sum, [, a]) => sum + Math.max(0, a), 0);
  return entries
    .map(([id, currentA]) => ({
      id,
      label: labels[id] ?? id,
      currentA,
      share: total > 0 ? Math.max(0, currentA) / total : 0,
    }))
    .sort((a, b) => b.currentA - a.currentA || a.id.localeCompare(b.id));
}
