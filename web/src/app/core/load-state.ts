import { Observable, catchError, map, of, startWith } from 'rxjs';
import { apiProblem, loadFailureText, serverErrorOf } from './api-error';

/**
 * A screen's data while it loads, once it arrived, or why it did not: the one load-state shape every feature
 * uses. (Angular's `resource`/`rxResource` would do this too, but are still experimental in Angular 21.)
 */
export type LoadState<T> =
  { status: 'loading' } | { status: 'error'; message: string } | { status: 'loaded'; value: T };

/** What the screen says when a load fails: a fixed fallback, or worked out from the error. */
export type LoadFailure = string | ((error: unknown) => string);

/**
 * Wraps a one-shot request so a template can show loading, error and loaded states. A string `failure` is the
 * fallback behind the server's own message (`serverErrorOf`); a function words the error itself.
 */
export function toLoadState<T>(source: Observable<T>, failure: LoadFailure): Observable<LoadState<T>> {
  return source.pipe(
    map((value): LoadState<T> => ({ status: 'loaded', value })),
    catchError((error: unknown) =>
      of<LoadState<T>>({
        status: 'error',
        message: typeof failure === 'string' ? serverErrorOf(error, failure).message : failure(error),
      }),
    ),
    startWith<LoadState<T>>({ status: 'loading' }),
  );
}

/**
 * A failure worded for a screen's data (`loadFailureText`): ended access or a lost connection when that is the
 * cause, else `fallback` (what could not be loaded and what to try).
 */
export function dataFailure(fallback: string): (error: unknown) => string {
  return (error) => loadFailureText(apiProblem(error), fallback);
}

/** The loaded value, or `fallback` while loading or after an error. */
export function loadedOr<T>(state: LoadState<T>, fallback: T): T {
  return state.status === 'loaded' ? state.value : fallback;
}

/** The error message, or null. */
export function loadError(state: LoadState<unknown>): string | null {
  return state.status === 'error' ? state.message : null;
}
