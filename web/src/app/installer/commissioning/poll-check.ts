import type { CommissioningCheck } from '@cellwarden/shared';
import { Observable, switchMap, takeWhile, timer } from 'rxjs';

/** How often a running check is asked for its progress. */
export const POLL_PERIOD_MS = 2000;

/** Fetches the check every `periodMs` and emits each answer, the first finished one included, then completes. */
export function pollCheck(fetch: () => Observable<CommissioningCheck>, periodMs = POLL_PERIOD_MS) {
  return timer(periodMs, periodMs).pipe(
    // switchMap: a slow answer is dropped in favour of the next, so a late "running" cannot overwrite "passed".
    switchMap(() => fetch()),
    takeWhile((check) => check.status === 'running', true),
  ) as Observable<CommissioningCheck>;
}
