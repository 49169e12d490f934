import type { RecordCheckChoice } from '@cellwarden/shared';

/** What a choice needs to know of a stored check. */
export interface ChoosableCheck {
  id: string;
  sourceId: string;
  status: RecordCheckChoice['status'];
  startedAt: number;
  ratedCurrentA: number;
}

/**
 * Which checks a record carries by default: the latest finished check of each charge source, unless it was
 * made against a rating the source no longer has (stale: the charger was replaced or re-rated, so its verdict
 * no longer speaks for what is fitted). Earlier checks of a source are superseded; running and abandoned
 * checks have no verdict. The installer may still pick any finished one.
 */
export function recordCheckChoices(
  checks: readonly ChoosableCheck[],
  ratingOf: (sourceId: string) => number | undefined,
): RecordCheckChoice[] {
  const latestFinished = new Map<string, ChoosableCheck>();
  for (const check of checks) {
    if (check.status !== 'passed' && check.status !== 'failed') continue;
    const known = latestFinished.get(check.sourceId);
    if (!known || check.startedAt > known.startedAt) latestFinished.set(check.sourceId, check);
  }
  return [...checks]
    .sort((a, b) => b.startedAt - a.startedAt)
    .map((check) => {
      const finished = check.status === 'passed' || check.status === 'failed';
      const leftOutBecause: RecordCheckChoice['leftOutBecause'] = !finished
        ? 'unfinished'
        : latestFinished.get(check.sourceId) !== check
          ? 'superseded'
          : ratingOf(check.sourceId) !== check.ratedCurrentA
            ? 'stale'
            : null;
      return {
        checkId: check.id,
        sourceId: check.sourceId,
        status: check.status,
        startedAt: check.startedAt,
        ratedCurrentA: check.ratedCurrentA,
        byDefault: leftOutBecause === null,
        leftOutBecause,
      };
    });
}
